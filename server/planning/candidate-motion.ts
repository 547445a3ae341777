/**
 * The 3D preview of a planner suggestion before it is used: the candidate's compiled steps run on
 * the plan's profile version body (the body the plan verified it on) in the product pool, at the
 * report's sample rate, with the composer's step timeline and cues. Nothing is stored: a candidate
 * and a profile version never change, so the route caches the built motion in memory.
 */
import { and, eq } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { crewMembers, plans, profileVersions, sequences } from '../../db/schema/index.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import type { CandidateMotionResponse } from '../../shared/contracts/motion.ts';
import { planCandidateSchema } from '../../shared/contracts/plan.ts';
import { validateSequence } from '../../shared/contracts/sequence.ts';
import type { SimulationPool } from '../engine/pool/simulation-pool.ts';
import { conflict, HttpError, notFound } from '../http/http-error.ts';
import { primitiveStepMap, stepTimeline } from '../maneuvers/step-timeline.ts';
import { parseStored, readProfileBody } from '../maneuvers/stored-version.ts';
import { targetAttitude } from '../maneuvers/target-attitude.ts';
import { REPORT_RATE_HZ } from '../maneuvers/verify-sequence.ts';

/** Which candidate. */
export interface CandidateRef {
  sequenceId: string;
  planId: string;
  rank: number;
}

/**
 * Builds the candidate's motion. 404 for an unknown plan or rank, 409 `plan_not_done` while the plan
 * has no candidates, 500 naming the plan when a stored value does not parse (the fault is ours), 503
 * when the engine could not run.
 */
export async function buildCandidateMotion(db: Database, pool: SimulationPool, engineVersion: string, ref: CandidateRef): Promise<CandidateMotionResponse> {
  const [row] = await db
    .select({ plan: plans, sequenceName: sequences.name, crewMemberName: crewMembers.name, body: profileVersions.body })
    .from(plans)
    .innerJoin(sequences, eq(sequences.id, plans.sequenceId))
    .innerJoin(crewMembers, eq(crewMembers.id, sequences.crewMemberId))
    .innerJoin(profileVersions, eq(profileVersions.id, plans.profileVersionId))
    .where(and(eq(plans.id, ref.planId), eq(plans.sequenceId, ref.sequenceId)));
  if (!row) throw notFound('Plan');
  if (row.plan.state !== 'done') throw conflict(`The plan is ${row.plan.state}: there are no suggestions to preview yet.`, 'plan_not_done');
  const stored = (row.plan.candidates ?? []).find((c) => c.rank === ref.rank);
  if (!stored) throw notFound(`Suggestion ${ref.rank}`);
  const planRow = `plan ${ref.planId}`;
  const candidate = parseStored(planCandidateSchema, stored, planRow, `suggestion ${ref.rank}`);
  const target = parseStored(sequenceTargetSchema, row.plan.target, planRow, 'target');
  const body = readProfileBody(row.plan.profileVersionId, row.body);
  const sequence = validateSequence(candidate.sequence, body);
  if (!sequence.ok) throw unsimulatable(planRow, ref.rank, sequence.issues[0].message);

  let reply;
  try {
    reply = await pool.run(body, sequence.value, { rateHz: REPORT_RATE_HZ });
  } catch (err) {
    throw new HttpError(503, 'simulation_failed', `The suggestion could not be simulated: ${err instanceof Error ? err.message : String(err)}`);
  }
  if (reply.kind === 'invalid') throw unsimulatable(planRow, ref.rank, reply.issues[0]?.message ?? `invalid ${reply.which}`);
  const result = reply.result;
  const { primitives } = candidate;
  const stepMap = primitiveStepMap(primitives, body, sequence.value) ?? [];
  return {
    planId: ref.planId, rank: ref.rank, sequenceId: ref.sequenceId, sequenceName: row.sequenceName, crewMemberName: row.crewMemberName,
    body, engineVersion: result.engineVersion, runningEngineVersion: engineVersion, verifiedByOtherEngine: false,
    computedAt: new Date().toISOString(), duration: result.duration, samples: result.samples,
    steps: stepTimeline(sequence.value, [], { primitives, stepMap }),
    target, targetAttitude: targetAttitude(target),
    final: result.final,
  };
}

/** Stored steps the engine refuses for the plan's body: a server fault naming the plan and suggestion. */
function unsimulatable(planRow: string, rank: number, message: string): HttpError {
  return new HttpError(500, 'stored_value_unreadable', `The stored suggestion ${rank} of ${planRow} cannot be simulated (${message}).`);
}
