/**
 * Cross-check against a general-purpose physics engine: MuJoCo's WebAssembly build (mujoco-js 0.0.7,
 * Google DeepMind). The same body (MJCF from the contract) and maneuver, with the joints driven by
 * stiff position servos instead of being prescribed, must reach the engine's final attitude.
 *
 * Tolerance: 1e-3 rad (issue 3). Why it is enough and not looser: MuJoCo's implicit-Euler step is
 * first order, so its momentum drift (measured below) and its servo tracking error both shrink in
 * proportion to the time step; the test shows the attitude difference itself halves when the step
 * halves (first-order convergence towards the engine), which a modelling error would not do.
 */
import { describe, expect, it } from 'vitest';

import { simulate } from '../../server/engine/simulate.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { loadBody, loadSequence, quatOf } from './fixtures.ts';
import { runMujoco } from './mujoco-run.ts';

/** Attitude agreement required with MuJoCo, rad (issue 3: expect ≤ 1e-3 rad). */
const MUJOCO_AGREEMENT_RAD = 1e-3;
/** Max servo tracking error accepted at the fine step, rad. */
const MAX_TRACKING_RAD = 2e-3;

describe('MuJoCo (mujoco-js) reaches the same final attitude', () => {
  const cases: [string, string][] = [['arm-on-trunk', 'arm-cone'], ['nested-chain', 'nested-chain-maneuver']];
  for (const [b, s] of cases) {
    it(`${b}: within 1e-3 rad, converging at first order in MuJoCo's time step`, async () => {
      const body = loadBody(b);
      const seq = loadSequence(s, body);
      const engine = quatOf(simulate(body, seq).final.attitude);
      const coarse = await runMujoco(body, seq, 4e-4);
      const fine = await runMujoco(body, seq, 2e-4);
      const dCoarse = quatAngleBetween(coarse.attitude, engine);
      const dFine = quatAngleBetween(fine.attitude, engine);
      // The maneuver turns the body far more than the tolerance.
      expect(quatAngleBetween(engine, [1, 0, 0, 0])).toBeGreaterThan(100 * MUJOCO_AGREEMENT_RAD);
      expect(fine.maxTrackingError).toBeLessThan(MAX_TRACKING_RAD);
      expect(dFine).toBeLessThan(MUJOCO_AGREEMENT_RAD);
      // First-order convergence: halving the step roughly halves the difference (ratio ≈ 0.5).
      expect(dFine / dCoarse).toBeGreaterThan(0.35);
      expect(dFine / dCoarse).toBeLessThan(0.65);
    });
  }
});
