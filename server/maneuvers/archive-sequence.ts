/**
 * Keeping the maneuver list to what is in use: archive and restore a maneuver, and delete one that
 * never reached a reviewer. Archiving keeps every version, review and rehearsal (the record stays
 * whole); it takes the maneuver out of default lists and out of trainees' sight and refuses new
 * versions until it is restored. Only a maneuver none of whose versions was ever submitted can be
 * deleted, with its drafts, plans and robustness runs, in one transaction.
 */
import { and, eq, inArray, or } from 'drizzle-orm';

import { plans, robustnessRuns, sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { conflict, notFound } from '../http/http-error.ts';
import { requireAuthor } from './maneuver-access.ts';

/** Statuses a version can have without ever reaching a reviewer (a newer draft replaces an older one). */
const NEVER_SUBMITTED: readonly string[] = ['drafting', 'replaced'];

/** Background work that still writes to a maneuver's rows. */
const ACTIVE_STATES = ['queued', 'running'];

/** Archives (or restores) a maneuver; 409 when it already is in that state or a version awaits a reviewer. */
export async function setSequenceArchived(ctx: AppContext, user: SessionUser, sequenceId: string, archived: boolean): Promise<void> {
  requireAuthor(user);
  await ctx.db.transaction(async (tx) => {
    const [seq] = await tx.select().from(sequences).where(eq(sequences.id, sequenceId)).for('update');
    if (!seq) throw notFound('Maneuver');
    if (archived === (seq.archivedAt !== null)) {
      throw conflict(archived ? `'${seq.name}' is already archived.` : `'${seq.name}' is not archived.`, archived ? 'already_archived' : 'not_archived');
    }
    if (archived) {
      // A version in front of a reviewer must be decided (or sent back) first: archiving must not hide pending work.
      const [pending] = await tx.select({ version: sequenceVersions.version }).from(sequenceVersions)
        .where(and(eq(sequenceVersions.sequenceId, sequenceId), eq(sequenceVersions.status, 'under_review'))).limit(1);
      if (pending) throw conflict(`Version ${pending.version} of '${seq.name}' is under review; it needs a reviewer's decision before the maneuver can be archived.`, 'under_review');
    }
    await tx.update(sequences)
      .set(archived ? { archivedAt: new Date(), archivedBy: user.id } : { archivedAt: null, archivedBy: null })
      .where(eq(sequences.id, sequenceId));
    await recordAudit(tx, { actorId: user.id, action: archived ? 'sequence.archive' : 'sequence.restore', objectType: 'sequence', objectId: sequenceId, detail: { name: seq.name } });
  });
}

/** 409 `archived` when the maneuver is archived: new versions and submissions wait for a restore. */
export function assertNotArchived(seq: { name: string; archivedAt: Date | null }): void {
  if (seq.archivedAt) throw conflict(`'${seq.name}' is archived. Restore it before changing it.`, 'archived');
}

/**
 * Deletes a maneuver none of whose versions was ever submitted, with its drafts, plans and
 * robustness runs. 409 `submitted` once any version reached a reviewer (the record must stay), 409
 * `busy` while a plan of it is queued or running (cancel or wait first); its robustness runs go with it.
 */
export async function deleteDraftSequence(ctx: AppContext, user: SessionUser, sequenceId: string): Promise<void> {
  requireAuthor(user);
  await ctx.db.transaction(async (tx) => {
    const [seq] = await tx.select().from(sequences).where(eq(sequences.id, sequenceId)).for('update');
    if (!seq) throw notFound('Maneuver');
    const versions = await tx.select({ id: sequenceVersions.id, version: sequenceVersions.version, status: sequenceVersions.status, submittedAt: sequenceVersions.submittedAt })
      .from(sequenceVersions).where(eq(sequenceVersions.sequenceId, sequenceId));
    const submitted = versions.find((v) => v.submittedAt !== null || !NEVER_SUBMITTED.includes(v.status));
    if (submitted) {
      throw conflict(`Version ${submitted.version} of '${seq.name}' went to review, so the maneuver stays on record. Archive it instead.`, 'submitted');
    }
    const versionIds = versions.map((v) => v.id);
    const planRows = await tx.select({ id: plans.id, state: plans.state }).from(plans).where(eq(plans.sequenceId, sequenceId));
    const planIds = planRows.map((p) => p.id);
    const runOwners = or(
      versionIds.length ? inArray(robustnessRuns.sequenceVersionId, versionIds) : undefined,
      planIds.length ? inArray(robustnessRuns.planId, planIds) : undefined,
    );
    const runs = versionIds.length || planIds.length
      ? await tx.select({ id: robustnessRuns.id, state: robustnessRuns.state }).from(robustnessRuns).where(runOwners)
      : [];
    if (planRows.some((p) => ACTIVE_STATES.includes(p.state))) {
      throw conflict(`The planner is still suggesting steps for '${seq.name}'. Cancel the plan or let it finish, then delete.`, 'busy');
    }
    // Children first (robustness chunks cascade with their run). A chunk job still in flight finds its
    // run gone and stops without writing (server/jobs/robustness/robustness-runs.ts).
    if (runs.length) await tx.delete(robustnessRuns).where(inArray(robustnessRuns.id, runs.map((r) => r.id)));
    if (planIds.length) await tx.delete(plans).where(inArray(plans.id, planIds));
    if (versionIds.length) await tx.delete(sequenceVersions).where(inArray(sequenceVersions.id, versionIds));
    await tx.delete(sequences).where(eq(sequences.id, sequenceId));
    await recordAudit(tx, {
      actorId: user.id, action: 'sequence.delete', objectType: 'sequence', objectId: sequenceId,
      detail: { name: seq.name, crewMemberId: seq.crewMemberId, versions: versions.length },
    });
  });
}
