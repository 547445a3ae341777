/**
 * Builds the rehearsal view's motion for a version: validates the stored body and compiled
 * sequence, simulates them with the engine, and adds the step timeline, cues and target.
 */
import type { MotionResponse } from '../../shared/contracts/motion.ts';
import { validateBody } from '../../shared/contracts/body.ts';
import { validateSequence } from '../../shared/contracts/sequence.ts';
import { type SimulationPool, SimulationTimeoutError } from '../engine/pool/simulation-pool.ts';
import { HttpError } from '../http/http-error.ts';
import { compiledParts } from './compiled-sequence.ts';
import { primitiveCues, primitiveStepMap } from './primitive-cues.ts';
import { stepTimeline } from './step-timeline.ts';
import { storedCompiled } from '../maneuvers/stored-compiled.ts';
import { targetAttitude } from './target-attitude.ts';
import type { LoadedVersion } from './version-access.ts';

/** A stored version whose body or sequence no longer passes the contracts (422 naming the first issue). */
function unprocessable(what: string, message: string): HttpError {
  return new HttpError(422, 'motion_invalid', `This version's ${what} cannot be simulated: ${message}`);
}

/**
 * The motion of one version at `rateHz` samples per second, simulated in the engine's worker pool.
 * Throws HttpError 422 on invalid stored data, 503 when the simulation exceeds its time budget.
 */
export async function buildMotion(v: LoadedVersion, rateHz: number, pool: SimulationPool): Promise<MotionResponse> {
  const body = validateBody(v.body);
  if (!body.ok) throw unprocessable('profile body', body.issues[0].message);
  const parts = compiledParts(v.compiled);
  const sequence = validateSequence(parts.sequence, body.value);
  if (!sequence.ok) throw unprocessable('compiled sequence', sequence.issues[0].message);
  let reply;
  try {
    reply = await pool.run(body.value, sequence.value, { rateHz });
  } catch (err) {
    if (err instanceof SimulationTimeoutError) throw new HttpError(503, 'simulation_timeout', err.message);
    throw err;
  }
  if (reply.kind === 'invalid') throw unprocessable(reply.which === 'body' ? 'profile body' : 'compiled sequence', reply.issues[0].message);
  const result = reply.result;
  const target = targetAttitude(v.target);
  const storedStepMap = storedCompiled(v.compiled).stepMap;
  return {
    versionId: v.id, sequenceId: v.sequenceId, sequenceName: v.sequenceName, version: v.version, status: v.status,
    crewMemberName: v.crewMemberName, body: body.value, engineVersion: result.engineVersion, duration: result.duration,
    samples: result.samples, steps: stepTimeline(sequence.value, parts.cues.length ? parts.cues : primitiveCues(v.primitives, body.value, sequence.value), {
      primitives: v.primitives,
      // versions saved before the step map was stored get it by recompiling their primitives
      stepMap: storedStepMap.length ? storedStepMap : (primitiveStepMap(v.primitives, body.value, sequence.value) ?? []),
    }),
    target: v.target, targetAttitude: target ?? result.final.attitude, targetSource: target ? 'target' : 'final',
    final: result.final,
  };
}
