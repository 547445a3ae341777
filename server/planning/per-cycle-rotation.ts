/**
 * Per-cycle rotation of a sweep: the attitude change of ONE cycle, simulated with its lead-in
 * blend from the reference posture and its return blend. The return retraces the lead-in, so the
 * pair contributes nothing net and the result is the cycle's rotation seen from the reference
 * posture; n cycles then rotate by its n-th power (exact up to the integrator's tolerance, because
 * each cycle starts and ends in the same posture).
 */
import type { Body } from '../../shared/contracts/body.ts';
import { quatMultiply, type Quat } from '../../shared/math/quaternion.ts';
import { simulate, type EngineOptions } from '../engine/simulate.ts';
import { candidatePrimitives } from './candidate-steps.ts';
import { compileForBody, SEARCH_ENGINE_OPTIONS } from './evaluate-steps.ts';
import type { PlanFamily } from './plan-families.ts';

/** Rotation [w,x,y,z] of one cycle of `family` at `amplitudes` on `body` (engine options: the search's by default). */
export function perCycleRotation(body: Body, family: PlanFamily, amplitudes: readonly number[], rateLimitDegS: number, options: EngineOptions = SEARCH_ENGINE_OPTIONS): Quat {
  const steps = candidatePrimitives([{ family, amplitudes: [...amplitudes], cycles: 1 }], rateLimitDegS);
  const r = simulate(body, compileForBody(body, steps), options);
  const a = r.final.attitude;
  return [a.w, a.x, a.y, a.z];
}

/** q^n for a unit quaternion and a whole n ≥ 0 (repeated products: n is small). */
export function quatPower(q: Quat, n: number): Quat {
  let out: Quat = [1, 0, 0, 0];
  for (let k = 0; k < n; k++) out = quatMultiply(out, q, [0, 0, 0, 0]);
  return out;
}
