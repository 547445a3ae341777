/**
 * Rotation travelled by the body: ∫|ω| dt, approximated by the sum of the angles between
 * successive attitude samples (chords of the attitude's path on the unit-quaternion sphere; the
 * sum approaches the integral from below as the sample rate grows, with an error of second order
 * in the sample interval for smooth motion).
 */
import { quatAngleBetween } from './quaternion.ts';

/** Attitude sample {w,x,y,z}. */
interface AttitudeSample { attitude: { w: number; x: number; y: number; z: number } }

/** Sum of angles between successive samples, degrees. */
export function pathDegFromSamples(frames: readonly AttitudeSample[]): number {
  let sum = 0;
  for (let k = 1; k < frames.length; k++) {
    const a = frames[k - 1].attitude, b = frames[k].attitude;
    sum += quatAngleBetween([a.w, a.x, a.y, a.z], [b.w, b.x, b.y, b.z]);
  }
  return (sum * 180) / Math.PI;
}
