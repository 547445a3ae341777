/**
 * The re-check's automatic save (DECISIONS.md "Re-check creates the next version"): when the
 * re-verification of a once-cleared version on a newer profile finishes, the next version of its
 * sequence is saved with the same steps and target, bound to that profile, authored by the system,
 * `under_review`, with the new report, and linked to the version it re-checks. It enters the
 * reviewer's queue as a re-check decision; clearing it replaces the old version as usual, and an
 * approval stays a person's decision.
 */
import { and, eq } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { crewMembers, type ProfileVersionRow, profileVersions, reverifications, sequences, type SequenceVersionRow,sequenceVersions, users } from '../../db/schema/index.ts';
import type { VerificationReport } from '../../shared/contracts/maneuver.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { publicUrl } from '../config.ts';
import { queueVersionRobustness } from '../jobs/robustness/version-robustness.ts';
import { recheckMail } from './review-mail.ts';
import { appendVersion } from './version-actions.ts';

type Tx = Parameters<Parameters<Database['transaction']>[0]>[0];

/** The saved re-check version. */
export interface RecheckSaved {
  id: string;
  version: number;
}

/**
 * Inside the transaction that stores the re-verification's result: saves the re-check version when
 * `stale` was once cleared, is still waiting (`recheck`), and `profile` is still the crew member's
 * current profile (a newer change brings its own re-verification). Returns null when none is due.
 */
export async function saveRecheckVersion(tx: Tx, a: { stale: SequenceVersionRow; profile: ProfileVersionRow; report: VerificationReport; reverificationId: string; attitudeShiftDeg: number | null; note?: string }): Promise<RecheckSaved | null> {
  const { stale, profile, report } = a;
  if (!stale.clearedAt) return null;
  const [now] = await tx.select({ status: sequenceVersions.status, currentVersion: crewMembers.currentVersion, crewMemberId: crewMembers.id })
    .from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .innerJoin(crewMembers, eq(crewMembers.id, sequences.crewMemberId))
    .where(eq(sequenceVersions.id, stale.id));
  if (now?.status !== 'recheck' || now.crewMemberId !== profile.crewMemberId || now.currentVersion !== profile.version) return null;
  const [from] = await tx.select({ version: profileVersions.version }).from(profileVersions).where(eq(profileVersions.id, stale.profileVersionId));
  const submittedAt = new Date();
  // An archived maneuver gets no re-check version: the stale one stays flagged until it is restored.
  const [seq] = await tx.select({ archivedAt: sequences.archivedAt }).from(sequences).where(eq(sequences.id, stale.sequenceId));
  if (seq?.archivedAt) return null;
  const row = await appendVersion(tx, stale.sequenceId, null, () => ({
    primitives: stale.primitives, target: stale.target, compiled: stale.compiled, profileVersionId: profile.id,
    // Straight to review: the system re-verified what a person cleared; only a person clears it again.
    status: 'under_review', submittedAt, report, engineVersion: report.engineVersion, inputsHash: report.inputsHash, authorId: null,
    note: a.note ?? `Automatic re-check of version ${stale.version} after the profile change v${from?.version ?? '?'} → v${profile.version}: the same steps, re-verified on the new profile.`,
    recheckOfId: stale.id,
  }));
  await tx.update(reverifications).set({ resultVersionId: row.id }).where(eq(reverifications.id, a.reverificationId));
  await recordAudit(tx, {
    actorId: null, action: 'sequence_version.recheck_saved', objectType: 'sequence_version', objectId: row.id,
    detail: { sequenceId: stale.sequenceId, version: row.version, recheckOf: stale.id, recheckOfVersion: stale.version, profileVersionId: profile.id, attitudeShiftDeg: a.attitudeShiftDeg, targetErrorDeg: report.target.errorDeg },
  });
  return { id: row.id, version: row.version };
}

/**
 * After commit: queues the re-check version's robustness run and e-mails every reviewer. Failures
 * are logged, not thrown: the version is stored, the report offers a new run, the queue shows it.
 */
export async function afterRecheckSaved(ctx: AppContext, saved: RecheckSaved, attitudeShiftDeg: number | null): Promise<void> {
  try {
    await queueVersionRobustness(ctx, saved.id, { requestedBy: null });
  } catch (err) {
    ctx.logger.error({ err, versionId: saved.id }, 'queueing the robustness run of a re-check version failed');
  }
  const [info] = await ctx.db.select({ sequenceName: sequences.name, crewName: crewMembers.name })
    .from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .innerJoin(crewMembers, eq(crewMembers.id, sequences.crewMemberId))
    .where(eq(sequenceVersions.id, saved.id));
  if (!info) return;
  const reviewers = await ctx.db.select().from(users).where(and(eq(users.role, 'reviewer'), eq(users.disabled, false)));
  for (const r of reviewers) {
    try {
      await ctx.mailer.send(recheckMail({
        to: r.email, reviewerName: r.name, sequenceName: info.sequenceName, version: saved.version, crewMemberName: info.crewName,
        attitudeShiftDeg, versionId: saved.id, baseUrl: publicUrl(ctx.config),
      }));
    } catch (err) {
      ctx.logger.error({ err, to: r.email }, 're-check mail failed');
    }
  }
}
