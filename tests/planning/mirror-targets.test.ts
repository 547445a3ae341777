/**
 * Mirror targets on a left–right symmetric body: a roll or yaw one way and its mirror the other way
 * are equally reachable. A loop run backwards is not the exact inverse of the loop (both senses of
 * two-arm circles drift the same way about pitch), so a search that modelled the reverse sense as
 * the negative of the forward one reached roll +90° but missed roll −90° by 8–9°. The body is
 * generated here (invented values in the adult range); the best candidate is checked outside the
 * planner by tests/planning/check-best.ts (compiler, full-accuracy engine, odex).
 */
import { describe, it } from 'vitest';

import { deriveProfile } from '../../server/crew/derive-profile.ts';
import { BUILT_IN_SUITS } from '../../server/model/suits/index.ts';
import { checkBest, ypr } from './check-best.ts';

const cabin = BUILT_IN_SUITS.find((s) => s.id === 'cabin-clothing') ?? null;
const body = deriveProfile({ sex: 'female', stature: 1.7, mass: 63, lengths: {}, gear: [] }, cabin, 'mirror-test woman').body;

describe('mirror targets on a cabin-clothed woman 1.70 m 63 kg', () => {
  it('reaches roll +90°', () => { checkBest(body, ypr(0, 0, 90)); }, 300_000);
  it('reaches roll −90°', () => { checkBest(body, ypr(0, 0, -90)); }, 300_000);
  it('reaches yaw −135° and its mirror yaw +135°', () => { checkBest(body, ypr(-135, 0, 0)); checkBest(body, ypr(135, 0, 0)); }, 300_000);
});
