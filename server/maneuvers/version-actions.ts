/**
 * What planners and reviewers do to versions: save (compile, verify, supersede), submit, decide,
 * comment. Every status change goes through the transition table and a guarded UPDATE
 * (`WHERE status = <expected>`), so two concurrent requests cannot both move a version; every
 * action writes an audit event in the same transaction.
 */
import { and, eq, inArray, isNull, lt, max, ne, or } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { auditEvents, crewMembers, reviews, sequences, type SequenceVersionRow,sequenceVersions, users } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import type { Body } from '../../shared/contracts/body.ts';
import type { SequenceTarget, StoredCompiled } from '../../shared/contracts/maneuver.ts';
import type { VersionStatus } from '../../shared/contracts/version-status.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { compiledStepCue } from '../../shared/primitives/primitive-cues.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';
import { failuresSentence, versionCheckFailures } from '../../shared/product/version-checks.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { publicUrl } from '../config.ts';
import { badRequest, conflict, forbidden, HttpError, notFound } from '../http/http-error.ts';
import { latestVersionRun } from '../jobs/robustness/version-robustness.ts';
import { assertNotArchived } from './archive-sequence.ts';
import { currentProfile } from './current-profile.ts';
import { requireAuthor } from './maneuver-access.ts';
import { decisionMail, submissionMail } from './review-mail.ts';
import { refusal, statusesAllowing, transition, type VersionEvent } from './status-machine.ts';
import { readSequenceTarget, readStoredReport } from './stored-version.ts';
import { verifySequence } from './verify-sequence.ts';

type Tx = Parameters<Parameters<Database['transaction']>[0]>[0];

/** 409 `invalid_transition` unless the table allows `event` from `from`; returns the new status. */
export function nextStatusOr409(from: VersionStatus, event: VersionEvent): VersionStatus {
  const to = transition(from, event);
  if (!to) throw conflict(refusal(from, event), 'invalid_transition');
  return to;
}

/** Moves one version from `from` by `event`, only if it is still in `from` (else 409). */
async function moveVersion(tx: Tx, v: SequenceVersionRow, event: VersionEvent, extra: Partial<SequenceVersionRow> = {}): Promise<VersionStatus> {
  const to = nextStatusOr409(v.status, event);
  const updated = await tx.update(sequenceVersions).set({ ...extra, status: to })
    .where(and(eq(sequenceVersions.id, v.id), eq(sequenceVersions.status, v.status)))
    .returning({ id: sequenceVersions.id });
  if (!updated.length) throw conflict('This version changed while you were working on it; reload it and try again.', 'stale_version');
  return to;
}

/** Compiles primitives for a body; 400 naming the first bad primitive. */
export function compileFor(primitives: Primitive[], body: Body) {
  const compiled = compilePrimitives(primitives, dofInfoFromBody(body));
  if (compiled.errors.length) throw badRequest(compiled.errors[0].message, compiled.errors[0].field);
  return compiled;
}

/** Saves version N+1 of a sequence: compile, verify on the current profile, supersede older ones. */
export async function saveVersion(ctx: AppContext, user: SessionUser, sequenceId: string, input: { primitives: Primitive[]; baseVersion: number; note: string; target?: SequenceTarget }): Promise<string> {
  requireAuthor(user);
  const { db } = ctx;
  const [seq] = await db.select().from(sequences).where(eq(sequences.id, sequenceId));
  if (!seq) throw notFound('Sequence');
  assertNotArchived(seq);
  const latestNow = async (q: Pick<Database, 'select'>) =>
    (await q.select({ n: max(sequenceVersions.version) }).from(sequenceVersions).where(eq(sequenceVersions.sequenceId, sequenceId)))[0]?.n ?? 0;
  const staleCheck = (latest: number) => {
    if (input.baseVersion !== latest) {
      throw conflict(`This maneuver changed while you were editing: you started from version ${input.baseVersion}, but the latest is version ${latest}. Nothing was saved; reload and apply your change again.`, 'stale_version');
    }
  };
  // Cheap checks first: no simulation for a stale editor.
  staleCheck(await latestNow(db));
  const profile = await currentProfile(db, seq.crewMemberId);
  const body = profile.body;
  const compiled = compileFor(input.primitives, body);
  // The version's own target: the request's, else the sequence's default.
  const target = input.target ?? readSequenceTarget(seq.id, seq.target);
  const report = await verifySequence({ body, sequence: compiled.sequence, target, profileVersionId: profile.id, pool: ctx.simulation.product, stepMap: compiled.stepMap });
  const stored: StoredCompiled = { sequence: compiled.sequence, cues: compiled.stepMap.map((s) => compiledStepCue(input.primitives[s.primitive], s.role)), stepMap: compiled.stepMap };

  return db.transaction(async (tx) => {
    const row = await appendVersion(tx, sequenceId, user.id, (latest, locked) => {
      // Serialised on the sequence row: re-check archiving and the base version under the lock.
      assertNotArchived(locked);
      staleCheck(latest);
      return {
        primitives: input.primitives, target, compiled: stored, profileVersionId: profile.id,
        status: 'drafting', report, engineVersion: report.engineVersion, inputsHash: report.inputsHash, authorId: user.id, note: input.note,
      };
    });
    // A new target becomes the default for the next version.
    if (input.target && JSON.stringify(input.target) !== JSON.stringify(readSequenceTarget(seq.id, seq.target))) {
      await tx.update(sequences).set({ target: input.target }).where(eq(sequences.id, sequenceId));
    }
    await recordAudit(tx, {
      actorId: user.id, action: 'sequence_version.save', objectType: 'sequence_version', objectId: row.id,
      detail: { sequenceId, version: row.version, target, profileVersionId: profile.id, engineVersion: report.engineVersion, inputsHash: report.inputsHash, targetErrorDeg: report.target.errorDeg },
    });
    return row.id;
  });
}

/** The content of a new version (its sequence and number are appendVersion's). */
export type NewVersionValues = Omit<typeof sequenceVersions.$inferInsert, 'sequenceId' | 'version'>;

/**
 * Inside `tx`: locks the sequence row (saves of one sequence serialise), inserts version latest + 1
 * with the values `make` returns for that latest number and the locked row (it may throw: a stale
 * editor, an archived maneuver), and
 * replaces the older versions a save supersedes — a once-cleared recheck version stays until its
 * successor is cleared. Used by a planner's save and by the re-check's automatic save.
 */
export async function appendVersion(tx: Tx, sequenceId: string, actorId: string | null, make: (latest: number, locked: { name: string; archivedAt: Date | null }) => NewVersionValues): Promise<SequenceVersionRow> {
  const [locked] = await tx.select({ name: sequences.name, archivedAt: sequences.archivedAt }).from(sequences).where(eq(sequences.id, sequenceId)).for('update');
  if (!locked) throw notFound('Sequence');
  const latest = (await tx.select({ n: max(sequenceVersions.version) }).from(sequenceVersions).where(eq(sequenceVersions.sequenceId, sequenceId)))[0]?.n ?? 0;
  const [row] = await tx.insert(sequenceVersions).values({ ...make(latest, locked), sequenceId, version: latest + 1 }).returning();
  const older = await tx.select().from(sequenceVersions).where(and(
    eq(sequenceVersions.sequenceId, sequenceId), lt(sequenceVersions.version, row.version),
    inArray(sequenceVersions.status, statusesAllowing('supersede_by_save')),
    or(ne(sequenceVersions.status, 'recheck'), isNull(sequenceVersions.clearedAt)),
  ));
  for (const o of older) {
    await moveVersion(tx, o, 'supersede_by_save');
    await recordAudit(tx, { actorId, action: 'sequence_version.replace', objectType: 'sequence_version', objectId: o.id, detail: { from: o.status, byVersion: row.version } });
  }
  return row;
}

/** Loads a version with its sequence and crew member; 404 when missing. */
async function loadForAction(db: Database, versionId: string) {
  const [row] = await db
    .select({ v: sequenceVersions, s: sequences, crewName: crewMembers.name, currentVersion: crewMembers.currentVersion })
    .from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .innerJoin(crewMembers, eq(crewMembers.id, sequences.crewMemberId))
    .where(eq(sequenceVersions.id, versionId));
  if (!row) throw notFound('Sequence version');
  return row;
}

/** Sends mail without failing the action that already committed (the failure is logged). */
async function sendQuietly(ctx: AppContext, mail: { to: string; subject: string; text: string }) {
  try {
    await ctx.mailer.send(mail);
  } catch (err) {
    ctx.logger.error({ err, to: mail.to }, 'review mail failed');
  }
}

/** What a submission carries (POST …/submit). */
export interface SubmitInput {
  /** A note for the reviewer (required with acknowledgeFailures). */
  note?: string;
  /** The submitter knows the version fails checks and submits it anyway. */
  acknowledgeFailures?: boolean;
}

/**
 * drafting → under_review by the author (or an admin); e-mails every reviewer. A version that fails
 * a check (shared/product/version-checks.ts) goes only with `acknowledgeFailures` and a note, both
 * stored with it for the reviewer; otherwise 409 `checks_failed` naming every failure.
 */
export async function submitVersion(ctx: AppContext, user: SessionUser, versionId: string, input: SubmitInput = {}): Promise<void> {
  requireAuthor(user);
  const { db } = ctx;
  const row = await loadForAction(db, versionId);
  if (row.v.authorId !== user.id && user.role !== 'admin') throw forbidden('Only the author (or an admin) submits a version.');
  nextStatusOr409(row.v.status, 'submit');
  assertNotArchived(row.s);
  // The bound profile must still be current: otherwise the report describes another body.
  const profile = await currentProfile(db, row.s.crewMemberId);
  if (profile.id !== row.v.profileVersionId) {
    throw conflict(`${row.crewName}'s profile changed since this version was verified; save a new version to verify it on profile version ${profile.version}.`, 'profile_changed');
  }
  const report = readStoredReport(row.v.id, row.v.report);
  if (!report) throw conflict('This version has no verification report.', 'not_verified');
  const run = await latestVersionRun(db, versionId);
  const failures = versionCheckFailures(report, run && { state: run.state, progress: run.samples ? run.doneSamples / run.samples : 0, error: run.error });
  const note = input.note?.trim() ?? '';
  if (failures.length && !(input.acknowledgeFailures && note)) {
    const how = input.acknowledgeFailures
      ? 'Say in the note why it should be reviewed anyway.'
      : 'Change the steps, or submit it with a note for the reviewer and acknowledgeFailures: true.';
    throw new HttpError(409, 'checks_failed', `Version ${row.v.version}: ${failuresSentence(failures)} ${how}`, input.acknowledgeFailures ? 'note' : 'acknowledgeFailures');
  }
  await db.transaction(async (tx) => {
    await moveVersion(tx, row.v, 'submit', { submittedAt: new Date(), submitNote: note || null, acknowledgedFailures: failures.length ? failures : null });
    await recordAudit(tx, {
      actorId: user.id, action: 'sequence_version.submit', objectType: 'sequence_version', objectId: versionId,
      detail: { sequenceId: row.s.id, version: row.v.version, note, acknowledgedFailures: failures.map((f) => f.check) },
    });
  });
  const reviewers = await db.select().from(users).where(and(eq(users.role, 'reviewer'), eq(users.disabled, false)));
  for (const r of reviewers) {
    await sendQuietly(ctx, submissionMail({
      to: r.email, reviewerName: r.name, authorName: user.name, sequenceName: row.s.name, version: row.v.version,
      crewMemberName: row.crewName, versionId, baseUrl: publicUrl(ctx.config),
    }));
  }
}

/** under_review → cleared | sent_back by a reviewer who is not the author; e-mails the author. */
export async function decideVersion(ctx: AppContext, user: SessionUser, versionId: string, decision: 'clear' | 'send_back', comment: string): Promise<void> {
  const { db } = ctx;
  const row = await loadForAction(db, versionId);
  if (row.v.authorId === user.id) throw forbidden('You authored this version: another reviewer must decide on it.');
  // An admin may submit someone else's draft; whoever put it up for review does not decide on it either.
  const [submitted] = await db.select({ id: auditEvents.id }).from(auditEvents).where(and(
    eq(auditEvents.objectId, versionId), eq(auditEvents.action, 'sequence_version.submit'), eq(auditEvents.actorId, user.id),
  )).limit(1);
  if (submitted) throw forbidden('You submitted this version for review: another reviewer must decide on it.');
  nextStatusOr409(row.v.status, decision);
  const report = readStoredReport(row.v.id, row.v.report);
  await db.transaction(async (tx) => {
    const now = new Date();
    if (decision === 'clear') {
      await moveVersion(tx, row.v, 'clear', { clearedBy: user.id, clearedAt: now });
      // The newly cleared version takes over from older cleared / recheck ones.
      const older = await tx.select().from(sequenceVersions).where(and(
        eq(sequenceVersions.sequenceId, row.s.id), lt(sequenceVersions.version, row.v.version),
        inArray(sequenceVersions.status, statusesAllowing('supersede_by_clear')),
      ));
      for (const o of older) {
        await moveVersion(tx, o, 'supersede_by_clear');
        await recordAudit(tx, { actorId: user.id, action: 'sequence_version.replace', objectType: 'sequence_version', objectId: o.id, detail: { from: o.status, byVersion: row.v.version } });
      }
    } else {
      await moveVersion(tx, row.v, 'send_back');
    }
    await tx.insert(reviews).values({
      sequenceVersionId: versionId, reviewerId: user.id, decision, comment,
      profileVersionId: row.v.profileVersionId, engineVersion: report?.engineVersion ?? row.v.engineVersion,
    });
    await recordAudit(tx, {
      actorId: user.id, action: decision === 'clear' ? 'sequence_version.clear' : 'sequence_version.send_back', objectType: 'sequence_version', objectId: versionId,
      detail: { sequenceId: row.s.id, version: row.v.version, profileVersionId: row.v.profileVersionId, engineVersion: row.v.engineVersion, comment },
    });
  });
  if (row.v.authorId) {
    const [authorRow] = await db.select().from(users).where(eq(users.id, row.v.authorId));
    if (authorRow) {
      await sendQuietly(ctx, decisionMail({
        to: authorRow.email, authorName: authorRow.name, reviewerName: user.name, sequenceName: row.s.name, version: row.v.version,
        decision, comment, sequenceId: row.s.id, versionId, baseUrl: publicUrl(ctx.config),
      }));
    }
  }
}

/** Adds a reviewer's comment without a decision. */
export async function commentVersion(ctx: AppContext, user: SessionUser, versionId: string, comment: string): Promise<void> {
  const row = await loadForAction(ctx.db, versionId);
  await ctx.db.transaction(async (tx) => {
    await tx.insert(reviews).values({ sequenceVersionId: versionId, reviewerId: user.id, decision: 'comment', comment, profileVersionId: row.v.profileVersionId, engineVersion: row.v.engineVersion });
    await recordAudit(tx, { actorId: user.id, action: 'sequence_version.comment', objectType: 'sequence_version', objectId: versionId, detail: { comment } });
  });
}
