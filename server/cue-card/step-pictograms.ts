/**
 * Stick-figure pictograms of each step for the printed cue card, drawn from the body's own forward
 * kinematics: the pose at each end of the step's widest joint swing (from the verified report's joint
 * series), projected onto whichever of the front, side or top views shows the two poses apart best.
 * Pure: lines in metres in the view plane; the renderer scales them to its box.
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { VerificationReport } from '../../shared/contracts/maneuver.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';
import { createBodyPose, forwardKinematics } from '../../shared/kinematics/forward-kinematics.ts';

/** A line in the view plane, metres: x to the right of the page, y up the page. */
export type PictogramLine = [number, number, number, number];

/** The view a pictogram is drawn from (x anterior, y to the person's left, z toward the head). */
export type PictogramView = 'front' | 'side' | 'above';

/** One step's pictogram: one pose (a still step) or the two ends of its widest swing. */
export interface StepPictogram {
  view: PictogramView;
  /** Stick figure at each extreme, first the swing's low end. */
  poses: PictogramLine[][];
  /** The head of each pose as a circle [x, y, radius] in the view plane (null for a body without a head segment). */
  heads: ([number, number, number] | null)[];
  /** The dof whose swing was drawn, or null for a still step. */
  dof: string | null;
}

/** Below this swing (degrees) a step counts as still. */
const STILL_DEG = 1;

/** View-plane coordinates of a root-frame point. Front: seen from ahead; side: from the right; above: from overhead, chest up the page. */
const PROJECT: Record<PictogramView, (x: number, y: number, z: number) => [number, number]> = {
  front: (_x, y, z) => [y, z],
  side: (x, _y, z) => [x, z],
  above: (x, y) => [-y, x],
};

/** Root-frame points of the stick figure: each segment's joint centre joined to its parent's, leaves drawn to twice their CoM. */
function stickPoints(body: Body, jointsDeg: Record<string, number>): { from: number[]; to: number[] }[] {
  return stickFigure(body, jointsDeg).lines;
}

/** The stick figure's lines (as {@link stickPoints}) and its head as a sphere (centre at the head's CoM), root frame. */
function stickFigure(body: Body, jointsDeg: Record<string, number>): { lines: { from: number[]; to: number[] }[]; head: { centre: number[]; radius: number } | null } {
  const model = compileBody(body);
  const pose = createBodyPose(model);
  const q = new Float64Array(model.dofCount);
  for (const [name, k] of model.dofIndex) q[k] = ((jointsDeg[name] ?? 0) * Math.PI) / 180;
  forwardKinematics(model, q, pose);
  const hasChild = new Uint8Array(model.segmentCount);
  for (let i = 0; i < model.segmentCount; i++) if (model.parent[i] >= 0) hasChild[model.parent[i]] = 1;
  const at = (arr: Float64Array, i: number) => [arr[3 * i], arr[3 * i + 1], arr[3 * i + 2]];
  const out: { from: number[]; to: number[] }[] = [];
  for (let i = 0; i < model.segmentCount; i++) {
    const p = model.parent[i];
    if (p >= 0) out.push({ from: at(pose.pos, p), to: at(pose.pos, i) });
  }
  const h = model.segmentNames.findIndex((name) => name.startsWith('head'));
  for (let i = 0; i < model.segmentCount; i++) {
    // The head is drawn as a circle instead.
    if (!hasChild[i] && i !== h) {
      // A leaf (head, hand, foot): its far end is about twice its CoM from its joint.
      const o = at(pose.pos, i);
      const c = at(pose.comPos, i);
      out.push({ from: o, to: [2 * c[0] - o[0], 2 * c[1] - o[1], 2 * c[2] - o[2]] });
    }
  }
  const head = h >= 0 ? { centre: at(pose.comPos, h), radius: 0.8 * Math.hypot(...at(pose.comPos, h).map((c, j) => c - at(pose.pos, h)[j])) } : null;
  return { lines: out, head };
}

/** The stick figure for given joint angles (degrees) projected onto one view: parent-to-child lines first in segment order, then leaf ends. */
export function projectedFigure(body: Body, jointsDeg: Record<string, number>, view: PictogramView): PictogramLine[] {
  return stickPoints(body, jointsDeg).map(({ from, to }) => [...PROJECT[view](from[0], from[1], from[2]), ...PROJECT[view](to[0], to[1], to[2])] as PictogramLine);
}

/** Joint angles at series sample k: the moving dofs from the series, the others as they end (they never move). */
function anglesAt(report: VerificationReport, k: number): Record<string, number> {
  const out: Record<string, number> = { ...report.final.jointsDeg };
  for (const [dof, values] of Object.entries(report.series.jointsDeg)) out[dof] = values[k];
  return out;
}

/** Pictograms for steps given by their time windows (seconds from the start), from the verified report. */
export function stepPictograms(body: Body, report: VerificationReport, steps: readonly { startS: number; durationS: number }[]): StepPictogram[] {
  const { t, jointsDeg } = report.series;
  return steps.map(({ startS, durationS }) => {
    const inStep: number[] = [];
    for (let k = 0; k < t.length; k++) if (t[k] >= startS - 1e-9 && t[k] <= startS + durationS + 1e-9) inStep.push(k);
    if (!inStep.length) inStep.push(nearest(t, startS));
    // The widest swing in the step decides the two poses drawn.
    let best: { dof: string; lo: number; hi: number; range: number } | null = null;
    for (const [dof, values] of Object.entries(jointsDeg)) {
      let lo = inStep[0];
      let hi = inStep[0];
      for (const k of inStep) {
        if (values[k] < values[lo]) lo = k;
        if (values[k] > values[hi]) hi = k;
      }
      const range = values[hi] - values[lo];
      if (range > STILL_DEG && (!best || range > best.range)) best = { dof, lo, hi, range };
    }
    const samples = best ? [best.lo, best.hi] : [inStep[Math.floor(inStep.length / 2)]];
    const figures = samples.map((k) => stickFigure(body, anglesAt(report, k)));
    const view = bestView(figures.map((f) => f.lines));
    const poses = figures.map((fig) => fig.lines.map(({ from, to }) => [...PROJECT[view](from[0], from[1], from[2]), ...PROJECT[view](to[0], to[1], to[2])] as PictogramLine));
    const heads = figures.map(({ head }) => (head ? [...PROJECT[view](head.centre[0], head.centre[1], head.centre[2]), head.radius] as [number, number, number] : null));
    return { view, poses, heads, dof: best?.dof ?? null };
  });
}

/** Index of the sample nearest to time `s`. */
function nearest(t: readonly number[], s: number): number {
  let k = 0;
  for (let i = 1; i < t.length; i++) if (Math.abs(t[i] - s) < Math.abs(t[k] - s)) k = i;
  return k;
}

/** The view in which the two figures' points move furthest apart (front for a still step or a tie). */
function bestView(figures: { from: number[]; to: number[] }[][]): PictogramView {
  if (figures.length < 2) return 'front';
  let best: PictogramView = 'front';
  let bestSpread = -1;
  for (const view of ['front', 'side', 'above'] as const) {
    let spread = 0;
    figures[0].forEach((a, i) => {
      const b = figures[1][i];
      const [ax, ay] = PROJECT[view](a.to[0], a.to[1], a.to[2]);
      const [bx, by] = PROJECT[view](b.to[0], b.to[1], b.to[2]);
      spread += (ax - bx) ** 2 + (ay - by) ** 2;
    });
    // Prefer the front view unless another shows clearly more (10 %).
    if (spread > bestSpread * 1.1) {
      best = view;
      bestSpread = spread;
    }
  }
  return best;
}
