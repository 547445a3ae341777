/**
 * Per-cycle rotations, which seed the planner. Under zero angular momentum the reorientation of a
 * closed loop in shape space depends only on the loop (the holonomy of the mechanical connection;
 * Shapere & Wilczek 1989, "Geometry of self-propulsion at low Reynolds number"; Montgomery 1993,
 * "Gauge theory of the falling cat"). Each planner sweep starts and ends in the reference posture,
 * so n cycles (lead-in, n loops, return) must rotate by exactly the n-th power of one cycle's
 * rotation: any difference is integrator error, which at the engine's rtol 1e-10 stays near 1e-9
 * rad per cycle; 1e-8 rad allows for a few cycles. Reversing the loop must invert the rotation.
 */
import { describe, expect, it } from 'vitest';

import { deriveBody } from '../../server/model/derive-body.ts';
import { simulate } from '../../server/engine/simulate.ts';
import { candidatePrimitives } from '../../server/planning/candidate-steps.ts';
import { compileForBody } from '../../server/planning/evaluate-steps.ts';
import { perCycleRotation, quatPower } from '../../server/planning/per-cycle-rotation.ts';
import { planFamily } from '../../server/planning/plan-families.ts';
import { composedRotation } from '../../server/planning/seed-candidates.ts';
import { quatAngleBetween, quatMultiply } from '../../shared/math/quaternion.ts';

const body = deriveBody({ sex: 'male', stature: 1.75, mass: 75 }).body;
const FULL = { rtol: 1e-10, rateHz: 1 };
const RATE = 180;

function simulateCycles(familyId: string, amplitudes: number[], cycles: number) {
  const steps = candidatePrimitives([{ family: planFamily(familyId), amplitudes, cycles }], RATE);
  const a = simulate(body, compileForBody(body, steps), FULL).final.attitude;
  return [a.w, a.x, a.y, a.z];
}

describe('per-cycle rotation composed over n cycles equals simulating n cycles', () => {
  for (const [id, amplitudes, n] of [
    ['hip_swirl_left', [15], 5],
    ['arm_orbit_outward', [25], 4],
    ['leg_pedal_forward', [25, 30], 3],
    ['arm_loop_frontal_fwd_right', [30, 30], 3],
  ] as const) {
    it(`${id}: ${n} cycles`, () => {
      const one = perCycleRotation(body, planFamily(id), [...amplitudes], RATE, FULL);
      const direct = simulateCycles(id, [...amplitudes], n);
      // The loop really turns the body (otherwise the check says nothing).
      expect(quatAngleBetween(one, [1, 0, 0, 0])).toBeGreaterThan(1e-3);
      expect(quatAngleBetween(quatPower(one, n), direct)).toBeLessThan(1e-8);
    });
  }

  it('two families in a row compose as the product of their powers', () => {
    const yaw = perCycleRotation(body, planFamily('hip_swirl_right'), [20], RATE, FULL);
    const pitch = perCycleRotation(body, planFamily('arm_orbit_inward'), [30], RATE, FULL);
    const steps = candidatePrimitives([
      { family: planFamily('arm_orbit_inward'), amplitudes: [30], cycles: 3 },
      { family: planFamily('hip_swirl_right'), amplitudes: [20], cycles: 2 },
    ], RATE);
    const a = simulate(body, compileForBody(body, steps), FULL).final.attitude;
    expect(quatAngleBetween(composedRotation([pitch, yaw], [3, 2]), [a.w, a.x, a.y, a.z])).toBeLessThan(1e-8);
  });
});

describe('loop symmetries', () => {
  it('the reversed loop (inward vs outward arm orbit) gives the inverse rotation', () => {
    const out = perCycleRotation(body, planFamily('arm_orbit_outward'), [20], RATE, FULL);
    const inw = perCycleRotation(body, planFamily('arm_orbit_inward'), [20], RATE, FULL);
    expect(quatAngleBetween(quatMultiply(out, inw, [0, 0, 0, 0]), [1, 0, 0, 0])).toBeLessThan(1e-8);
  });

  it('both arms moving as mirror images turn the body about its left–right axis only (pitch)', () => {
    // The standard model is left–right symmetric, so mirror-symmetric motion cannot yaw or roll it.
    const [w, x, y, z] = perCycleRotation(body, planFamily('arm_orbit_outward'), [20], RATE, FULL);
    expect(Math.abs(y)).toBeGreaterThan(1e-3);
    expect(Math.hypot(x, z) / Math.hypot(x, y, z)).toBeLessThan(1e-8);
    expect(w).toBeGreaterThan(0);
  });
});
