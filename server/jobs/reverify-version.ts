/**
 * The re-verification job: recomputes one sequence version's compiled steps on a newer profile
 * version's body and records how far the final attitude moved (`attitudeShiftDeg`) in
 * `reverifications`. The version itself is frozen (it may be cleared); only the record changes, and a
 * once-cleared version gets its re-check version for the reviewer (server/maneuvers/recheck-version.ts).
 * A record on the version's own profile is an engine change's (server/maneuvers/engine-recheck.ts):
 * unchanged, the approval stands; moved, the version becomes stale and gets its re-check version.
 * Throws on failure so the queue retries; the last attempt marks the record `failed`. A record
 * cancelled meanwhile (Team → Jobs) keeps `cancelled`.
 */
import { and, desc, eq, ne, notInArray } from 'drizzle-orm';

import { profileVersions, reverifications, sequenceVersions } from '../../db/schema/index.ts';
import type { Reverification } from '../../shared/contracts/maneuver.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { profileBody } from '../crew/profile-row.ts';
import { compareUnderEngine, engineOutcome } from '../maneuvers/engine-recheck.ts';
import { afterRecheckSaved, type RecheckSaved, saveRecheckVersion } from '../maneuvers/recheck-version.ts';
import { readStoredCompiled, readStoredReport, readVersionTarget } from '../maneuvers/stored-version.ts';
import { verifySequence } from '../maneuvers/verify-sequence.ts';

/** Job payload. */
export interface ReverifyJob {
  sequenceVersionId: string;
  toProfileVersionId: string;
}

const DEG = 180 / Math.PI;
const notIn = (states: Reverification['state'][]) => notInArray(reverifications.state, states);
/** A cancelled record keeps its end state: no later write of a job reopens it. */
const notCancelled = () => notIn(['cancelled']);

/** Runs one re-verification; `attempt` counts retries already made (0 on the first run). */
export async function reverifyVersion(ctx: AppContext, job: ReverifyJob, opts: { attempt: number; retryLimit: number }): Promise<void> {
  const { db } = ctx;
  const [v] = await db
    .select({ v: sequenceVersions })
    .from(sequenceVersions)
    .where(eq(sequenceVersions.id, job.sequenceVersionId));
  if (!v) throw new Error(`sequence version ${job.sequenceVersionId} not found`);
  const [profile] = await db.select().from(profileVersions).where(eq(profileVersions.id, job.toProfileVersionId));
  if (!profile) throw new Error(`profile version ${job.toProfileVersionId} not found`);

  // The record this job fills (created when the version was flagged; made here if missing).
  let [record] = await db
    .select()
    .from(reverifications)
    .where(and(eq(reverifications.sequenceVersionId, v.v.id), eq(reverifications.toProfileVersionId, profile.id), ne(reverifications.state, 'done')))
    .orderBy(desc(reverifications.createdAt))
    .limit(1);
  if (record?.state === 'cancelled') return; // someone stopped it: its job has nothing to do
  if (!record) {
    const [done] = await db.select({ id: reverifications.id }).from(reverifications)
      .where(and(eq(reverifications.sequenceVersionId, v.v.id), eq(reverifications.toProfileVersionId, profile.id), eq(reverifications.state, 'done')));
    if (done) return; // already recomputed (a duplicate job)
    [record] = await db.insert(reverifications).values({ sequenceVersionId: v.v.id, fromProfileVersionId: v.v.profileVersionId, toProfileVersionId: profile.id }).returning();
  }
  const claimed = await db.update(reverifications).set({ state: 'running', attempts: record.attempts + 1, error: null })
    .where(and(eq(reverifications.id, record.id), notCancelled())).returning({ id: reverifications.id });
  if (!claimed.length) return;

  try {
    // Read here, inside the attempt: a stored value that does not parse fails the record, naming it.
    const compiled = readStoredCompiled(v.v.id, v.v.compiled);
    // The version's own target (a re-check verifies what was cleared, not the sequence's next default).
    const target = readVersionTarget(v.v.id, v.v.target);
    const report = await verifySequence({ body: profileBody(profile), sequence: compiled.sequence, target, profileVersionId: profile.id, pool: ctx.simulation.product, stepMap: compiled.stepMap });
    const old = readStoredReport(v.v.id, v.v.report);
    const shift = old
      ? quatAngleBetween([old.final.attitude.w, old.final.attitude.x, old.final.attitude.y, old.final.attitude.z],
        [report.final.attitude.w, report.final.attitude.x, report.final.attitude.y, report.final.attitude.z]) * DEG
      : null;
    const saved = await db.transaction(async (tx) => {
      // Only while still open: a retried or duplicated job stores one result.
      const stored = await tx.update(reverifications)
        .set({ state: 'done', attitudeShiftDeg: shift, report, finishedAt: new Date(), error: null })
        .where(and(eq(reverifications.id, record.id), notIn(['done', 'cancelled']))).returning({ id: reverifications.id });
      if (!stored.length) return null;
      await recordAudit(tx, {
        actorId: null, action: 'sequence_version.reverified', objectType: 'sequence_version', objectId: v.v.id,
        detail: { toProfileVersionId: profile.id, attitudeShiftDeg: shift, targetErrorDeg: report.target.errorDeg },
      });
      // The same profile on both sides: a newer engine's re-verification of a cleared version.
      if (record.fromProfileVersionId === record.toProfileVersionId && old) {
        const c = compareUnderEngine(old, report);
        let saved: RecheckSaved | null = null;
        if (!c.unchanged) {
          // The result moved: stale, and the re-check flow of a profile change applies.
          const flagged = await tx.update(sequenceVersions).set({ status: 'recheck', staleSince: new Date() })
            .where(and(eq(sequenceVersions.id, v.v.id), eq(sequenceVersions.status, 'cleared'))).returning({ id: sequenceVersions.id });
          if (flagged.length) {
            saved = await saveRecheckVersion(tx, {
              stale: v.v, profile, report, reverificationId: record.id, attitudeShiftDeg: shift,
              note: `Automatic re-check of version ${v.v.version} after an engine change (${v.v.engineVersion ?? '?'} → ${report.engineVersion}): the same steps on the same profile, re-verified; the result moved.`,
            });
          }
        }
        const outcome = engineOutcome(report.engineVersion, c, saved?.version ?? null);
        await tx.update(reverifications).set({ outcome }).where(eq(reverifications.id, record.id));
        await recordAudit(tx, {
          actorId: null, action: c.unchanged ? 'sequence_version.engine_unchanged' : 'sequence_version.engine_changed', objectType: 'sequence_version', objectId: v.v.id,
          detail: { fromEngineVersion: v.v.engineVersion, toEngineVersion: report.engineVersion, shiftRad: c.shiftRad, changedChecks: c.changedChecks, recheckVersionId: saved?.id ?? null },
        });
        return saved;
      }
      // A once-cleared version gets its successor for the reviewer in the same commit as the result.
      return saveRecheckVersion(tx, { stale: v.v, profile, report, reverificationId: record.id, attitudeShiftDeg: shift });
    });
    if (saved) await afterRecheckSaved(ctx, saved, shift);
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    const last = opts.attempt >= opts.retryLimit;
    await db.update(reverifications)
      .set({ state: last ? 'failed' : 'queued', error: message, finishedAt: last ? new Date() : null })
      .where(and(eq(reverifications.id, record.id), notCancelled()));
    ctx.logger.warn({ err, job, attempt: opts.attempt }, 're-verification failed');
    throw err;
  }
}
