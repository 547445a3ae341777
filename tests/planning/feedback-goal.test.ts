/**
 * The planner's robustness goal on the case it exists for: the suited demo crew member's half turn
 * (yaw 180°), whose best candidate must land with the feedback 95th percentile within 3× the 2°
 * tolerance ("marginal" or better, the levels of DECISIONS.md) for two robustness seeds, with 100
 * samples as the planner reports by default. Every phase of the plan must end in small cycles about
 * its own axis, which is what lets the crew member stop or add cycles: a two-phase plan whose
 * half turn ends in 8° cycles measured 6.55° here. The reference for "within tolerance" is the
 * engine's full-accuracy run that the planner's verification reports (checked independently of
 * the planner in tests/planning/planner.test.ts).
 */
import { describe, expect, it } from 'vitest';

import { perCycleRotation } from '../../server/planning/per-cycle-rotation.ts';
import { fitFamilies } from '../../server/planning/plan-families.ts';
import { planManeuver } from '../../server/planning/plan-maneuver.ts';
import { quatAngle } from '../../server/planning/rotation-vector.ts';
import { planRequestSchema } from '../../shared/contracts/plan.ts';
import { ypr } from './check-best.ts';
import { demoBody } from './planner-bodies.ts';

const suited = demoBody('kettle');
const target = ypr(180, 0, 0);

describe('feedback robustness of the suited half turn', () => {
  for (const seed of [1, 2]) {
    it(`best candidate's feedback 95th percentile ≤ 3× the tolerance (robustness seed ${seed}, 100 samples)`, () => {
      const { candidates } = planManeuver({ body: suited, target, settings: planRequestSchema.parse({ samples: 100, maxCandidates: 3, seed }) });
      const best = candidates[0];
      expect(best.withinTolerance && best.withinRateLimit && best.rangeViolationCount === 0).toBe(true);
      expect(best.robustness.samples).toBe(100);
      expect(best.robustness.feedbackP95Deg).toBeLessThanOrEqual(3 * target.toleranceDeg);
      // Feedback is what does it: open-loop, the same plan misses by far more.
      expect(best.robustness.openLoopP95Deg).toBeGreaterThan(3 * target.toleranceDeg);
    }, 180_000);
  }

  it('every family the best candidate turns with ends in cycles of at most about 2.5° (room to stop or trim)', () => {
    const { candidates } = planManeuver({ body: suited, target, settings: planRequestSchema.parse({ samples: 10, maxCandidates: 1 }), skipRobustness: true });
    const { families } = fitFamilies(suited, target.rateLimitDegS);
    const best = candidates[0];
    // The last sweep of each run of one family, with its size (the sweep's main amplitude).
    const sweeps = best.primitives.filter((p) => 'cycles' in p);
    expect(sweeps.length).toBe(best.families.length);
    best.families.forEach((id, i) => {
      if (best.families[i + 1] === id) return;
      const family = families.find((f) => f.id === id)!;
      const size = ['halfAngleDeg', 'hipSwingDeg'].map((k) => (sweeps[i] as Record<string, unknown>)[k]).find((v) => typeof v === 'number') as number;
      const perCycleDeg = (quatAngle(perCycleRotation(suited, family, size, target.rateLimitDegS)) * 180) / Math.PI;
      expect(perCycleDeg, `${id} at size ${size}`).toBeLessThanOrEqual(2.5);
      expect(sweeps[i].cycles, `${id} cycles`).toBeGreaterThanOrEqual(2);
    });
  }, 120_000);
});
