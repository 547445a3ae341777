import { and, desc, eq, inArray, isNull, type SQL } from 'drizzle-orm';
import { Router } from 'express';

import { crewMembers, rehearsals, sequences, sequenceVersions, users } from '../../db/schema/index.ts';
import { logRehearsalSchema, type RehearsableVersion, type Rehearsal, rehearsalListQuerySchema } from '../../shared/contracts/rehearsal.ts';
import { targetWords } from '../../shared/product/target-words.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { badRequest, forbidden, notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';
import { assertRehearsable, visibleVersions } from '../maneuvers/maneuver-access.ts';
import { recheckInfos } from '../maneuvers/recheck-info.ts';
import { compiledDuration, stepListCount } from '../maneuvers/step-timeline.ts';
import { loadStoredVersion, readStoredCompiled, readVersionTarget } from '../maneuvers/stored-version.ts';
import { mountRehearsalCaptures } from './rehearsal-captures.ts';

type RehearsalJoin = { r: typeof rehearsals.$inferSelect; seqName: string; version: number; traineeName: string; engineVersion: string | null };

function toRehearsal({ r, seqName, version, traineeName, engineVersion }: RehearsalJoin): Rehearsal {
  return {
    id: r.id, sequenceVersionId: r.sequenceVersionId, sequenceName: seqName, version, traineeId: r.traineeId, traineeName,
    performedAt: r.performedAt.toISOString(), playbackSpeed: r.playbackSpeed, completedSteps: r.completedSteps,
    totalSteps: r.totalSteps, selfRating: r.selfRating, notes: r.notes, engineVersion,
  };
}

/**
 * Rehearsals: trainees list what they may rehearse and log runs of cleared versions of their own
 * crew member; everyone signed in reads the history (trainees only their own).
 */
export function rehearsalsRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  const selectRehearsals = (where: SQL | undefined) =>
    db
      .select({ r: rehearsals, seqName: sequences.name, version: sequenceVersions.version, traineeName: users.name, engineVersion: sequenceVersions.engineVersion })
      .from(rehearsals)
      .innerJoin(sequenceVersions, eq(sequenceVersions.id, rehearsals.sequenceVersionId))
      .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
      .innerJoin(users, eq(users.id, rehearsals.traineeId))
      .where(where)
      .orderBy(desc(rehearsals.performedAt));

  // What the caller may rehearse: cleared versions (a trainee: of their own crew member), plus
  // formerly cleared or rehearsed versions that now need a re-check, with a notice in the list.
  // Recordings attached to rehearsals (issue 15); before '/:id' style routes.
  mountRehearsalCaptures(router, ctx);

  router.get('/available', async (req, res) => {
    const me = req.user!;
    const rows = await db
      .select({ v: sequenceVersions, s: sequences, crewName: crewMembers.name })
      .from(sequenceVersions)
      .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
      .innerJoin(crewMembers, eq(crewMembers.id, sequences.crewMemberId))
      // Archived maneuvers are retired from rehearsal for everyone; a trainee sees only what the visibility rule shows.
      .where(and(inArray(sequenceVersions.status, ['cleared', 'recheck']), isNull(sequences.archivedAt), visibleVersions(me)))
      .orderBy(sequences.name, desc(sequenceVersions.version));
    const mine = rows.length
      ? await selectRehearsals(and(
          inArray(rehearsals.sequenceVersionId, rows.map((r) => r.v.id)),
          me.role === 'trainee' ? eq(rehearsals.traineeId, me.id) : undefined,
        ))
      : [];
    // Re-check versions show when they had been cleared (or were rehearsed), so the notice explains why they went away.
    const shown = rows.filter(({ v }) => v.status === 'cleared' || v.clearedAt !== null || mine.some((m) => m.r.sequenceVersionId === v.id));
    const rechecks = await recheckInfos(db, shown.filter(({ v }) => v.status === 'recheck').map(({ v }) => v));
    const versions: RehearsableVersion[] = shown
      .map(({ v, s, crewName }) => {
        const target = readVersionTarget(v.id, v.target);
        const compiled = readStoredCompiled(v.id, v.compiled);
        const runs = mine.filter((m) => m.r.sequenceVersionId === v.id);
        const last = runs[0]?.r;
        return {
          versionId: v.id, sequenceId: s.id, sequenceName: s.name, version: v.version, status: v.status,
          crewMemberName: crewName, target, targetLabel: targetWords(target),
          // the verified run's duration (the report's summary), else the compiled steps' own
          duration: v.reportSummary?.durationS ?? compiledDuration(compiled), stepCount: stepListCount(compiled),
          engineVersion: v.engineVersion, verifiedByOtherEngine: v.engineVersion !== null && v.engineVersion !== ctx.engineVersion,
          clearedAt: v.clearedAt?.toISOString() ?? null,
          lastRehearsal: last ? { performedAt: last.performedAt.toISOString(), selfRating: last.selfRating, completedSteps: last.completedSteps, totalSteps: last.totalSteps } : null,
          rehearsalCount: runs.length,
          recheck: rechecks.get(v.id) ?? null,
        };
      });
    res.json({ versions });
  });

  router.get('/', validate({ query: rehearsalListQuerySchema }), async (req, res) => {
    const me = req.user!;
    const { versionId } = res.locals.query;
    const rows = await selectRehearsals(and(
      me.role === 'trainee' ? eq(rehearsals.traineeId, me.id) : undefined,
      versionId ? eq(rehearsals.sequenceVersionId, versionId) : undefined,
    ));
    res.json({ rehearsals: rows.map(toRehearsal) });
  });

  router.post('/', validate({ body: logRehearsalSchema }), async (req, res) => {
    const me = req.user!;
    if (me.role !== 'trainee') throw forbidden('Only crew trainees log rehearsals.');
    const input = req.body;
    const v = await loadStoredVersion(db, input.sequenceVersionId);
    if (!v) throw notFound('Sequence version');
    assertRehearsable(me, v);
    const totalSteps = stepListCount(v.compiled);
    if (input.completedSteps > totalSteps) {
      throw badRequest(`completedSteps: this version has ${totalSteps} steps; ${input.completedSteps} cannot be completed.`, 'completedSteps');
    }
    const row = await db.transaction(async (tx) => {
      const [r] = await tx
        .insert(rehearsals)
        .values({
          sequenceVersionId: v.id, traineeId: me.id, playbackSpeed: input.playbackSpeed,
          completedSteps: input.completedSteps, totalSteps, selfRating: input.selfRating, notes: input.notes,
        })
        .returning();
      await recordAudit(tx, {
        actorId: me.id, action: 'rehearsal.log', objectType: 'rehearsal', objectId: r.id,
        detail: { sequenceVersionId: v.id, completedSteps: input.completedSteps, totalSteps, playbackSpeed: input.playbackSpeed },
      });
      return r;
    });
    res.status(201).json({ rehearsal: toRehearsal({ r: row, seqName: v.sequenceName, version: v.version, traineeName: me.name, engineVersion: v.engineVersion }) });
  });

  return router;
}
