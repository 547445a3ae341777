/**
 * Forward kinematics of the body tree in the root segment's frame: each segment's rotation, origin
 * and CoM for given joint angles, and (optionally) their velocities for given joint rates.
 * Allocation-free: results go into a preallocated BodyPose.
 */
import { float64Block } from '../math/float64-block.ts';
import type { BodyModel } from './body-model.ts';

/** Mutable pose buffers for one body, all in the root segment's frame. */
export interface BodyPose {
  /** Segment → root rotation per segment, row-major 3×3; 9 per segment. */
  rot: Float64Array;
  /** Segment frame origin (joint centre), m; 3 per segment. */
  pos: Float64Array;
  /** Segment CoM, m; 3 per segment. */
  comPos: Float64Array;
  /** Each dof's unit axis in the root frame at the current pose; 3 per dof. */
  dofAxisRoot: Float64Array;
  /** Segment angular velocity relative to the root frame, rad/s; 3 per segment (filled by segmentVelocities). */
  angVel: Float64Array;
  /** Segment CoM velocity relative to the root frame, m/s; 3 per segment (filled by segmentVelocities). */
  comVel: Float64Array;
  /** Per dof: the angle (rad) whose cosine and sine are held in dofCos/dofSin (NaN: none yet). */
  dofAngle: Float64Array;
  dofCos: Float64Array;
  dofSin: Float64Array;
  /** Scratch. */
  tmpRot: Float64Array;
  tmpRot2: Float64Array;
  tmpVec: Float64Array;
}

/** Allocates pose buffers for a model. */
export function createBodyPose(model: BodyModel): BodyPose {
  const n = model.segmentCount, nd = Math.max(1, model.dofCount);
  // One buffer for all of them (poses are made for every simulation).
  const [rot, pos, comPos, dofAxisRoot, angVel, comVel, dofAngle, dofCos, dofSin, tmpRot, tmpRot2, tmpVec] = float64Block([9 * n, 3 * n, 3 * n, 3 * nd, 3 * n, 3 * n, nd, nd, nd, 9, 9, 3]);
  dofAngle.fill(NaN);
  return { rot, pos, comPos, dofAxisRoot, angVel, comVel, dofAngle, dofCos, dofSin, tmpRot, tmpRot2, tmpVec };
}

/**
 * Segments (indices, tree order) whose pose relative to the root changes when the dofs listed in
 * `movingDofs` change: those with a moving dof of their own or a moving ancestor.
 */
function movingSegments(model: BodyModel, movingDofs: ArrayLike<number>): Int32Array {
  const n = model.segmentCount;
  const moves = new Uint8Array(n);
  const dofMoves = new Uint8Array(model.dofCount);
  for (let j = 0; j < movingDofs.length; j++) dofMoves[movingDofs[j]] = 1;
  const out: number[] = [];
  for (let i = 0; i < n; i++) {
    const p = model.parent[i];
    let m = p >= 0 && moves[p] === 1;
    for (let k = model.dofStart[i]; k < model.dofStart[i + 1] && !m; k++) m = dofMoves[k] === 1;
    if (m) { moves[i] = 1; out.push(i); }
  }
  return Int32Array.from(out);
}

/** How each segment moves relative to the root while only some dofs move (see segmentMotion). */
export interface SegmentMotion {
  /** Segments with a moving dof of their own or in their subtree, and a moving dof on the way from the root (tree order). */
  moving: Int32Array;
  /** Segments that move with a moving ancestor but whose own subtree is still: rigid relative to `host[i]` (tree order). */
  carried: Int32Array;
  /** For a carried segment: its nearest ancestor in `moving`; otherwise the segment itself. */
  host: Int32Array;
  /** Segments still relative to the root (tree order). */
  still: Int32Array;
}

/**
 * Splits the segments by how they move when only `movingDofs` change: moving, carried rigidly by
 * a moving ancestor (a still subtree hanging from it, e.g. forearm and hand while only the
 * shoulder turns), or still relative to the root.
 */
export function segmentMotion(model: BodyModel, movingDofs: ArrayLike<number>): SegmentMotion {
  const n = model.segmentCount, { parent, dofStart } = model;
  const inMotion = new Uint8Array(n);
  const all = movingSegments(model, movingDofs);
  for (let j = 0; j < all.length; j++) inMotion[all[j]] = 1;
  // subtreeMoves[i]: a dof of i or of a descendant moves (children come after parents).
  const dofMoves = new Uint8Array(model.dofCount);
  for (let j = 0; j < movingDofs.length; j++) dofMoves[movingDofs[j]] = 1;
  const subtreeMoves = new Uint8Array(n);
  for (let i = n - 1; i >= 0; i--) {
    for (let k = dofStart[i]; k < dofStart[i + 1]; k++) if (dofMoves[k]) subtreeMoves[i] = 1;
    if (subtreeMoves[i] && parent[i] >= 0) subtreeMoves[parent[i]] = 1;
  }
  const host = Int32Array.from(parent.keys());
  const moving: number[] = [], carried: number[] = [], still: number[] = [];
  for (let i = 0; i < n; i++) {
    if (!inMotion[i]) still.push(i);
    else if (subtreeMoves[i]) moving.push(i);
    else { carried.push(i); host[i] = host[parent[i]]; }
  }
  return { moving: Int32Array.from(moving), carried: Int32Array.from(carried), host, still: Int32Array.from(still) };
}

/**
 * Fills pose.rot, pos, comPos and dofAxisRoot for joint angles q (rad, one per dof).
 * Child frame = parent frame moved by joint.origin, then rotated by Rot(a₁,θ₁)·Rot(a₂,θ₂)·….
 * With `segments` (indices in tree order, parents before children), only those segments are
 * recomputed: the others must already hold their pose for these angles (e.g. segments whose own
 * and ancestors' angles do not change over a motion step, posed once at its start).
 */
export function forwardKinematics(model: BodyModel, q: ArrayLike<number>, pose: BodyPose, segments?: ArrayLike<number>): void {
  const { parent, origin, com, dofStart, dofAxis } = model;
  const { rot, pos, comPos, dofAxisRoot, dofAngle, dofCos, dofSin } = pose;
  const n = segments ? segments.length : model.segmentCount;
  // Hot path: everything inline on locals (no helper calls, no temporaries).
  for (let j = 0; j < n; j++) {
    const i = segments ? segments[j] : j;
    const p = parent[i];
    const o = 9 * i, i3 = 3 * i;
    let r0 = 1, r1 = 0, r2 = 0, r3 = 0, r4 = 1, r5 = 0, r6 = 0, r7 = 0, r8 = 1;
    if (p < 0) {
      // Root: identity rotation at the origin.
      pos[i3] = 0; pos[i3 + 1] = 0; pos[i3 + 2] = 0;
    } else {
      const po = 9 * p, p3 = 3 * p;
      r0 = rot[po]; r1 = rot[po + 1]; r2 = rot[po + 2]; r3 = rot[po + 3]; r4 = rot[po + 4]; r5 = rot[po + 5]; r6 = rot[po + 6]; r7 = rot[po + 7]; r8 = rot[po + 8];
      // Origin: parent position + parent rotation · joint origin.
      const ox = origin[i3], oy = origin[i3 + 1], oz = origin[i3 + 2];
      pos[i3] = pos[p3] + r0 * ox + r1 * oy + r2 * oz;
      pos[i3 + 1] = pos[p3 + 1] + r3 * ox + r4 * oy + r5 * oz;
      pos[i3 + 2] = pos[p3 + 2] + r6 * ox + r7 * oy + r8 * oz;
      // Apply each dof in order: R ← R · Rot(axis, θ) (Rodrigues).
      for (let k = dofStart[i]; k < dofStart[i + 1]; k++) {
        const k3 = 3 * k;
        const x = dofAxis[k3], y = dofAxis[k3 + 1], z = dofAxis[k3 + 2];
        // A dof whose angle has not changed since the last call (one at rest) keeps its cos/sin.
        const th = q[k];
        if (th !== dofAngle[k]) { dofAngle[k] = th; dofCos[k] = Math.cos(th); dofSin[k] = Math.sin(th); }
        const c = dofCos[k], s = dofSin[k];
        // The dof axis in the root frame uses the rotation left by the previous dofs: R·axis.
        // Anatomical joints mostly turn about a frame axis (±x, ±y, ±z): then R·axis is ± a column
        // of R and Rot mixes only the two other columns (the same products with their zero terms
        // left out; a unit axis is exactly ±1).
        if (y === 0 && z === 0) {
          dofAxisRoot[k3] = r0 * x; dofAxisRoot[k3 + 1] = r3 * x; dofAxisRoot[k3 + 2] = r6 * x;
          const sx = s * x;
          const n1 = c * r1 + sx * r2, n4 = c * r4 + sx * r5, n7 = c * r7 + sx * r8;
          r2 = c * r2 - sx * r1; r5 = c * r5 - sx * r4; r8 = c * r8 - sx * r7;
          r1 = n1; r4 = n4; r7 = n7;
        } else if (x === 0 && z === 0) {
          dofAxisRoot[k3] = r1 * y; dofAxisRoot[k3 + 1] = r4 * y; dofAxisRoot[k3 + 2] = r7 * y;
          const sy = s * y;
          const n0 = c * r0 - sy * r2, n3 = c * r3 - sy * r5, n6 = c * r6 - sy * r8;
          r2 = sy * r0 + c * r2; r5 = sy * r3 + c * r5; r8 = sy * r6 + c * r8;
          r0 = n0; r3 = n3; r6 = n6;
        } else if (x === 0 && y === 0) {
          dofAxisRoot[k3] = r2 * z; dofAxisRoot[k3 + 1] = r5 * z; dofAxisRoot[k3 + 2] = r8 * z;
          const sz = s * z;
          const n0 = c * r0 + sz * r1, n3 = c * r3 + sz * r4, n6 = c * r6 + sz * r7;
          r1 = c * r1 - sz * r0; r4 = c * r4 - sz * r3; r7 = c * r7 - sz * r6;
          r0 = n0; r3 = n3; r6 = n6;
        } else {
          dofAxisRoot[k3] = r0 * x + r1 * y + r2 * z;
          dofAxisRoot[k3 + 1] = r3 * x + r4 * y + r5 * z;
          dofAxisRoot[k3 + 2] = r6 * x + r7 * y + r8 * z;
          const t = 1 - c;
          const a0 = t * x * x + c, a1 = t * x * y - s * z, a2 = t * x * z + s * y;
          const a3 = t * x * y + s * z, a4 = t * y * y + c, a5 = t * y * z - s * x;
          const a6 = t * x * z - s * y, a7 = t * y * z + s * x, a8 = t * z * z + c;
          const n0 = r0 * a0 + r1 * a3 + r2 * a6, n1 = r0 * a1 + r1 * a4 + r2 * a7, n2 = r0 * a2 + r1 * a5 + r2 * a8;
          const n3 = r3 * a0 + r4 * a3 + r5 * a6, n4 = r3 * a1 + r4 * a4 + r5 * a7, n5 = r3 * a2 + r4 * a5 + r5 * a8;
          const n6 = r6 * a0 + r7 * a3 + r8 * a6, n7 = r6 * a1 + r7 * a4 + r8 * a7, n8 = r6 * a2 + r7 * a5 + r8 * a8;
          r0 = n0; r1 = n1; r2 = n2; r3 = n3; r4 = n4; r5 = n5; r6 = n6; r7 = n7; r8 = n8;
        }
      }
    }
    rot[o] = r0; rot[o + 1] = r1; rot[o + 2] = r2; rot[o + 3] = r3; rot[o + 4] = r4; rot[o + 5] = r5; rot[o + 6] = r6; rot[o + 7] = r7; rot[o + 8] = r8;
    // CoM: origin + rotation · com.
    const cx = com[i3], cy = com[i3 + 1], cz = com[i3 + 2];
    comPos[i3] = pos[i3] + r0 * cx + r1 * cy + r2 * cz;
    comPos[i3 + 1] = pos[i3 + 1] + r3 * cx + r4 * cy + r5 * cz;
    comPos[i3 + 2] = pos[i3 + 2] + r6 * cx + r7 * cy + r8 * cz;
  }
}

/**
 * Fills pose.angVel and pose.comVel (relative to the root frame) for joint rates qd (rad/s),
 * after forwardKinematics for the same angles. Analytic: ω_i = ω_parent + Σ axis_k·θ̇_k,
 * v_origin_i = v_origin_parent + ω_parent × (pos_i − pos_parent), v_com_i = v_origin_i + ω_i × (com_i − pos_i).
 * `originVel` is scratch of 3 per segment (joint-centre velocities). With `segments` (tree order),
 * only those are recomputed; the others must already hold theirs (zero for segments at rest).
 */
export function segmentVelocities(model: BodyModel, qd: ArrayLike<number>, pose: BodyPose, originVel: Float64Array, segments?: ArrayLike<number>): void {
  const { parent, dofStart } = model;
  const { pos, comPos, dofAxisRoot, angVel, comVel } = pose;
  const n = segments ? segments.length : model.segmentCount;
  for (let j = 0; j < n; j++) {
    const i = segments ? segments[j] : j;
    const p = parent[i];
    let wx = 0, wy = 0, wz = 0, vx = 0, vy = 0, vz = 0;
    if (p >= 0) {
      const pwx = angVel[3 * p], pwy = angVel[3 * p + 1], pwz = angVel[3 * p + 2];
      const rx = pos[3 * i] - pos[3 * p], ry = pos[3 * i + 1] - pos[3 * p + 1], rz = pos[3 * i + 2] - pos[3 * p + 2];
      vx = originVel[3 * p] + pwy * rz - pwz * ry;
      vy = originVel[3 * p + 1] + pwz * rx - pwx * rz;
      vz = originVel[3 * p + 2] + pwx * ry - pwy * rx;
      wx = pwx; wy = pwy; wz = pwz;
      for (let k = dofStart[i]; k < dofStart[i + 1]; k++) {
        wx += dofAxisRoot[3 * k] * qd[k]; wy += dofAxisRoot[3 * k + 1] * qd[k]; wz += dofAxisRoot[3 * k + 2] * qd[k];
      }
    }
    angVel[3 * i] = wx; angVel[3 * i + 1] = wy; angVel[3 * i + 2] = wz;
    originVel[3 * i] = vx; originVel[3 * i + 1] = vy; originVel[3 * i + 2] = vz;
    const cx = comPos[3 * i] - pos[3 * i], cy = comPos[3 * i + 1] - pos[3 * i + 1], cz = comPos[3 * i + 2] - pos[3 * i + 2];
    comVel[3 * i] = vx + wy * cz - wz * cy;
    comVel[3 * i + 1] = vy + wz * cx - wx * cz;
    comVel[3 * i + 2] = vz + wx * cy - wy * cx;
  }
}
