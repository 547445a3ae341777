/**
 * /api/sequences/:sequenceId/plans: the maneuver planner ("Suggest steps"). POST queues a planning
 * job on the crew member's current profile body and answers 202 { planId }; GET returns the plan's
 * state, progress and ranked candidates (shapes in shared/contracts/plan.ts).
 */
import { and, eq } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { plans, sequences, type PlanRow } from '../../db/schema/index.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { planRequestSchema, type Plan, type PlanCandidate, type PlanCreated } from '../../shared/contracts/plan.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { forbidden, notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';
import { currentProfile } from '../maneuvers/current-profile.ts';
import { requireAuthor } from '../maneuvers/maneuver-access.ts';

const uuid = z.uuid('Not a valid id.');
const sequenceParams = z.object({ sequenceId: uuid });
const planParams = z.object({ sequenceId: uuid, planId: uuid });

/** The API shape of a stored plan. */
export function planView(row: PlanRow): Plan {
  const iso = (d: Date | null) => (d ? d.toISOString() : null);
  return {
    id: row.id,
    sequenceId: row.sequenceId,
    profileVersionId: row.profileVersionId,
    state: row.state as Plan['state'],
    progress: row.progress,
    progressNote: row.progressNote,
    settings: planRequestSchema.parse(row.settings),
    candidates: (row.candidates as PlanCandidate[] | null) ?? [],
    error: row.error,
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
    const { sequenceId } = res.locals.params as z.infer<typeof sequenceParams>;
    const settings = req.body as z.infer<typeof planRequestSchema>;
    const [sequence] = await db.select().from(sequences).where(eq(sequences.id, sequenceId));
    if (!sequence) throw notFound('Sequence');
    const profile = await currentProfile(db, sequence.crewMemberId);
    const target = sequenceTargetSchema.parse(sequence.target);
    const id = await db.transaction(async (tx) => {
      const [row] = await tx.insert(plans).values({ sequenceId, profileVersionId: profile.id, requestedBy: user.id, target, settings }).returning({ id: plans.id });
      await recordAudit(tx, { actorId: user.id, action: 'plan.request', objectType: 'plan', objectId: row.id, detail: { sequenceId, profileVersionId: profile.id, settings } });
      return row.id;
    });
    // Without a queue in this process the row stays queued; a queue started later picks it up.
    if (ctx.jobs?.enqueuePlan) await ctx.jobs.enqueuePlan(id);
    res.status(202).json({ planId: id } satisfies PlanCreated);
  });

  router.get('/:planId', validate({ params: planParams }), async (req, res) => {
    const { sequenceId, planId } = res.locals.params as z.infer<typeof planParams>;
    if (req.user!.role === 'trainee') throw forbidden('Plans are for planners, reviewers and admins.');
    const [row] = await db.select({ plan: plans }).from(plans)
      .innerJoin(sequences, eq(sequences.id, plans.sequenceId))
      .where(and(eq(plans.id, planId), eq(plans.sequenceId, sequenceId)));
    if (!row) throw notFound('Plan');
    res.json(planView(row.plan));
  });

  return router;
}
