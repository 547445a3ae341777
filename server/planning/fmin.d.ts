/**
 * Hand-written types for fmin 0.0.4 (ships no .d.ts). Only the members the planner uses.
 */

/** A point of the simplex with its function value. */
export type FminPoint = number[] & { fx?: number };

/** Options of nelderMead (all optional). */
export interface NelderMeadParameters {
  /** Iteration cap (default 200 × dimensions). */
  maxIterations?: number;
  /** Initial simplex: each non-zero coordinate is multiplied by this (default 1.05). */
  nonZeroDelta?: number;
  /** Initial simplex: a zero coordinate becomes this (default 0.001). */
  zeroDelta?: number;
  /** Stops when the simplex's values differ by less than this and its points by less than 1e-5 (default 1e-6). */
  minErrorDelta?: number;
}

/** What nelderMead returns: the best point and its value. */
export interface NelderMeadResult {
  x: FminPoint;
  fx: number;
}

/** The package's exports the planner uses. */
export interface FminModule {
  /** Minimises f from x0 by the downhill simplex method. */
  nelderMead(f: (x: number[]) => number, x0: number[], parameters?: NelderMeadParameters): NelderMeadResult;
}
