/**
 * The planner on bodies kept outside the demo data and the benchmark: a small woman, a tall man
 * (with measured arm and leg lengths) and a woman in the pressurised suit, generated here from
 * anthropometry that appears nowhere else in the project (invented values in the adult range).
 * For a half turn and a 3-axis target that no demo or benchmark plan uses, the best candidate
 * must reach the target within the tolerance, inside every joint range and under the rate limit,
 * checked outside the planner: compiled by the composer's compiler, simulated at full accuracy and
 * re-integrated by odex (tests/planning/check-best.ts).
 */
import { describe, it } from 'vitest';

import { deriveProfile } from '../../server/crew/derive-profile.ts';
import { BUILT_IN_SUITS } from '../../server/model/suits/index.ts';
import type { Body } from '../../shared/contracts/body.ts';
import { checkBest, ypr } from './check-best.ts';

type Form = Parameters<typeof deriveProfile>[0];

function outsideBody(form: Pick<Form, 'sex' | 'stature' | 'mass'> & Partial<Form>, suitId: string, name: string): Body {
  const suit = BUILT_IN_SUITS.find((s) => s.id === suitId) ?? null;
  return deriveProfile({ lengths: {}, gear: [], ...form }, suit, name).body;
}

const BODIES: [string, Body][] = [
  ['small woman 1.52 m 46 kg (cabin clothing)', outsideBody({ sex: 'female', stature: 1.52, mass: 46, biacromialBreadth: 0.33 }, 'cabin-clothing', 'outside small woman')],
  ['tall man 1.96 m 102 kg, measured arms and legs (cabin clothing)', outsideBody({ sex: 'male', stature: 1.96, mass: 102, lengths: { upperArm: 0.37, forearm: 0.29, thigh: 0.5, shank: 0.47 } }, 'cabin-clothing', 'outside tall man')],
  ['woman 1.63 m 57 kg in the pressurised suit', outsideBody({ sex: 'female', stature: 1.63, mass: 57 }, 'pressurised-suit', 'outside suited woman')],
];

for (const [label, body] of BODIES) {
  describe(`planner on a body outside the demo data: ${label}`, () => {
    it('reaches a 180° yaw (half turn)', () => { checkBest(body, ypr(180, 0, 0)); }, 180_000);
    it('reaches a 3-axis target (yaw −120, pitch 35, roll −25)', () => { checkBest(body, ypr(-120, 35, -25)); }, 180_000);
  });
}
