/**
 * Inertia tensors (kg·m², flat row-major 3×3) and the one validity rule every inertia in the
 * product meets. zod-free, so the 3D view can use it without the zod runtime.
 */
import { mat3Multiply, mat3Transpose } from './mat3.ts';
import { symmetricEigen3 } from './symmetric-eigen.ts';
import type { Vec3 } from './vec3.ts';

/** The contract's inertia list: [Ixx, Iyy, Izz] or [Ixx, Iyy, Izz, Ixy, Ixz, Iyz], kg·m². */
export type InertiaList = [number, number, number] | [number, number, number, number, number, number];

/**
 * The full symmetric tensor of a contract inertia list [Ixx, Iyy, Izz] or
 * [Ixx, Iyy, Izz, Ixy, Ixz, Iyz] (the last three are the tensor's own off-diagonal entries).
 */
export function inertiaTensor(list: readonly number[]): number[] {
  const [ixx, iyy, izz] = list;
  const ixy = list[3] ?? 0, ixz = list[4] ?? 0, iyz = list[5] ?? 0;
  return [ixx, ixy, ixz, ixy, iyy, iyz, ixz, iyz, izz];
}

/**
 * The contract's inertia list of a tensor: [Ixx, Iyy, Izz] when the off-diagonal entries vanish
 * (below 1e-12 of the trace), else [Ixx, Iyy, Izz, Ixy, Ixz, Iyz].
 */
export function inertiaList(i: ArrayLike<number>): InertiaList {
  const tiny = 1e-12 * (i[0] + i[4] + i[8]);
  return [i[1], i[2], i[5]].every((v) => Math.abs(v) <= tiny)
    ? [i[0], i[4], i[8]]
    : [i[0], i[4], i[8], i[1], i[2], i[5]];
}

/** R·J·Rᵀ: tensor J (given in a frame rotated by R) expressed in the outer frame. */
export function rotateTensor(r: ArrayLike<number>, j: ArrayLike<number>): number[] {
  return mat3Multiply(mat3Multiply(r, j), mat3Transpose(r));
}

/** Parallel-axis term m(|d|²E − d dᵀ) (Steiner): the inertia of a point mass m at offset d. */
export function pointMassTensor(m: number, d: ArrayLike<number>): number[] {
  const d2 = d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
  return [
    m * (d2 - d[0] * d[0]), -m * d[0] * d[1], -m * d[0] * d[2],
    -m * d[1] * d[0], m * (d2 - d[1] * d[1]), -m * d[1] * d[2],
    -m * d[2] * d[0], -m * d[2] * d[1], m * (d2 - d[2] * d[2]),
  ];
}

/**
 * Relative tolerance of the inertia checks, against the largest principal moment: rounding in
 * hand-typed tables and in the model's own sums (common practice for double-precision checks).
 */
export const INERTIA_TOLERANCE = 1e-9;

/** What is wrong with an inertia, if anything. */
export type InertiaProblem = 'not_positive' | 'triangle' | null;

/**
 * Checks an inertia list against what every rigid body's inertia satisfies: principal moments
 * positive (`definite`: a segment) or non-negative (`semidefinite`: an added item, zero for a point
 * mass), and the triangle inequality I₁ + I₂ ≥ I₃. Both within INERTIA_TOLERANCE of the largest moment.
 */
export function checkInertia(list: readonly number[], kind: 'definite' | 'semidefinite'): { moments: Vec3; problem: InertiaProblem } {
  const moments = symmetricEigen3(inertiaTensor(list)).values;
  const slack = INERTIA_TOLERANCE * Math.max(Math.abs(moments[2]), Number.MIN_VALUE);
  const positive = kind === 'definite' ? moments[0] > 0 : moments[0] >= -slack;
  // NaN moments fail `positive` (comparisons with NaN are false).
  if (!positive) return { moments, problem: 'not_positive' };
  if (moments[0] + moments[1] < moments[2] - slack) return { moments, problem: 'triangle' };
  return { moments, problem: null };
}
