/**
 * /api/sequences: maneuvers, their versions, compile previews, submission and comparison
 * (shapes in shared/contracts/maneuver.ts). The area is open to every role; object-level rules are
 * in server/maneuvers/maneuver-access.ts.
 */
import { and, eq, ilike, inArray, isNotNull, isNull, or, type SQL } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { crewMembers, sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import {
  compileRequestSchema,   type CompileResponse, createSequenceRequestSchema, saveVersionRequestSchema, type SequenceDetail, type SequenceListItem, sequenceListQuerySchema, type SequenceListResponse, type SequenceSummary, submitRequestSchema, updateSequenceRequestSchema,
type VersionSummary,
} from '../../shared/contracts/maneuver.ts';
import { DOF_NAMES } from '../../shared/model/dof-names.ts';
import { compilePrimitives, type DofInfo, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { cueFor } from '../../shared/primitives/primitive-cues.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { readableMember } from '../crew/crew-access.ts';
import { badRequest, notFound } from '../http/http-error.ts';
import { ReadCache, sendCachedJson } from '../http/read-cache.ts';
import { validate } from '../http/validate.ts';
import { queueRobustnessAfterSave } from '../jobs/robustness/version-robustness.ts';
import { compareVersions } from '../maneuvers/compare-versions.ts';
import { currentProfile } from '../maneuvers/current-profile.ts';
import { requireAuthor, visibleSequences, visibleVersions } from '../maneuvers/maneuver-access.ts';
import { updateSequence } from '../maneuvers/update-sequence.ts';
import { saveVersion, submitVersion } from '../maneuvers/version-actions.ts';
import { loadVersionDetail } from '../maneuvers/version-detail.ts';
import { allOf, sequenceHeads, sequenceListRows, versionSummaries } from '../maneuvers/version-views.ts';
import { UNSUITED_DOF_RANGES } from '../model/data/joint-ranges-unsuited.ts';
import { cueCardRouter } from './cue-card.ts';
import { robustnessRouter } from './robustness.ts';
import { sequenceArchiveRouter } from './sequence-archive.ts';
import { sequencePlansRouter } from './sequence-plans.ts';

const uuid = z.uuid('Not a valid id.');
const sequenceParams = z.object({ sequenceId: uuid });
const versionParams = z.object({ versionId: uuid });
const compareParams = z.object({ versionId: uuid, otherVersionId: uuid });
/** A list page's mark: the last maneuver's name and id, as the client got it in `next`. */
const pageMarkSchema = z.tuple([z.string(), z.uuid()]);

/** `next` of a page ending at `head`. */
function pageMark(head: { name: string; id: string }): string {
  return Buffer.from(JSON.stringify([head.name, head.id])).toString('base64url');
}

/** The position a page mark names; 400 naming `after` when it is not one. */
function readPageMark(mark: string): { name: string; id: string } {
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.from(mark, 'base64url').toString('utf8'));
  } catch {
    parsed = undefined;
  }
  const ok = pageMarkSchema.safeParse(parsed);
  if (!ok.success) throw badRequest('after: not a page mark of this list (use the previous page’s next).', 'after');
  return { name: ok.data[0], id: ok.data[1] };
}

/** Maneuvers whose name or crew member's name contains `text`, any case (LIKE's wildcards taken literally). */
function nameContains(text: string): SQL | undefined {
  const pattern = `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
  return or(ilike(sequences.name, pattern), ilike(crewMembers.name, pattern));
}

/** The standard model's unsuited dof ranges (compile previews without a crew member). */
const STANDARD_DOFS: DofInfo[] = DOF_NAMES.map((name) => ({ name, ...UNSUITED_DOF_RANGES[name] }));

/** The cleared version trainees rehearse: the newest cleared, or a once-cleared recheck one. */
function rehearsable(versions: VersionSummary[]): VersionSummary | null {
  return versions.find((v) => v.status === 'cleared' || (v.status === 'recheck' && v.clearedAt !== null)) ?? null;
}

/** Archived maneuvers are those archived themselves or whose crew member is archived. */
function archivedCondition(archived: boolean): SQL | undefined {
  return archived
    ? or(isNotNull(sequences.archivedAt), isNotNull(crewMembers.archivedAt))
    : and(isNull(sequences.archivedAt), isNull(crewMembers.archivedAt));
}

/** Builds the router. */
export function sequencesRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const reads = new ReadCache();

  /** The list's rows of these sequences (heads, version counts, briefs of the newest and rehearsable versions) in one query. */
  function listRows(user: SessionUser, sequenceIds: string[]) {
    return sequenceListRows(db, allOf(visibleSequences(user), inArray(sequences.id, sequenceIds)), visibleVersions(user));
  }

  /**
   * GET /sequences: the lean list or one page of it, one query (a trainee sees only sequences with
   * something to rehearse).
   */
  async function listPage(user: SessionUser, query: z.output<typeof sequenceListQuerySchema>): Promise<SequenceListResponse> {
    const { crewMemberId, archived, q, status, limit, after } = query;
    const rows = await sequenceListRows(db, allOf(
      visibleSequences(user),
      crewMemberId ? eq(sequences.crewMemberId, crewMemberId) : undefined,
      archivedCondition(archived),
      q ? nameContains(q) : undefined,
    ), visibleVersions(user), {
      latestStatus: status, withVersions: user.role === 'trainee', after: after === undefined ? undefined : readPageMark(after),
      // One more than the page tells whether another page follows.
      limit: limit === undefined ? undefined : limit + 1,
    });
    const more = limit !== undefined && rows.length > limit;
    const page = more ? rows.slice(0, limit) : rows;
    const items: SequenceListItem[] = page.map((r) => ({
      id: r.head.id, name: r.head.name, crewMemberName: r.head.crewMemberName, target: r.head.target, latest: r.latest,
      cleared: r.cleared && { id: r.cleared.id, version: r.cleared.version, status: r.cleared.status },
    }));
    return { sequences: items, next: more ? pageMark(page[page.length - 1].head) : null };
  }

  /**
   * Full sequence summaries (what creating or renaming one answers): the list's query, then one for
   * the full summaries of its newest and rehearsable versions.
   */
  async function summaries(user: SessionUser, sequenceIds: string[]): Promise<SequenceSummary[]> {
    const rows = await listRows(user, sequenceIds);
    const ids = [...new Set(rows.flatMap((r) => [r.latest?.id, r.cleared?.id]).filter((id) => id !== undefined))];
    const versions = ids.length ? (await versionSummaries(db, inArray(sequenceVersions.id, ids))).summaries : [];
    const byId = new Map(versions.map((v) => [v.id, v]));
    const out = rows.map((r) => ({
      ...r.head, versionCount: r.versionCount,
      latest: (r.latest && byId.get(r.latest.id)) || null, cleared: (r.cleared && byId.get(r.cleared.id)) || null,
    }));
    // A trainee sees only sequences with something to rehearse.
    return user.role === 'trainee' ? out.filter((s) => s.versionCount > 0) : out;
  }

  /** One sequence with every version the user may see, newest first; 404 when hidden or missing. */
  async function detail(user: SessionUser, sequenceId: string): Promise<SequenceDetail> {
    const [head] = await sequenceHeads(db, allOf(visibleSequences(user), eq(sequences.id, sequenceId)));
    if (!head) throw notFound('Sequence');
    const { summaries: versions } = await versionSummaries(db, allOf(visibleVersions(user), eq(sequenceVersions.sequenceId, sequenceId)));
    if (user.role === 'trainee' && !versions.length) throw notFound('Sequence');
    return { ...head, versionCount: versions.length, latest: versions[0] ?? null, cleared: rehearsable(versions), versions };
  }

  router.get('/', validate({ query: sequenceListQuerySchema }), async (req, res) => {
    const query = res.locals.query;
    await sendCachedJson(reads, req, res, () => listPage(req.user!, query));
  });

  router.post('/', validate({ body: createSequenceRequestSchema }), async (req, res) => {
    const user = req.user!;
    requireAuthor(user);
    const input = req.body;
    const [member] = await db.select({ id: crewMembers.id, name: crewMembers.name, archivedAt: crewMembers.archivedAt }).from(crewMembers).where(eq(crewMembers.id, input.crewMemberId));
    if (!member) throw badRequest('crewMemberId: no such crew member.', 'crewMemberId');
    if (member.archivedAt) throw badRequest(`crewMemberId: ${member.name} is archived; restore them on Crew first.`, 'crewMemberId');
    const id = await db.transaction(async (tx) => {
      const [row] = await tx.insert(sequences).values({ crewMemberId: input.crewMemberId, name: input.name, target: input.target, createdBy: user.id }).returning();
      await recordAudit(tx, { actorId: user.id, action: 'sequence.create', objectType: 'sequence', objectId: row.id, detail: { name: input.name, crewMemberId: input.crewMemberId, target: input.target } });
      return row.id;
    });
    const [created] = await summaries(user, [id]);
    res.status(201).json(created);
  });

  router.post('/compile', validate({ body: compileRequestSchema }), async (req, res) => {
    const input = req.body;
    // Compiling against a member's profile reads that profile: the same rule as reading it (a trainee only their own).
    if (input.crewMemberId) await readableMember(db, req.user!, input.crewMemberId);
    const dofs = input.crewMemberId ? dofInfoFromBody((await currentProfile(db, input.crewMemberId)).body) : STANDARD_DOFS;
    const primitives = input.primitives;
    const c = compilePrimitives(primitives, dofs);
    const out: CompileResponse = { compiled: c.sequence, stepMap: c.stepMap, cues: primitives.map(cueFor), durationS: c.durationS, errors: c.errors, warnings: c.warnings,
      ranges: Object.fromEntries(dofs.map((d) => [d.name, { min: d.min, max: d.max }])),
    };
    res.json(out);
  });

  router.get('/versions/:versionId', validate({ params: versionParams }), async (req, res) => {
    const { versionId } = res.locals.params;
    await sendCachedJson(reads, req, res, () => loadVersionDetail(db, req.user!, versionId));
  });

  router.post('/versions/:versionId/submit', validate({ params: versionParams, body: submitRequestSchema }), async (req, res) => {
    const { versionId } = res.locals.params;
    await submitVersion(ctx, req.user!, versionId, req.body);
    res.json(await loadVersionDetail(db, req.user!, versionId));
  });

  router.get('/versions/:versionId/compare/:otherVersionId', validate({ params: compareParams }), async (req, res) => {
    const { versionId, otherVersionId } = res.locals.params;
    const a = await loadVersionDetail(db, req.user!, versionId);
    const b = await loadVersionDetail(db, req.user!, otherVersionId);
    res.json(compareVersions(a, b));
  });

  router.use(cueCardRouter(ctx));
  router.use(sequenceArchiveRouter(ctx));
  router.use(robustnessRouter(ctx));
  router.use('/:sequenceId/plans', sequencePlansRouter(ctx));

  router.get('/:sequenceId', validate({ params: sequenceParams }), async (req, res) => {
    const { sequenceId } = res.locals.params;
    await sendCachedJson(reads, req, res, () => detail(req.user!, sequenceId));
  });

  router.patch('/:sequenceId', validate({ params: sequenceParams, body: updateSequenceRequestSchema }), async (req, res) => {
    const user = req.user!;
    requireAuthor(user);
    const { sequenceId } = res.locals.params;
    await updateSequence(ctx, user, sequenceId, req.body);
    const [summary] = await summaries(user, [sequenceId]);
    res.json(summary);
  });

  router.post('/:sequenceId/versions', validate({ params: sequenceParams, body: saveVersionRequestSchema }), async (req, res) => {
    const { sequenceId } = res.locals.params;
    const input = req.body;
    const id = await saveVersion(ctx, req.user!, sequenceId, { primitives: input.primitives, baseVersion: input.baseVersion, note: input.note, target: input.target });
    await queueRobustnessAfterSave(ctx, id, req.user!.id);
    res.status(201).json(await loadVersionDetail(db, req.user!, id));
  });

  return router;
}
