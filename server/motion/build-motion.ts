/**
 * Builds the rehearsal view's motion for a version from what was verified and stored with it: the
 * report's samples (no new simulation, so a later engine cannot change what trainees rehearse), the
 * bound profile version's body, the step timeline, cues and target.
 */
import { validateBody } from '../../shared/contracts/body.ts';
import { verificationReportSchema } from '../../shared/contracts/maneuver.ts';
import type { MotionResponse } from '../../shared/contracts/motion.ts';
import { validateSequence } from '../../shared/contracts/sequence.ts';
import { dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { HttpError } from '../http/http-error.ts';
import { storedCompiled } from '../maneuvers/stored-compiled.ts';
import { compiledParts } from './compiled-sequence.ts';
import { primitiveCues, primitiveStepMap } from './primitive-cues.ts';
import { stepTimeline } from './step-timeline.ts';
import { targetAttitude } from './target-attitude.ts';
import { resampleVerified, UnreadableResultError, verifiedSamples } from './verified-samples.ts';
import type { LoadedVersion } from './version-access.ts';

/** A stored version that can no longer be read (422 naming the first issue). */
function unprocessable(v: LoadedVersion, what: string, message: string): HttpError {
  return new HttpError(422, 'motion_invalid', `Version ${v.version} of ${v.sequenceName}: its ${what} cannot be read: ${message}`);
}

/** The motion fields that depend on the request, not on the stored version. */
export type StoredMotion = Omit<MotionResponse, 'status' | 'runningEngineVersion' | 'verifiedByOtherEngine'>;

/**
 * The motion of one version from its stored verification, at `rateHz` samples per second (absent:
 * the verified samples as stored; another rate: derived from them). Throws HttpError 409 when the
 * version has no verification yet, 422 when a stored value cannot be read.
 */
export function buildMotion(v: LoadedVersion, rateHz: number | undefined): StoredMotion {
  if (v.report === null) throw new HttpError(409, 'not_verified', `Version ${v.version} of ${v.sequenceName} has no verification result to play.`);
  const report = verificationReportSchema.safeParse(v.report);
  if (!report.success) throw unprocessable(v, 'verification report', `${report.error.issues[0].path.join('.')}: ${report.error.issues[0].message}`);
  const body = validateBody(v.body);
  if (!body.ok) throw unprocessable(v, 'profile body', body.issues[0].message);
  const parts = compiledParts(v.compiled);
  const sequence = validateSequence(parts.sequence, body.value);
  if (!sequence.ok) throw unprocessable(v, 'compiled sequence', sequence.issues[0].message);
  let samples;
  try {
    samples = verifiedSamples(report.data, dofInfoFromBody(body.value).map((d) => d.name));
  } catch (err) {
    if (err instanceof UnreadableResultError) throw unprocessable(v, 'verification report', err.message);
    throw err;
  }
  if (rateHz !== undefined) samples = resampleVerified(samples, rateHz);
  const target = targetAttitude(v.target);
  const storedStepMap = storedCompiled(v.compiled).stepMap;
  return {
    versionId: v.id, sequenceId: v.sequenceId, sequenceName: v.sequenceName, version: v.version,
    crewMemberName: v.crewMemberName, body: body.value, engineVersion: report.data.engineVersion, verifiedAt: report.data.computedAt,
    duration: report.data.durationS,
    samples, steps: stepTimeline(sequence.value, parts.cues.length ? parts.cues : primitiveCues(v.primitives, body.value, sequence.value), {
      primitives: v.primitives,
      // versions saved before the step map was stored get it by recompiling their primitives
      stepMap: storedStepMap.length ? storedStepMap : (primitiveStepMap(v.primitives, body.value, sequence.value) ?? []),
    }),
    target: v.target, targetAttitude: target ?? report.data.final.attitude, targetSource: target ? 'target' : 'final',
    final: report.data.final,
  };
}
