/**
 * /api/sequences/:sequenceId/plans: the maneuver planner ("Suggest steps"). POST queues a planning
 * job on the crew member's current profile body and answers 202 { planId }; GET / lists the
 * sequence's plans newest first (so a reopened composer finds its latest run); GET /:planId returns
 * the plan's state, progress and ranked candidates (shapes in shared/contracts/plan.ts);
 * GET /:planId/candidates/:rank/motion simulates a suggestion for the 3D preview before it is used
 * (shared/contracts/motion.ts `CandidateMotionResponse`; kept in memory, as candidates never change);
 * POST /:planId/cancel stops a queued or running plan (its planner thread ends within about a
 * second; the plan ends `cancelled`), 409 `not_open` when it has already ended.
 */
import { and, desc, eq, sql } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { type PlanRow,plans, sequences } from '../../db/schema/index.ts';
import { readStored } from '../../db/stored-json.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import {
type Plan, planCandidateSchema, type PlanCreated, type PlanList,
  planListQuerySchema, planRequestSchema, } from '../../shared/contracts/plan.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { conflict, forbidden, notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';
import { cancelPlan } from '../jobs/run-plan.ts';
import { currentProfile } from '../maneuvers/current-profile.ts';
import { requireAuthor } from '../maneuvers/maneuver-access.ts';
import { MotionCache } from '../maneuvers/motion-cache.ts';
import { buildCandidateMotion } from '../planning/candidate-motion.ts';

const uuid = z.uuid('Not a valid id.');
const sequenceParams = z.object({ sequenceId: uuid });
const planParams = z.object({ sequenceId: uuid, planId: uuid });
const candidateParams = planParams.extend({
  rank: z.coerce.number({ error: 'rank must be a whole number' }).int('rank must be a whole number').min(1, 'rank must be at least 1').max(8, 'rank must be at most 8'),
});

/** The API shape of a stored plan. */
export function planView(row: PlanRow): Plan {
  const iso = (d: Date | null) => (d ? d.toISOString() : null);
  return {
    id: row.id,
    sequenceId: row.sequenceId,
    profileVersionId: row.profileVersionId,
    state: row.state,
    progress: row.progress,
    progressNote: row.progressNote,
    settings: readStored(planRequestSchema, row.settings, 'plans.settings'),
    candidates: row.candidates === null ? [] : readStored(z.array(planCandidateSchema), row.candidates, 'plans.candidates'),
    error: row.error,
    notes: readStored(z.array(z.string()), row.notes, 'plans.notes'),
    elapsedS: row.startedAt && row.finishedAt ? (row.finishedAt.getTime() - row.startedAt.getTime()) / 1000 : null,
    createdAt: row.createdAt.toISOString(),
    startedAt: iso(row.startedAt),
    finishedAt: iso(row.finishedAt),
  };
}

/** Builds the router (mounted under /sequences/:sequenceId/plans). */
export function sequencePlansRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const { db } = ctx;

  router.post('/', validate({ params: sequenceParams, body: planRequestSchema }), async (req, res) => {
    const user = req.user!;
    requireAuthor(user);
    const { sequenceId } = res.locals.params;
    const settings = req.body;
    const [sequence] = await db.select().from(sequences).where(eq(sequences.id, sequenceId));
    if (!sequence) throw notFound('Sequence');
    const profile = await currentProfile(db, sequence.crewMemberId);
    const target = readStored(sequenceTargetSchema, sequence.target, 'sequences.target');
    const id = await db.transaction(async (tx) => {
      const [row] = await tx.insert(plans).values({ sequenceId, profileVersionId: profile.id, requestedBy: user.id, target, settings }).returning({ id: plans.id });
      await recordAudit(tx, { actorId: user.id, action: 'plan.request', objectType: 'plan', objectId: row.id, detail: { sequenceId, profileVersionId: profile.id, settings } });
      return row.id;
    });
    // Without a queue in this process the row stays queued; a queue started later picks it up.
    if (ctx.jobs?.enqueuePlan) await ctx.jobs.enqueuePlan(id);
    res.status(202).json({ planId: id } satisfies PlanCreated);
  });

  router.get('/', validate({ params: sequenceParams, query: planListQuerySchema }), async (req, res) => {
    requireAuthor(req.user!);
    const { sequenceId } = res.locals.params;
    const { limit } = res.locals.query;
    const [sequence] = await db.select({ id: sequences.id }).from(sequences).where(eq(sequences.id, sequenceId));
    if (!sequence) throw notFound('Sequence');
    // Counted in SQL so the list does not carry every candidate's step list.
    const rows = await db.select({
      id: plans.id,
      state: plans.state,
      progress: plans.progress,
      createdAt: plans.createdAt,
      candidateCount: sql<number>`coalesce(jsonb_array_length(${plans.candidates}), 0)`.mapWith(Number),
      bestErrorDeg: sql<number | null>`(${plans.candidates} -> 0 ->> 'errorDeg')::double precision`,
    }).from(plans).where(eq(plans.sequenceId, sequenceId)).orderBy(desc(plans.createdAt), desc(plans.id)).limit(limit);
    const out: PlanList = {
      plans: rows.map((r) => ({
        id: r.id,
        state: r.state,
        progress: r.progress,
        createdAt: r.createdAt.toISOString(),
        candidateCount: r.candidateCount,
        bestErrorDeg: r.bestErrorDeg === null ? null : Number(r.bestErrorDeg),
      })),
    };
    res.json(out);
  });

  router.get('/:planId', validate({ params: planParams }), async (req, res) => {
    const { sequenceId, planId } = res.locals.params;
    if (req.user!.role === 'trainee') throw forbidden('Plans are for planners, reviewers and admins.');
    const [row] = await db.select({ plan: plans }).from(plans)
      .innerJoin(sequences, eq(sequences.id, plans.sequenceId))
      .where(and(eq(plans.id, planId), eq(plans.sequenceId, sequenceId)));
    if (!row) throw notFound('Plan');
    res.json(planView(row.plan));
  });

  // Serialised once per candidate: its steps and the plan's profile body are frozen.
  const motions = new MotionCache<string>(8);
  router.get('/:planId/candidates/:rank/motion', validate({ params: candidateParams }), async (req, res) => {
    const { sequenceId, planId, rank } = res.locals.params;
    if (req.user!.role === 'trainee') throw forbidden('Plans are for planners, reviewers and admins.');
    const json = await motions.get(`${sequenceId}|${planId}|${rank}`, async () =>
      JSON.stringify(await buildCandidateMotion(db, ctx.simulation.product, ctx.engineVersion, { sequenceId, planId, rank })));
    res.set('Cache-Control', 'private, max-age=0');
    res.type('application/json').send(json);
  });

  router.post('/:planId/cancel', validate({ params: planParams }), async (req, res) => {
    const user = req.user!;
    requireAuthor(user);
    const { sequenceId, planId } = res.locals.params;
    const [row] = await db.select({ id: plans.id }).from(plans).where(and(eq(plans.id, planId), eq(plans.sequenceId, sequenceId)));
    if (!row) throw notFound('Plan');
    const reason = `Cancelled by ${user.name}.`;
    if (!(await cancelPlan(ctx, planId, reason))) throw conflict('The plan has already ended; there is nothing to cancel.', 'not_open');
    await recordAudit(db, { actorId: user.id, action: 'plan.cancel', objectType: 'plan', objectId: planId, detail: { sequenceId, reason } });
    const [plan] = await db.select().from(plans).where(eq(plans.id, planId));
    res.json(planView(plan));
  });

  return router;
}
