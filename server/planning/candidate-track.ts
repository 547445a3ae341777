/**
 * The compact attitude track stored with each verified candidate (shared/contracts/plan.ts
 * `candidateTrackSchema`): yaw/pitch/roll against time from the verification samples, thinned to a
 * fixed number of points so a plan of several candidates stays small to poll and store.
 */
import { CANDIDATE_TRACK_POINTS, type CandidateTrack } from '../../shared/contracts/plan.ts';
import type { SimulationResult } from '../../shared/contracts/result.ts';
import { quatToYpr } from '../../shared/math/euler-zyx.ts';
import { unwrapDeg } from '../maneuvers/build-report.ts';

const DEG = 180 / Math.PI;
const round = (x: number) => Math.round(x * 100) / 100;

/**
 * Every k-th sample (k the smallest whole stride that keeps at most `maxPoints`) plus the last one,
 * so the track ends at the final attitude. Angles are unwrapped over all samples before thinning,
 * so a jump across ±180° between two kept points is never mistaken for a turn.
 */
export function candidateTrack(frames: SimulationResult['samples']['frames'], maxPoints = CANDIDATE_TRACK_POINTS): CandidateTrack {
  if (maxPoints < 2) throw new RangeError('maxPoints must be at least 2');
  const ypr = frames.map((f) => quatToYpr([f.attitude.w, f.attitude.x, f.attitude.y, f.attitude.z]));
  const yaw = unwrapDeg(ypr.map((a) => a.yaw * DEG));
  const pitch = ypr.map((a) => a.pitch * DEG);
  const roll = unwrapDeg(ypr.map((a) => a.roll * DEG));
  const stride = Math.max(1, Math.ceil((frames.length - 1) / (maxPoints - 1)));
  const keep: number[] = [];
  for (let i = 0; i < frames.length; i += stride) keep.push(i);
  if (frames.length && keep[keep.length - 1] !== frames.length - 1) keep.push(frames.length - 1);
  return {
    t: keep.map((i) => round(frames[i].t)),
    yawDeg: keep.map((i) => round(yaw[i])),
    pitchDeg: keep.map((i) => round(pitch[i])),
    rollDeg: keep.map((i) => round(roll[i])),
  };
}
