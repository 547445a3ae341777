/** Bodies for the planner's tests: the demo crew's cabin-clothed and suited profiles (invented demo data). */
import { DEMO_PROFILES } from '../../db/seed/seed-crew-profiles.ts';
import { deriveProfile } from '../../server/crew/derive-profile.ts';
import { BUILT_IN_SUITS } from '../../server/model/suits/index.ts';
import type { Body } from '../../shared/contracts/body.ts';

/** The body of a demo crew member's profile version (index into its history). */
export function demoBody(key: keyof typeof DEMO_PROFILES, version = 0): Body {
  const v = DEMO_PROFILES[key][version];
  const suit = v.suit ? BUILT_IN_SUITS.find((s) => s.id === v.suit) ?? null : null;
  return deriveProfile({ lengths: {}, gear: [], ...v.inputs } as Parameters<typeof deriveProfile>[0], suit, String(key)).body;
}
