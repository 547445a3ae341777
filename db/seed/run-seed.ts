import { sql } from 'drizzle-orm';

import type { SimulationPool } from '../../server/engine/pool/simulation-pool.ts';
import type { Database } from '../client.ts';
import { seedCrewProfiles } from './seed-crew-profiles.ts';
import { seedManeuvers } from './seed-maneuvers.ts';
import { seedTeam } from './seed-team.ts';

/** Context handed to each later seed stage (crew profiles, sequences…). */
export interface SeedState {
  db: Database;
  bcryptCost: number;
  /** Verifies the demo maneuvers (the app context's product pool). */
  pool: SimulationPool;
  crewIds: Record<string, string>;
  userIds: Record<string, string>;
}

/** Seed stages after the team, in order; each adds one part of the demo scenario. */
export const SEED_STAGES: ((s: SeedState) => Promise<void>)[] = [seedCrewProfiles, seedManeuvers];

/** Seeds the demo scenario into an empty database; does nothing when users exist. Returns whether it seeded. */
export async function seedDemo(db: Database, bcryptCost: number, pool: SimulationPool): Promise<boolean> {
  const { rows } = await db.execute<{ n: number }>(sql`SELECT count(*)::int AS n FROM users`);
  if (rows[0].n > 0) return false;
  const ids = await seedTeam(db, bcryptCost);
  const state: SeedState = { db, bcryptCost, pool, ...ids };
  for (const stage of SEED_STAGES) await stage(state);
  return true;
}
