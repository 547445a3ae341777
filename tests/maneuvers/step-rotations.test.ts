/**
 * Per-step rotations of the verification report (server/maneuvers/step-rotations.ts), checked
 * outside the code that makes them:
 * - composed with gl-matrix's quaternion product (a reference library, 64-bit arrays), the steps'
 *   rotations give the final attitude of the full engine run (zero momentum: each step's rotation
 *   depends only on its own shape path, so the attitudes chain);
 * - n cycles of a sweep rotate by the n-th power of one cycle (the posture returns each cycle),
 *   against the engine run of the whole sweep;
 * - a pause rotates by nothing (closed form: no motion, no rotation);
 * - the steps' shares of the path add up to the report's pathDeg.
 */
import { glMatrix, quat } from 'gl-matrix';
import { afterAll, describe, expect, it } from 'vitest';

import { demoCurrentBody } from '../../db/seed/plan-demo-maneuvers.ts';
import { SimulationPool } from '../../server/engine/pool/simulation-pool.ts';
import { simulate } from '../../server/engine/simulate.ts';
import { verifySequence } from '../../server/maneuvers/verify-sequence.ts';
import { anglesAfter } from '../../server/planning/execution-pieces.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';

glMatrix.setMatrixArrayType(Array);
/** Agreement of two runs of the same integrator at rtol 1e-10 over a few tens of seconds, rad. */
const ATTITUDE_TOL_RAD = 1e-7;

const body = demoCurrentBody('moss');
const primitives: Primitive[] = [
  { kind: 'pose_shift', posture: 'arms_forward', durationS: 1.2 },
  { kind: 'hip_swirl', halfAngleDeg: 15, centreFlexDeg: 20, turn: 'to_left', cycles: 3, periodS: 2 },
  { kind: 'pause', durationS: 0.5 },
  { kind: 'arm_orbit', arms: 'both', centre: 'forward', halfAngleDeg: 20, travel: 'outward', cycles: 4, periodS: 1.5 },
  { kind: 'pose_shift', posture: 'reference', durationS: 1.2 },
];
const compiled = compilePrimitives(primitives, dofInfoFromBody(body));
const sequence = compiled.sequence;
const target = sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw: 0, pitch: 0, roll: 0 } });
const pool = new SimulationPool({ size: 1, timeoutMs: 120_000 });
afterAll(() => pool.close());

/** gl-matrix order [x,y,z,w] from the contract's {w,x,y,z}. */
const gl = (q: { w: number; x: number; y: number; z: number }) => quat.fromValues(q.x, q.y, q.z, q.w);
/** Angle between two gl-matrix quaternions, rad (sign-insensitive). */
const angleBetween = (a: quat, b: quat) => 2 * Math.acos(Math.min(1, Math.abs(quat.dot(a, b))));

describe('per-step rotations', () => {
  const reportP = verifySequence({ body, sequence, target, profileVersionId: '00000000-0000-4000-8000-000000000000', pool, stepMap: compiled.stepMap });

  it('has one entry per composer step, in order, covering the whole duration', async () => {
    const r = await reportP;
    expect(r.stepRotations?.map((s) => s.step)).toEqual([0, 1, 2, 3, 4]);
    expect(r.stepRotations?.[0].startS).toBe(0);
    expect(r.stepRotations?.[4].endS).toBeCloseTo(r.durationS, 9);
  }, 120_000);

  it('composes by quaternion product (gl-matrix) to the full run\'s final attitude', async () => {
    const r = await reportP;
    const product = r.stepRotations!.reduce((acc, s) => quat.multiply(quat.create(), acc, gl(s.rotation.quat)), quat.create());
    expect(angleBetween(product, gl(r.final.attitude))).toBeLessThan(ATTITUDE_TOL_RAD);
    // The turn is real (not identity everywhere): the swirls and orbits rotate the body by degrees.
    expect(r.final.rotation.angleDeg).toBeGreaterThan(1);
  }, 120_000);

  it('gives each sweep\'s n cycles as the n-th power of one cycle (against the engine run of the whole sweep)', async () => {
    const r = await reportP;
    const sweeps = r.stepRotations!.flatMap((s) => s.sweeps);
    expect(sweeps.map((s) => s.cycles)).toEqual([3, 4]);
    for (const s of sweeps) {
      let start: Record<string, number> = { ...sequence.start };
      for (const st of sequence.steps.slice(0, s.compiledStep)) start = anglesAfter(start, st);
      const whole = simulate(body, { start, steps: [sequence.steps[s.compiledStep]] }).final.attitude;
      let power = quat.create();
      for (let k = 0; k < s.cycles; k++) power = quat.multiply(quat.create(), power, gl(s.perCycle.quat));
      expect(angleBetween(power, gl(whole))).toBeLessThan(ATTITUDE_TOL_RAD);
    }
  }, 120_000);

  it('gives a pause no rotation at all', async () => {
    const r = await reportP;
    expect(r.stepRotations![2].rotation.angleDeg).toBe(0);
    expect(r.stepRotations![2].sweeps).toEqual([]);
  }, 120_000);

  it('splits pathDeg between the steps without loss', async () => {
    const r = await reportP;
    const sum = r.stepRotations!.reduce((t, s) => t + s.pathDeg, 0);
    expect(sum).toBeCloseTo(r.pathDeg!, 9);
    expect(r.pathDeg!).toBeGreaterThan(r.final.rotation.angleDeg);
  }, 120_000);
});
