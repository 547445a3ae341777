/**
 * Where a sequence's rotation comes from: the rotation of each composer step (its lead-in
 * included) and, for each sweep of whole cycles inside it, the rotation of one cycle.
 *
 * With zero angular momentum the attitude change over a stretch of motion depends only on the
 * shape path and the posture it starts from, so each step is simulated on its own from the joint
 * angles the sequence reaches before it; the final attitude is then the ordered product of the
 * steps' rotations (earlier steps on the left), and n cycles of a sweep rotate by the n-th power
 * of one cycle. Both are checked against the full run in tests/maneuvers/step-rotations.test.ts.
 */
import type { RelativeRotation, StepRotation } from '../../shared/contracts/maneuver.ts';
import type { Sequence, Step } from '../../shared/contracts/sequence.ts';
import { quatToYpr } from '../../shared/math/euler-zyx.ts';
import { type Quat,quatAngleBetween, quatCanonical, quatToAxisAngle } from '../../shared/math/quaternion.ts';
import type { StepOrigin } from '../../shared/primitives/compile-primitives.ts';
import { anglesAfter } from '../planning/execution-pieces.ts';

const DEG = 180 / Math.PI;

/** Simulates a sequence from its start and returns the final attitude [w,x,y,z] (identity at t = 0). */
export type RotationOf = (sequence: Sequence) => Promise<Quat>;

/** One attitude sample of the full run (for each step's path). */
interface Frame { t: number; attitude: { w: number; x: number; y: number; z: number } }

/** A rotation quaternion as the report shows it. */
export function relativeRotation(q: Quat): RelativeRotation {
  const c = quatCanonical([q[0], q[1], q[2], q[3]]);
  const { angle, axis } = quatToAxisAngle(c);
  const ypr = quatToYpr(c);
  return {
    quat: { w: c[0], x: c[1], y: c[2], z: c[3] },
    angleDeg: angle * DEG,
    axis,
    yprDeg: { yaw: ypr.yaw * DEG, pitch: ypr.pitch * DEG, roll: ypr.roll * DEG },
  };
}

/** Whole cycles of a harmonic step (null when it has a fractional cycle or none). */
function wholeCycles(step: Step): number | null {
  if (step.kind !== 'harmonic') return null;
  const n = Math.round(step.cycles);
  return n >= 1 && Math.abs(step.cycles - n) < 1e-9 ? n : null;
}

/** Rotation travelled between the samples whose chord midpoints fall in [from, to), degrees. */
function pathBetween(frames: readonly Frame[], from: number, to: number, last: boolean): number {
  let sum = 0;
  for (let k = 1; k < frames.length; k++) {
    const mid = (frames[k - 1].t + frames[k].t) / 2;
    if (mid < from || (last ? mid > to : mid >= to)) continue;
    const a = frames[k - 1].attitude, b = frames[k].attitude;
    sum += quatAngleBetween([a.w, a.x, a.y, a.z], [b.w, b.x, b.y, b.z]);
  }
  return sum * DEG;
}

/**
 * One entry per composer step (grouped by `stepMap[i].primitive`, in order). `frames` are the full
 * run's attitude samples, for each step's share of the path. Empty when there is no step map.
 */
export async function stepRotations(sequence: Sequence, stepMap: readonly StepOrigin[], frames: readonly Frame[], rotationOf: RotationOf): Promise<StepRotation[]> {
  if (!stepMap.length || stepMap.length !== sequence.steps.length) return [];
  // Composer steps: runs of compiled steps from the same primitive.
  const groups: { step: number; from: number; to: number }[] = [];
  stepMap.forEach((origin, i) => {
    const g = groups[groups.length - 1];
    if (g && g.step === origin.primitive) g.to = i + 1;
    else groups.push({ step: origin.primitive, from: i, to: i + 1 });
  });
  // Joint angles at the start of every compiled step.
  const startAngles: Record<string, number>[] = [];
  let angles: Record<string, number> = { ...sequence.start };
  for (const s of sequence.steps) {
    startAngles.push(angles);
    angles = anglesAfter(angles, s);
  }
  return Promise.all(groups.map(async (g, gi) => {
    const steps = sequence.steps.slice(g.from, g.to);
    const sweeps = await Promise.all(steps.flatMap((s, k) => {
      const n = wholeCycles(s);
      if (n === null || s.kind !== 'harmonic') return [];
      const i = g.from + k;
      return [rotationOf({ start: startAngles[i], steps: [{ ...s, cycles: 1 }] })
        .then((q) => ({ compiledStep: i, cycles: n, periodS: s.period, perCycle: relativeRotation(q) }))];
    }));
    const rotation = relativeRotation(await rotationOf({ start: startAngles[g.from], steps }));
    const startS = stepMap[g.from].startS, endS = stepMap[g.to - 1].endS;
    return { step: g.step, startS, endS, rotation, pathDeg: pathBetween(frames, startS, endS, gi === groups.length - 1), sweeps };
  }));
}
