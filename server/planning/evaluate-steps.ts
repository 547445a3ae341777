/**
 * Runs the full simulation of a composer step list on a body and measures what the planner
 * optimises: the final attitude error to the target, range violations and the peak joint rate.
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { SimulationResult } from '../../shared/contracts/result.ts';
import type { Sequence } from '../../shared/contracts/sequence.ts';
import { type Quat, quatAngleBetween } from '../../shared/math/quaternion.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';
import { type EngineOptions, simulate, simulateFinal } from '../engine/simulate.ts';

const DEG = 180 / Math.PI;

/**
 * Engine settings inside the optimisation loop: a looser tolerance than verification's 1e-10
 * (still far below the degree-level errors being minimised), in search mode: no samples, no audit.
 */
export const SEARCH_ENGINE_OPTIONS: EngineOptions = { rtol: 1e-8, finalOnly: true };

/** What one evaluation measured. */
export interface StepsOutcome {
  /** Final attitude error to the target, degrees. */
  errorDeg: number;
  /** Sum of the range violations' worst margins, degrees (0 when none). */
  violationDeg: number;
  rangeViolationCount: number;
  /** Peak joint rate, deg/s. */
  peakRateDegS: number;
  durationS: number;
  result: SimulationResult;
}

/** Compiles `primitives` for the body (from the reference posture) into the engine's sequence; throws on unknown dofs. */
export function compileForBody(body: Body, primitives: readonly Primitive[]): Sequence {
  const c = compilePrimitives(primitives, dofInfoFromBody(body));
  if (c.errors.length) throw new Error(c.errors[0].message);
  return c.sequence;
}

/** Simulates an engine sequence and measures it against the target quaternion [w,x,y,z]. */
export function evaluateSequence(body: Body, sequence: Sequence, target: Quat, options: EngineOptions = SEARCH_ENGINE_OPTIONS): StepsOutcome {
  // Search mode: the final attitude and the checks only (no samples, audit or interpolation).
  const result = options.finalOnly ? simulateFinal(body, sequence, options) : simulate(body, sequence, options);
  const a = result.final.attitude;
  return {
    errorDeg: quatAngleBetween([a.w, a.x, a.y, a.z], target) * DEG,
    violationDeg: result.rangeViolations.reduce((s, v) => s + v.marginDeg, 0),
    rangeViolationCount: result.rangeViolations.length,
    peakRateDegS: result.peakJointRateDegS.max,
    durationS: result.duration,
    result,
  };
}

/** Compiles and evaluates a composer step list. */
export function evaluateSteps(body: Body, primitives: readonly Primitive[], target: Quat, options?: EngineOptions): StepsOutcome {
  return evaluateSequence(body, compileForBody(body, primitives), target, options);
}
