/**
 * Builds the rehearsal view's motion for a version from what was verified and stored with it: the
 * report's samples (no new simulation, so a later engine cannot change what trainees rehearse), the
 * bound profile version's body, the step timeline, cues and target.
 */
import type { MotionResponse } from '../../shared/contracts/motion.ts';
import { dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { HttpError } from '../http/http-error.ts';
import { versionStepList } from './step-timeline.ts';
import { type StoredVersion, UnreadableStoredValue } from './stored-version.ts';
import { targetAttitude } from './target-attitude.ts';
import { resampleVerified, UnreadableResultError, verifiedSamples } from './verified-samples.ts';

/** The motion fields that depend on the request, not on the stored version. */
export type StoredMotion = Omit<MotionResponse, 'status' | 'runningEngineVersion' | 'verifiedByOtherEngine'>;

/**
 * The motion of one version from its stored verification, at `rateHz` samples per second (absent:
 * the verified samples as stored; another rate: derived from them). Throws HttpError 409 when the
 * version has no verification yet, 500 naming the version when its samples cannot be read back.
 */
export function buildMotion(v: StoredVersion, rateHz: number | undefined): StoredMotion {
  const report = v.report;
  if (report === null) throw new HttpError(409, 'not_verified', `Version ${v.version} of ${v.sequenceName} has no verification result to play.`);
  let samples;
  try {
    samples = verifiedSamples(report, dofInfoFromBody(v.body).map((d) => d.name));
  } catch (err) {
    if (err instanceof UnreadableResultError) throw new UnreadableStoredValue(`sequence version ${v.id}`, 'verification report', err.message);
    throw err;
  }
  if (rateHz !== undefined) samples = resampleVerified(samples, rateHz);
  return {
    versionId: v.id, sequenceId: v.sequenceId, sequenceName: v.sequenceName, version: v.version,
    crewMemberName: v.crewMemberName, body: v.body, engineVersion: report.engineVersion, verifiedAt: report.computedAt,
    duration: report.durationS, samples, steps: versionStepList(v),
    target: v.target, targetAttitude: targetAttitude(v.target),
    final: report.final,
  };
}
