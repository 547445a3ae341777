/**
 * Builds the rehearsal view's motion for a version: validates the stored body and compiled
 * sequence, simulates them with the engine, and adds the step timeline, cues and target.
 */
import type { MotionResponse } from '../../shared/contracts/motion.ts';
import { validateBody } from '../../shared/contracts/body.ts';
import { validateSequence } from '../../shared/contracts/sequence.ts';
import { simulate } from '../engine/simulate.ts';
import { HttpError } from '../http/http-error.ts';
import { compiledParts } from './compiled-sequence.ts';
import { stepTimeline } from './step-timeline.ts';
import { targetAttitude } from './target-attitude.ts';
import type { LoadedVersion } from './version-access.ts';

/** A stored version whose body or sequence no longer passes the contracts (422 naming the first issue). */
function unprocessable(what: string, message: string): HttpError {
  return new HttpError(422, 'motion_invalid', `This version's ${what} cannot be simulated: ${message}`);
}

/** The motion of one version at `rateHz` samples per second. Throws HttpError 422 on invalid stored data. */
export function buildMotion(v: LoadedVersion, rateHz: number): MotionResponse {
  const body = validateBody(v.body);
  if (!body.ok) throw unprocessable('profile body', body.issues[0].message);
  const parts = compiledParts(v.compiled);
  const sequence = validateSequence(parts.sequence, body.value);
  if (!sequence.ok) throw unprocessable('compiled sequence', sequence.issues[0].message);
  const result = simulate(body.value, sequence.value, { rateHz });
  const target = targetAttitude(v.target);
  return {
    versionId: v.id, sequenceId: v.sequenceId, sequenceName: v.sequenceName, version: v.version, status: v.status,
    crewMemberName: v.crewMemberName, body: body.value, engineVersion: result.engineVersion, duration: result.duration,
    samples: result.samples, steps: stepTimeline(sequence.value, parts.cues),
    target: v.target, targetAttitude: target ?? result.final.attitude, targetSource: target ? 'target' : 'final',
    final: result.final,
  };
}
