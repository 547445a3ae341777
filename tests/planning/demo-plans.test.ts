/**
 * The planner-made demo maneuvers committed in db/seed/planned-maneuvers.json still reach their
 * targets on their crew members' current demo profiles: compiled by the composer's compiler and
 * simulated by the engine at full accuracy, within 2° of the target, with no range violation and
 * the peak joint rate under 180°/s. No demo target is 0°.
 */
import { describe, expect, it } from 'vitest';

import { demoCurrentBody } from '../../db/seed/plan-demo-maneuvers.ts';
import { loadPlannedManeuvers, PLANNED_DEMO_MANEUVERS } from '../../db/seed/planned-maneuvers.ts';
import { simulate } from '../../server/engine/simulate.ts';
import { targetQuat } from '../../server/maneuvers/target-attitude.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';

describe('planner-made demo maneuvers', () => {
  const planned = loadPlannedManeuvers();
  it('cover every listed target, none of them 0°', () => {
    expect(planned.map((p) => p.name)).toEqual(PLANNED_DEMO_MANEUVERS.map((p) => p.name));
    for (const p of planned) expect(Math.hypot(p.yprDeg.yaw, p.yprDeg.pitch, p.yprDeg.roll)).toBeGreaterThan(0);
  });
  for (const p of loadPlannedManeuvers()) {
    it(`${p.name} reaches yaw ${p.yprDeg.yaw}°, pitch ${p.yprDeg.pitch}°, roll ${p.yprDeg.roll}° within 2°`, () => {
      const body = demoCurrentBody(p.crew);
      const compiled = compilePrimitives(p.primitives, dofInfoFromBody(body));
      expect(compiled.errors).toEqual([]);
      const r = simulate(body, compiled.sequence, { rateHz: 2 });
      const a = r.final.attitude;
      const error = (quatAngleBetween([a.w, a.x, a.y, a.z], targetQuat(sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: p.yprDeg }))) * 180) / Math.PI;
      expect(error).toBeLessThan(2);
      expect(r.rangeViolations).toEqual([]);
      expect(r.peakJointRateDegS.max).toBeLessThanOrEqual(180);
    }, 60_000);
  }
});
