/**
 * Per-cycle rotations, which the planner's search composes. Under zero angular momentum the
 * reorientation of a closed loop in shape space depends only on the loop (the holonomy of the
 * mechanical connection; Shapere & Wilczek 1989, "Geometry of self-propulsion at low Reynolds
 * number"; Montgomery 1993, "Gauge theory of the falling cat"). Each planner phase starts and ends
 * in the reference posture, so n cycles (lead-in, n loops, return) must rotate by exactly the n-th
 * power of one cycle's rotation: any difference is integrator error, which at the engine's rtol
 * 1e-10 stays near 1e-9 rad per cycle; 1e-8 rad allows for a few cycles.
 */
import { describe, expect, it } from 'vitest';

import { simulate } from '../../server/engine/simulate.ts';
import { deriveBody } from '../../server/model/derive-body.ts';
import { candidatePrimitives } from '../../server/planning/candidate-steps.ts';
import { compileForBody } from '../../server/planning/evaluate-steps.ts';
import { perCycleRotation, quatPower } from '../../server/planning/per-cycle-rotation.ts';
import { fitFamilies, type PlanFamily } from '../../server/planning/plan-families.ts';
import { quatChain } from '../../server/planning/rotation-vector.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';

const body = deriveBody({ sex: 'male', stature: 1.75, mass: 75 }).body;
const FULL = { rtol: 1e-10, rateHz: 1 };
const RATE = 180;
const { families } = fitFamilies(body, RATE);
const family = (id: string): PlanFamily => families.find((f) => f.id === id)!;

function simulateCycles(f: PlanFamily, size: number, cycles: number) {
  const steps = candidatePrimitives([{ family: f, size, cycles }], RATE);
  const a = simulate(body, compileForBody(body, steps), FULL).final.attitude;
  return [a.w, a.x, a.y, a.z];
}

describe('per-cycle rotation composed over n cycles equals simulating n cycles', () => {
  for (const [id, size, n] of [
    ['hip_swirl_left', 15, 5],
    ['hanging_arm_circles_out', 20, 4],
    ['leg_pedal_forward', 25, 3],
    ['forward_arm_twin_circles_in', 30, 3],
  ] as const) {
    it(`${id}: ${n} cycles`, () => {
      const one = perCycleRotation(body, family(id), size, RATE, FULL);
      const direct = simulateCycles(family(id), size, n);
      // The loop really turns the body (otherwise the check says nothing).
      expect(quatAngleBetween(one, [1, 0, 0, 0])).toBeGreaterThan(1e-3);
      expect(quatAngleBetween(quatPower(one, n), direct)).toBeLessThan(1e-8);
    });
  }

  it('two families in a row compose as the ordered product of their powers', () => {
    const yaw = perCycleRotation(body, family('hip_swirl_right'), 20, RATE, FULL);
    const pitch = perCycleRotation(body, family('forward_arm_circles_in'), 30, RATE, FULL);
    const steps = candidatePrimitives([
      { family: family('forward_arm_circles_in'), size: 30, cycles: 3 },
      { family: family('hip_swirl_right'), size: 20, cycles: 2 },
    ], RATE);
    const a = simulate(body, compileForBody(body, steps), FULL).final.attitude;
    expect(quatAngleBetween(quatChain(quatPower(pitch, 3), quatPower(yaw, 2)), [a.w, a.x, a.y, a.z])).toBeLessThan(1e-8);
  });
});

describe('loop symmetries of the standard (left–right symmetric) model', () => {
  it('both arms circling as mirror images turn the body about its left–right axis only (pitch)', () => {
    const [w, x, y, z] = perCycleRotation(body, family('forward_arm_circles_out'), 20, RATE, FULL);
    expect(Math.abs(y)).toBeGreaterThan(1e-3);
    expect(Math.hypot(x, z) / Math.hypot(x, y, z)).toBeLessThan(1e-8);
    expect(w).toBeGreaterThan(0);
  });

  it('both arms circling forward the same way round turn the body mainly about its front–back axis (roll)', () => {
    // The arms' pitch effects cancel to first order (not exactly: the two arms start the loop at different points).
    const [, x, y] = perCycleRotation(body, family('forward_arm_twin_circles_out'), 30, RATE, FULL);
    expect(Math.abs(x)).toBeGreaterThan(1e-3);
    expect(Math.abs(y)).toBeLessThan(0.2 * Math.abs(x));
  });
});
