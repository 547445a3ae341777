/**
 * Verification: runs the engine (in the worker pool, off the request thread) on a compiled
 * sequence for a profile version's body and builds the report. Used when a version is saved and by
 * the re-verification job.
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { SequenceTarget, StepRotation, VerificationReport } from '../../shared/contracts/maneuver.ts';
import { type Sequence, stepDuration } from '../../shared/contracts/sequence.ts';
import { SIMULATE_LIMITS } from '../../shared/contracts/simulate-request.ts';
import type { Quat } from '../../shared/math/quaternion.ts';
import { dofInfoFromBody, type StepOrigin } from '../../shared/primitives/compile-primitives.ts';
import type { SimulationPool } from '../engine/pool/simulation-pool.ts';
import { badRequest,HttpError } from '../http/http-error.ts';
import { buildReport } from './build-report.ts';
import { inputsHash } from './inputs-hash.ts';
import { stepRotations } from './step-rotations.ts';

/** Sample rate of the report's plot series, Hz (modest: the report is stored with the version). */
export const REPORT_RATE_HZ = 20;

/** What to verify. */
export interface VerifyInputs {
  body: Body;
  sequence: Sequence;
  target: SequenceTarget;
  profileVersionId: string;
  /** The pool to run on: the app context's product pool (`ctx.simulation.product`). */
  pool: SimulationPool;
  /** Which primitive each compiled step came from: gives the report's per-step rotations (none without it). */
  stepMap?: readonly StepOrigin[];
}

/** Runs the engine and returns the report; contract problems become a 400 naming the step. */
export async function verifySequence({ body, sequence, target, profileVersionId, pool, stepMap }: VerifyInputs): Promise<VerificationReport> {
  const duration = sequence.steps.reduce((t, s) => t + stepDuration(s), 0);
  if (duration > SIMULATE_LIMITS.maxDurationS) {
    throw badRequest(`primitives: the sequence lasts ${duration.toFixed(1)} s; the limit is ${SIMULATE_LIMITS.maxDurationS} s`, 'primitives');
  }
  const engine = pool;
  let reply;
  let steps: StepRotation[] | undefined;
  try {
    reply = await engine.run(body, sequence, { rateHz: REPORT_RATE_HZ });
    if (reply.kind === 'result' && stepMap) {
      // Each composer step on its own, in search mode at the report's tolerance (pool threads, not this one).
      const rotationOf = async (part: Sequence): Promise<Quat> => {
        const r = await engine.run(body, part, { finalOnly: true });
        if (r.kind !== 'result') throw new Error(`a step could not be simulated on its own: ${r.issues[0]?.message ?? r.kind}`);
        const a = r.result.final.attitude;
        return [a.w, a.x, a.y, a.z];
      };
      steps = await stepRotations(sequence, stepMap, reply.result.samples.frames, rotationOf);
    }
  } catch (err) {
    throw new HttpError(503, 'verification_failed', `verification could not run: ${err instanceof Error ? err.message : String(err)}`);
  }
  if (reply.kind === 'invalid') {
    const issue = reply.issues[0];
    throw badRequest(`${reply.which}: ${issue.message}`, reply.which === 'sequence' ? 'primitives' : 'profile');
  }
  return buildReport({ result: reply.result, target, profileVersionId, dofs: dofInfoFromBody(body), inputsHash: inputsHash(body, sequence), stepRotations: steps });
}
