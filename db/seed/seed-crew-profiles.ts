import { appendProfileVersion } from '../../server/crew/append-profile-version.ts';
import { deriveProfile } from '../../server/crew/derive-profile.ts';
import { BUILT_IN_SUITS } from '../../server/model/suits/index.ts';
import type { ProfileInputsInput } from '../../shared/contracts/profile-inputs.ts';
import type { SuitConfig } from '../../shared/contracts/suit.ts';
import { suitConfigs } from '../schema/index.ts';
import { DEMO_CREW } from './demo-people.ts';
import type { SeedState } from './run-seed.ts';

/** A demo profile version: the inputs without the suit, the suit's id, and the history note. */
interface DemoVersion {
  inputs: Omit<ProfileInputsInput, 'suit'>;
  suit: string | null;
  note: string;
}

/**
 * The invented demo crew's profile histories (all values made up for the fictional "Lumen Ring"
 * station). Reed has two versions, so the history and the comparison show a change.
 */
export const DEMO_PROFILES: Record<keyof typeof DEMO_CREW, DemoVersion[]> = {
  reed: [
    { inputs: { sex: 'female', stature: 1.67, mass: 60.5 }, suit: 'cabin-clothing', note: 'Pre-flight baseline (demo data).' },
    { inputs: { sex: 'female', stature: 1.67, mass: 59.1 }, suit: 'cabin-clothing', note: 'In-flight mass check, day 40: 1.4 kg lighter (demo data).' },
  ],
  kettle: [
    {
      inputs: {
        sex: 'male', stature: 1.83, mass: 86, biacromialBreadth: 0.42,
        gear: [{ name: 'tool caddy', segment: 'lower_trunk', mass: 3.5, position: [0.15, 0, 0] }],
      },
      suit: 'pressurised-suit',
      note: 'Spacewalk configuration with a tool caddy at the waist (demo data).',
    },
  ],
  moss: [
    { inputs: { sex: 'female', stature: 1.61, mass: 54, lengths: { thigh: 0.4, shank: 0.41 } }, suit: 'cabin-clothing', note: 'Baseline with measured thigh and shank lengths (demo data).' },
  ],
};

/** The planner who authored the demo profiles. */
const DEMO_AUTHOR = 'orrin.vale@lumen.example.test';

/** Seed stage: the two illustrative suit configurations and the demo crew's profile versions. */
export async function seedCrewProfiles(state: SeedState): Promise<void> {
  const { db, crewIds, userIds } = state;
  const authorId = userIds[DEMO_AUTHOR] ?? null;
  await db.transaction(async (tx) => {
    for (const suit of BUILT_IN_SUITS) {
      await tx.insert(suitConfigs).values({ name: suit.name, config: suit, illustrative: suit.illustrative, updatedBy: authorId });
    }
    for (const [key, versions] of Object.entries(DEMO_PROFILES)) {
      const crewMemberId = crewIds[key];
      const name = DEMO_CREW[key].name;
      for (const [k, v] of versions.entries()) {
        const suit: SuitConfig | null = v.suit ? BUILT_IN_SUITS.find((s) => s.id === v.suit)! : null;
        const derived = deriveProfile({ lengths: {}, gear: [], ...v.inputs } as Parameters<typeof deriveProfile>[0], suit, name);
        await appendProfileVersion(tx, {
          crewMemberId, baseVersion: k, source: 'regression', inputs: derived.inputs, body: derived.body,
          summary: derived.summary, note: v.note, authorId,
        });
      }
    }
  });
}
