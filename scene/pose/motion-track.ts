/**
 * The engine's samples as flat typed arrays for the render loop: times, attitudes (sign-continuous,
 * so neighbouring samples slerp the short way) and joint angles in the body model's dof order, radians.
 */
import type { BodyModel } from '@/shared/kinematics/body-model';

/** The samples part of the motion response: dof names and frames (t s, attitude {w,x,y,z}, jointsDeg °). */
export interface SampleFrames {
  dofs: readonly string[];
  frames: readonly { t: number; attitude: { w: number; x: number; y: number; z: number }; jointsDeg: readonly number[] }[];
}

/** Read-only track; index k is sample k. */
export interface MotionTrack {
  /** Number of samples (≥ 1). */
  readonly count: number;
  /** Number of dofs of the body model. */
  readonly dofCount: number;
  /** Sample times, s, increasing. */
  readonly times: Float64Array;
  /** Attitude per sample [w,x,y,z], body → inertial; sample k+1 is sign-flipped if needed so dot(k, k+1) ≥ 0. */
  readonly attitudes: Float64Array;
  /** Joint angles per sample in the model's dof order, rad; dofCount per sample (dofs missing from the samples stay 0). */
  readonly joints: Float64Array;
  /** Duration, s (time of the last sample). */
  readonly duration: number;
}

const DEG = Math.PI / 180;

/** Builds the track; throws when there are no frames or the frames' dofs are unknown to the model. */
export function createMotionTrack(model: BodyModel, samples: SampleFrames): MotionTrack {
  const n = samples.frames.length;
  if (n === 0) throw new Error('motion has no samples');
  const nd = model.dofCount;
  // Column k of the samples feeds model dof map[k].
  const map = samples.dofs.map((name) => {
    const i = model.dofIndex.get(name);
    if (i === undefined) throw new Error(`samples name dof '${name}', which the body does not have`);
    return i;
  });
  const times = new Float64Array(n);
  const attitudes = new Float64Array(4 * n);
  const joints = new Float64Array(nd * n);
  samples.frames.forEach((f, k) => {
    times[k] = f.t;
    let { w, x, y, z } = f.attitude;
    if (k > 0) {
      const o = 4 * (k - 1);
      // q and −q are the same rotation: keep the one nearer the previous sample.
      if (w * attitudes[o] + x * attitudes[o + 1] + y * attitudes[o + 2] + z * attitudes[o + 3] < 0) { w = -w; x = -x; y = -y; z = -z; }
    }
    attitudes[4 * k] = w; attitudes[4 * k + 1] = x; attitudes[4 * k + 2] = y; attitudes[4 * k + 3] = z;
    for (let c = 0; c < map.length; c++) joints[nd * k + map[c]] = f.jointsDeg[c] * DEG;
  });
  return { count: n, dofCount: nd, times, attitudes, joints, duration: times[n - 1] };
}
