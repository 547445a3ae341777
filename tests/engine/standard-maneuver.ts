/**
 * The standard maneuver the engine is measured and checked on: the standard human model (server/model,
 * a fictional 1.75 m, 75 kg crew member, unsuited) through ≈10 s of arm cones, then leg loops. The
 * benchmark (tests/bench/engine.ts) times it and the engine tests hold their figures to it.
 */
import { compileMotion, type MotionPlan } from '../../server/engine/joint-motion.ts';
import { deriveBody } from '../../server/model/derive-body.ts';
import { type Body, validateBody } from '../../shared/contracts/body.ts';
import type { Sequence } from '../../shared/contracts/sequence.ts';
import { type BodyModel, compileBody } from '../../shared/kinematics/body-model.ts';
import { mustSequence } from './fixtures.ts';

/** Both arms circle (cones about the forward-raised arms), then both legs pedal, then back to rest. */
export const STANDARD_STEPS = [
  { kind: 'move', duration: 0.8, to: { r_sh_flex: 90, r_sh_abd: 30, l_sh_flex: 90, l_sh_abd: 30 } },
  { kind: 'harmonic', period: 1.25, cycles: 3, joints: {
    r_sh_flex: { offset: 60, amplitude: 30, phase: 90 }, r_sh_abd: { offset: 30, amplitude: 30, phase: 0 },
    l_sh_flex: { offset: 60, amplitude: 30, phase: 90 }, l_sh_abd: { offset: 30, amplitude: 30, phase: 180 } } },
  { kind: 'move', duration: 0.8, to: { r_sh_flex: 0, r_sh_abd: 0, l_sh_flex: 0, l_sh_abd: 0, r_hip_flex: 75, l_hip_flex: 75, r_knee_flex: 60, l_knee_flex: 60 } },
  { kind: 'harmonic', period: 1.25, cycles: 3, joints: {
    r_hip_flex: { offset: 45, amplitude: 30, phase: 90 }, r_knee_flex: { offset: 60, amplitude: 40, phase: 0 },
    l_hip_flex: { offset: 45, amplitude: 30, phase: 90 }, l_knee_flex: { offset: 60, amplitude: 40, phase: 0 } } },
  { kind: 'move', duration: 0.9, to: { r_hip_flex: 0, l_hip_flex: 0, r_knee_flex: 0, l_knee_flex: 0 } },
];

export interface StandardManeuver {
  body: Body;
  sequence: Sequence;
  model: BodyModel;
  plan: MotionPlan;
}

/** The standard body, validated, and the standard steps compiled for it. */
export function standardManeuver(): StandardManeuver {
  const v = validateBody(deriveBody({ sex: 'male', stature: 1.75, mass: 75 }, { name: 'standard crew member' }).body);
  if (!v.ok) throw new Error(`standard body invalid: ${v.issues.map((i) => i.message).join('; ')}`);
  const body = v.value;
  const sequence = mustSequence({ start: {}, steps: STANDARD_STEPS }, body);
  const model = compileBody(body);
  return { body, sequence, model, plan: compileMotion(model, sequence) };
}
