/**
 * Every demo maneuver's name says what it does: the newest version, simulated on the body it is
 * bound to, turns the body mainly about the axis and in the direction its name says (frame of
 * DESIGN.md: +yaw turns to the left, +pitch forward (head down), +roll to the right), by at least
 * a degree, so no demo target rounds to 0°. Planner-made ones are checked against their targets
 * here and reach them in demo-plans.test.ts.
 */
import { describe, expect, it } from 'vitest';

import { loadPlannedManeuvers } from '../../db/seed/planned-maneuvers.ts';
import { DEMO_PROFILES } from '../../db/seed/seed-crew-profiles.ts';
import { DEMO_SEQUENCES } from '../../db/seed/seed-maneuvers.ts';
import { simulate } from '../../server/engine/simulate.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { demoBody } from './planner-bodies.ts';

type Axis = 'yaw' | 'pitch' | 'roll';
/** What each name promises: the main axis and its sign. */
const PROMISED: Record<string, [Axis, 1 | -1]> = {
  'Yaw to the right by hip swirls': ['yaw', -1],
  'Forward pitch with arm orbits': ['pitch', 1],
  'Yaw trim with right-arm loops': ['yaw', -1],
  'Pre-flight yaw drill': ['yaw', -1],
  'Cabin yaw with hip swirls': ['yaw', -1],
  'Spacewalk pitch trim with leg pedalling': ['pitch', 1],
  'Cabin yaw to the left with left-arm loops': ['yaw', 1],
  'Quarter turn to the left': ['yaw', 1],
  'Half turn to face aft': ['yaw', 1],
  'Pitch-over in the suit (forward 90°)': ['pitch', 1],
  'Quarter turn to the left in the suit': ['yaw', 1],
  'Roll 45° to the right': ['roll', 1],
};

/** The main axis of a yaw/pitch/roll triple and its sign. */
function mainAxis(ypr: Record<Axis, number>): [Axis, 1 | -1, number] {
  const axis = (['yaw', 'pitch', 'roll'] as const).reduce((a, b) => (Math.abs(ypr[b]) > Math.abs(ypr[a]) ? b : a));
  return [axis, ypr[axis] >= 0 ? 1 : -1, Math.abs(ypr[axis])];
}

describe('demo maneuver names match what they do', () => {
  for (const demo of DEMO_SEQUENCES) {
    it(`${demo.name}: its newest version turns as the name says, by at least 1°`, () => {
      expect(PROMISED[demo.name], `no promise listed for '${demo.name}'`).toBeDefined();
      const newest = demo.versions[demo.versions.length - 1];
      const crew = demo.crew as 'reed' | 'kettle' | 'moss';
      const body = demoBody(crew, newest.profileVersion ? newest.profileVersion - 1 : DEMO_PROFILES[crew].length - 1);
      const compiled = compilePrimitives(newest.primitives, dofInfoFromBody(body));
      expect(compiled.errors).toEqual([]);
      const [axis, sign, size] = mainAxis(simulate(body, compiled.sequence, { rateHz: 2 }).final.yprDeg);
      expect([axis, sign]).toEqual(PROMISED[demo.name]);
      expect(size).toBeGreaterThanOrEqual(1);
    }, 60_000);
  }

  it('planner-made maneuvers: each name matches its target\'s main axis and direction', () => {
    for (const p of loadPlannedManeuvers()) {
      expect(PROMISED[p.name], `no promise listed for '${p.name}'`).toBeDefined();
      const [axis, sign, size] = mainAxis(p.yprDeg);
      expect([axis, sign], p.name).toEqual(PROMISED[p.name]);
      expect(size).toBeGreaterThanOrEqual(1);
    }
  });
});
