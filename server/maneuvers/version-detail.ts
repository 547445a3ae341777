/** One version as GET /sequences/versions/:versionId shows it, after the visibility check. */
import { eq } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { sequenceVersions } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import type { VersionDetail } from '../../shared/contracts/maneuver.ts';
import { cueFor } from '../../shared/primitives/primitive-cues.ts';
import type { RecheckInfo } from '../../shared/product/recheck-status.ts';
import { notFound } from '../http/http-error.ts';
import { versionRobustness } from '../jobs/robustness/version-robustness.ts';
import { assertVersionVisible, canAuthor, canReview } from './maneuver-access.ts';
import { recheckInfos } from './recheck-info.ts';
import { transition } from './status-machine.ts';
import { readStoredCompiled, readStoredPrimitives, readStoredReport } from './stored-version.ts';
import { reviewEntries, selectReverifications, selectVersions, toReverification, toSequenceHead, toVersionSummary } from './version-views.ts';

/** The full view of a version, or 404 when missing or hidden from the user. */
export async function loadVersionDetail(db: Database, user: SessionUser, versionId: string): Promise<VersionDetail> {
  const [row] = await selectVersions(db, eq(sequenceVersions.id, versionId));
  if (!row) throw notFound('Sequence version');
  assertVersionVisible(user, { crewMemberId: row.crewMemberId, status: row.v.status, clearedAt: row.v.clearedAt, archived: row.sequence.archivedAt !== null });
  // The content (steps, report) and the histories, read side by side once the version is visible.
  const [[content], revs, reviews, rechecks, robustness] = await Promise.all([
    db.select({ primitives: sequenceVersions.primitives, compiled: sequenceVersions.compiled, report: sequenceVersions.report })
      .from(sequenceVersions).where(eq(sequenceVersions.id, versionId)),
    selectReverifications(db, [row.v.id]),
    reviewEntries(db, row.v.id),
    row.v.status === 'recheck' ? recheckInfos(db, [row.v]) : Promise.resolve(new Map<string, RecheckInfo>()),
    versionRobustness(db, row.v.id),
  ]);
  const report = readStoredReport(versionId, content.report);
  const primitives = readStoredPrimitives(versionId, content.primitives);
  const compiled = readStoredCompiled(versionId, content.compiled);
  const isAuthor = row.v.authorId === user.id;
  return {
    ...toVersionSummary(row),
    sequence: toSequenceHead(row),
    primitives,
    cues: primitives.map(cueFor),
    compiled: compiled.sequence,
    stepMap: compiled.stepMap,
    // The stored report is frozen with the version; its robustness is the newest run, read live.
    report: report ? { ...report, robustness } : null,
    reviews,
    reverifications: revs.map(toReverification),
    allowed: {
      submit: canAuthor(user) && (isAuthor || user.role === 'admin') && transition(row.v.status, 'submit') !== null,
      decide: canReview(user) && !isAuthor && transition(row.v.status, 'clear') !== null,
      comment: canReview(user),
    },
    recheck: rechecks.get(row.v.id) ?? null,
  };
}
