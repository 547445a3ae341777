/**
 * Re-verifying many versions after a profile change, seen as one piece of work: the records of one
 * crew member toward their newest re-verification target (a profile version), counted by state for
 * a progress figure, and cancelled together (each open record ends `cancelled`, its queued job is
 * cancelled, and a job already running finds its record closed and stores nothing).
 */
import { and, desc, eq, inArray } from 'drizzle-orm';

import { profileVersions, reverifications, sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { ReverificationProgress } from '../../shared/contracts/maneuver.ts';
import type { AppContext } from '../app-context.ts';
import { cancelJobs } from './background-work.ts';
import { REVERIFY_QUEUE } from './queue-names.ts';
import { OPEN_STATES } from './robustness/robustness-runs.ts';

/** The member's newest re-verification target: the profile version of their latest record. */
async function latestTarget(ctx: AppContext, crewMemberId: string): Promise<{ id: string; version: number } | null> {
  const [row] = await ctx.db.select({ id: reverifications.toProfileVersionId, version: profileVersions.version })
    .from(reverifications)
    .innerJoin(profileVersions, eq(profileVersions.id, reverifications.toProfileVersionId))
    .where(eq(profileVersions.crewMemberId, crewMemberId))
    .orderBy(desc(reverifications.createdAt)).limit(1);
  return row ?? null;
}

/** Progress of the member's re-verification toward their newest target. */
export async function reverificationProgress(ctx: AppContext, crewMemberId: string): Promise<ReverificationProgress> {
  const target = await latestTarget(ctx, crewMemberId);
  const empty: ReverificationProgress = {
    toProfileVersionId: null, toProfileVersion: null, total: 0, queued: 0, running: 0, done: 0, failed: 0, cancelled: 0, progress: 1, items: [],
  };
  if (!target) return empty;
  const rows = await ctx.db.select({ r: reverifications, sequenceId: sequences.id, name: sequences.name, version: sequenceVersions.version })
    .from(reverifications)
    .innerJoin(sequenceVersions, eq(sequenceVersions.id, reverifications.sequenceVersionId))
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .where(and(eq(reverifications.toProfileVersionId, target.id), eq(sequences.crewMemberId, crewMemberId)))
    .orderBy(sequences.name, sequenceVersions.version);
  const out: ReverificationProgress = { ...empty, toProfileVersionId: target.id, toProfileVersion: target.version };
  for (const { r, sequenceId, name, version } of rows) {
    const state = r.state;
    out[state]++;
    out.total++;
    out.items.push({ id: r.id, sequenceId, sequenceName: name, version, state, attitudeShiftDeg: r.attitudeShiftDeg, error: r.error });
  }
  out.progress = out.total ? (out.done + out.failed + out.cancelled) / out.total : 1;
  return out;
}

/** Cancels every open re-verification of the member toward their newest target; returns how many. */
export async function cancelReverifications(ctx: AppContext, crewMemberId: string, reason: string): Promise<number> {
  const target = await latestTarget(ctx, crewMemberId);
  if (!target) return 0;
  const mine = ctx.db.select({ id: sequenceVersions.id }).from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId)).where(eq(sequences.crewMemberId, crewMemberId));
  const rows = await ctx.db.update(reverifications).set({ state: 'cancelled', error: reason, finishedAt: new Date() })
    .where(and(eq(reverifications.toProfileVersionId, target.id), inArray(reverifications.state, [...OPEN_STATES]), inArray(reverifications.sequenceVersionId, mine)))
    .returning({ sequenceVersionId: reverifications.sequenceVersionId });
  const boss = ctx.jobs?.boss;
  if (boss) for (const r of rows) await cancelJobs(boss, REVERIFY_QUEUE, { sequenceVersionId: r.sequenceVersionId, toProfileVersionId: target.id });
  return rows.length;
}
