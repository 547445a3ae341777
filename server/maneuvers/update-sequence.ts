/**
 * PATCH of a sequence: its name, or the target the next version starts from. A version keeps the
 * target it was saved with, so what a reviewer cleared cannot be retargeted: while the latest
 * version is under review, cleared or awaiting its re-check, a target change answers 409
 * `cleared_version` and the planner saves a new version with the new target instead.
 */
import { desc, eq } from 'drizzle-orm';

import { sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import type { SequenceTarget } from '../../shared/contracts/maneuver.ts';
import type { VersionStatus } from '../../shared/contracts/version-status.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { badRequest, conflict, notFound } from '../http/http-error.ts';
import { assertNotArchived } from './archive-sequence.ts';
import { readSequenceTarget } from './stored-version.ts';

/** Statuses of a latest version whose target is under a reviewer's eyes or approved. */
const TARGET_FROZEN: readonly VersionStatus[] = ['under_review', 'cleared', 'recheck'];

/** Applies a name and/or default-target change; 400 `no_change` when it would change nothing. */
export async function updateSequence(ctx: AppContext, user: SessionUser, sequenceId: string, input: { name?: string; target?: SequenceTarget }): Promise<void> {
  await ctx.db.transaction(async (tx) => {
    // Lock the sequence: a concurrent version save must not slip between the check and the update.
    const [seq] = await tx.select().from(sequences).where(eq(sequences.id, sequenceId)).for('update');
    if (!seq) throw notFound('Sequence');
    assertNotArchived(seq);
    const rename = input.name !== undefined && input.name !== seq.name;
    const retarget = input.target !== undefined && JSON.stringify(input.target) !== JSON.stringify(readSequenceTarget(seq.id, seq.target));
    if (!rename && !retarget) throw badRequest('Nothing to change: the name and target are already as given.', input.target !== undefined ? 'target' : 'name');
    if (retarget) {
      const [latest] = await tx.select({ version: sequenceVersions.version, status: sequenceVersions.status }).from(sequenceVersions)
        .where(eq(sequenceVersions.sequenceId, sequenceId)).orderBy(desc(sequenceVersions.version)).limit(1);
      if (latest && TARGET_FROZEN.includes(latest.status)) {
        throw conflict(
          `Version ${latest.version} is ${latest.status.replace('_', ' ')} with its own target, which cannot change. Save a new version with the new target instead.`,
          'cleared_version',
        );
      }
    }
    await tx.update(sequences).set({ ...(rename ? { name: input.name } : {}), ...(retarget ? { target: input.target } : {}) }).where(eq(sequences.id, sequenceId));
    await recordAudit(tx, {
      actorId: user.id, action: 'sequence.update', objectType: 'sequence', objectId: sequenceId,
      detail: { ...(rename ? { name: { from: seq.name, to: input.name } } : {}), ...(retarget ? { target: { from: seq.target, to: input.target } } : {}) },
    });
  });
}
