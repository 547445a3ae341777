/**
 * A BVH file and a mapping → a uniform-rate track: the mapped dof angles per file frame, resampled
 * through the natural cubic spline when another rate is asked for.
 */
import type { BvhMapping } from '../../shared/contracts/recording.ts';
import { naturalCubicSpline, resampleUniform, uniformKnots } from '../../shared/math/natural-cubic-spline.ts';
import type { BvhMotion } from './bvh-file.ts';
import { applyBvhMapping, mappingAssumptions, mappingIssues } from './bvh-mapping.ts';

/** The track a mapping gives, or the mapping's problems. */
export function bvhTrack(motion: BvhMotion, mapping: BvhMapping, rateHz?: number):
  { ok: true; rateHz: number; dofs: string[]; frames: number[][]; assumptions: string[] } | { ok: false; issues: string[] } {
  const issues = mappingIssues(mapping, motion);
  if (issues.length) return { ok: false, issues };
  const { dofs, frames } = applyBvhMapping(motion, mapping);
  const assumptions = mappingAssumptions(mapping, motion);
  const fileRate = 1 / motion.frameTime;
  if (rateHz === undefined || Math.abs(rateHz - fileRate) < 1e-9 * fileRate) return { ok: true, rateHz: fileRate, dofs, frames, assumptions };
  const knots = uniformKnots(frames.length, fileRate);
  const cols = dofs.map((_, j) => resampleUniform(naturalCubicSpline(knots, frames.map((f) => f[j])), rateHz));
  assumptions.push(`Resampled from ${fileRate.toFixed(3)} Hz to ${rateHz} Hz through each dof's natural cubic spline.`);
  return { ok: true, rateHz, dofs, frames: cols[0].map((_, k) => cols.map((c) => c[k])), assumptions };
}
