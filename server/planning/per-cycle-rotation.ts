/**
 * Per-cycle rotation of a family at a size: the attitude change of ONE phase of one cycle (lead-in
 * from the reference posture, the cycle, the way back), simulated. The way back retraces the
 * lead-in, so n cycles rotate by its n-th power exactly (up to the integrator's tolerance).
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { Quat } from '../../shared/math/quaternion.ts';
import type { EngineOptions } from '../engine/simulate.ts';
import { phasePrimitives } from './candidate-steps.ts';
import { compileForBody, evaluateSequence, SEARCH_ENGINE_OPTIONS } from './evaluate-steps.ts';
import type { PlanFamily } from './plan-families.ts';
import { quatIntPower } from './rotation-vector.ts';

const IDENTITY: Quat = [1, 0, 0, 0];

/** Rotation [w,x,y,z] of one cycle of `family` at `size` on `body` (engine options: the search's by default). */
export function perCycleRotation(body: Body, family: PlanFamily, size: number, rateLimitDegS: number, options: EngineOptions = SEARCH_ENGINE_OPTIONS): Quat {
  const seq = compileForBody(body, phasePrimitives({ family, size, cycles: 1 }, rateLimitDegS));
  const a = evaluateSequence(body, seq, IDENTITY, options).result.final.attitude;
  return [a.w, a.x, a.y, a.z];
}

/** q^n for a unit quaternion and a whole n ≥ 0. */
export function quatPower(q: Quat, n: number): Quat {
  return quatIntPower(q, n);
}
