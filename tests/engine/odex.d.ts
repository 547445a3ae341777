/**
 * Hand-written types for odex 2.0.4 (CommonJS, ships no .d.ts; its own .ts source fails strict checks).
 * Only the members the engine uses.
 */

/** Right-hand side y' = f(x, y); returns a new array of length n. */
export type OdexDerivative = (x: number, y: number[]) => number[];

/** Called after every accepted step; `dense(component, t)` interpolates on [xOld, x]. Return false to stop. */
export type OdexOutput = (nr: number, xOld: number, x: number, y: number[], dense: (component: number, t: number) => number) => boolean | void;

/** odex's outcome codes. */
export declare enum OdexOutcome { Converged = 0, MaxStepsExceeded = 1, EarlyReturn = 2 }

/** What solve() returns. */
export interface OdexResult {
  y: number[];
  outcome: OdexOutcome;
  nStep: number;
  nAccept: number;
  nReject: number;
  nEval: number;
}

/** The Gragg–Bulirsch–Stoer extrapolation solver (Hairer, Nørsett & Wanner's ODEX). */
export declare class OdexSolver {
  constructor(n: number);
  relativeTolerance: number | number[];
  absoluteTolerance: number | number[];
  denseOutput: boolean;
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  solve(f: OdexDerivative, x: number, y0: number[], xEnd: number, solOut?: OdexOutput): OdexResult;
}

/** The module's exports. */
export interface OdexModule {
  Solver: typeof OdexSolver;
  Outcome: typeof OdexOutcome;
}
