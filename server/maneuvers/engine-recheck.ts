/**
 * An engine change (DECISIONS.md "An engine change"): on start, every cleared version verified by
 * another engine version is re-verified in the background on its own profile version. When the final
 * attitude agrees within 1e-6 rad and every limit check is unchanged, the record says so ("re-verified
 * under engine X, unchanged") and the approval stands; otherwise the version becomes stale and the
 * re-check flow of a profile change applies (recheck-version.ts saves the next version for review).
 * An engine re-verification is the one whose from and to profile versions are the same.
 */
import { and, eq, inArray, ne, sql } from 'drizzle-orm';

import { reverifications, sequenceVersions } from '../../db/schema/index.ts';
import type { VerificationReport } from '../../shared/contracts/maneuver.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';

/** Final attitudes closer than this (radians) agree. */
export const ENGINE_AGREEMENT_RAD = 1e-6;

/** How a re-verification under another engine compares with the stored report. */
export interface EngineComparison {
  unchanged: boolean;
  /** Angle between the stored and the recomputed final attitude, radians. */
  shiftRad: number;
  /** The limit checks whose verdict changed, in words (empty when none). */
  changedChecks: string[];
}

const rangeKey = (r: VerificationReport['rangeViolations'][number]) => `${r.dof} ${r.bound} in step ${r.step + 1}`;

/** Compares a report recomputed under another engine with the stored one. */
export function compareUnderEngine(stored: VerificationReport, next: VerificationReport): EngineComparison {
  const q = (r: VerificationReport) => [r.final.attitude.w, r.final.attitude.x, r.final.attitude.y, r.final.attitude.z] as [number, number, number, number];
  const shiftRad = quatAngleBetween(q(stored), q(next));
  const changedChecks: string[] = [];
  if (stored.target.withinTolerance !== next.target.withinTolerance) changedChecks.push(`target ${next.target.withinTolerance ? 'now within' : 'no longer within'} tolerance`);
  if (stored.peakJointRate.withinLimit !== next.peakJointRate.withinLimit) changedChecks.push(`joint rate ${next.peakJointRate.withinLimit ? 'now within' : 'now over'} its limit`);
  if (stored.timeBudget.within !== next.timeBudget.within) changedChecks.push(`time budget ${next.timeBudget.within ? 'now met' : 'now exceeded'}`);
  const before = new Set(stored.rangeViolations.map(rangeKey));
  const after = new Set(next.rangeViolations.map(rangeKey));
  for (const k of after) if (!before.has(k)) changedChecks.push(`new range violation: ${k}`);
  for (const k of before) if (!after.has(k)) changedChecks.push(`range violation gone: ${k}`);
  return { unchanged: shiftRad <= ENGINE_AGREEMENT_RAD && changedChecks.length === 0, shiftRad, changedChecks };
}

/** The record's words for an engine re-verification. */
export function engineOutcome(engineVersion: string, c: EngineComparison, recheckVersion: number | null): string {
  if (c.unchanged) return `Re-verified under engine ${engineVersion}, unchanged (final attitude within ${c.shiftRad.toExponential(1)} rad; every limit check the same); the approval stands.`;
  const what = [c.shiftRad > ENGINE_AGREEMENT_RAD ? `final attitude moved ${c.shiftRad.toExponential(2)} rad` : null, ...c.changedChecks].filter(Boolean).join('; ');
  return `Re-verified under engine ${engineVersion}: ${what}. ${recheckVersion !== null ? `Version ${recheckVersion} waits for a reviewer's re-check.` : 'A planner has to save it again for review.'}`;
}

/**
 * On start: queues a re-verification of every cleared version verified by another engine version than
 * this process's (`ctx.engineVersion`), unless one is open or one under this engine finished already.
 * The records are the outbox (the reconcile pass sends any job lost here). Returns the version ids queued.
 */
export async function queueEngineRechecks(ctx: AppContext): Promise<string[]> {
  const { db } = ctx;
  const stale = await db.select({ id: sequenceVersions.id, profileVersionId: sequenceVersions.profileVersionId, engineVersion: sequenceVersions.engineVersion })
    .from(sequenceVersions)
    .where(and(eq(sequenceVersions.status, 'cleared'), ne(sequenceVersions.engineVersion, ctx.engineVersion)));
  if (!stale.length) return [];
  const records = await db.select({ versionId: reverifications.sequenceVersionId, state: reverifications.state, engine: sql<string | null>`${reverifications.report}->>'engineVersion'` })
    .from(reverifications)
    .where(and(inArray(reverifications.sequenceVersionId, stale.map((s) => s.id)), eq(reverifications.fromProfileVersionId, reverifications.toProfileVersionId)));
  const covered = new Set(records.filter((r) => r.state === 'queued' || r.state === 'running' || (r.state === 'done' && r.engine === ctx.engineVersion)).map((r) => r.versionId));
  const due = stale.filter((s) => !covered.has(s.id));
  if (!due.length) return [];
  await db.transaction(async (tx) => {
    for (const v of due) {
      await tx.insert(reverifications).values({ sequenceVersionId: v.id, fromProfileVersionId: v.profileVersionId, toProfileVersionId: v.profileVersionId });
      await recordAudit(tx, {
        actorId: null, action: 'sequence_version.engine_recheck', objectType: 'sequence_version', objectId: v.id,
        detail: { fromEngineVersion: v.engineVersion, toEngineVersion: ctx.engineVersion },
      });
    }
  });
  if (ctx.jobs) {
    for (const v of due) {
      try {
        await ctx.jobs.enqueueReverification([v.id], v.profileVersionId);
      } catch (err) {
        ctx.logger.error({ err, versionId: v.id }, 'could not send an engine re-verification job; the reconcile pass will');
      }
    }
  } else {
    ctx.logger.warn({ count: due.length }, 'no job queue running: engine re-verification records stay queued');
  }
  ctx.logger.info({ count: due.length, engineVersion: ctx.engineVersion }, 'cleared versions verified by another engine queued for re-verification');
  return due.map((v) => v.id);
}
