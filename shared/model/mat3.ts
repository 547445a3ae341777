import type { Vec3 } from './vec3.ts';

/** A 3×3 matrix as rows: m[i][j] is row i, column j. */
export type Mat3 = [Vec3, Vec3, Vec3];

/** The 3×3 identity. */
export function identity3(): Mat3 {
  return [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ];
}

/** a·b */
export function mul3(a: Mat3, b: Mat3): Mat3 {
  const r = identity3();
  for (let i = 0; i < 3; i++)
    for (let j = 0; j < 3; j++) r[i][j] = a[i][0] * b[0][j] + a[i][1] * b[1][j] + a[i][2] * b[2][j];
  return r;
}

/** m·v */
export function mulVec3(m: Mat3, v: Vec3 | number[]): Vec3 {
  return [
    m[0][0] * v[0] + m[0][1] * v[1] + m[0][2] * v[2],
    m[1][0] * v[0] + m[1][1] * v[1] + m[1][2] * v[2],
    m[2][0] * v[0] + m[2][1] * v[1] + m[2][2] * v[2],
  ];
}

/** mᵀ */
export function transpose3(m: Mat3): Mat3 {
  return [
    [m[0][0], m[1][0], m[2][0]],
    [m[0][1], m[1][1], m[2][1]],
    [m[0][2], m[1][2], m[2][2]],
  ];
}

/** Rotation matrix of angle `rad` about `axis` (normalised here; a zero axis throws). Rodrigues' formula. */
export function axisAngleMatrix(axis: Vec3 | number[], rad: number): Mat3 {
  const n = Math.hypot(axis[0], axis[1], axis[2]);
  if (!(n > 0)) throw new Error(`rotation axis [${axis.join(', ')}] is zero or not a number`);
  const x = axis[0] / n;
  const y = axis[1] / n;
  const z = axis[2] / n;
  const c = Math.cos(rad);
  const s = Math.sin(rad);
  const t = 1 - c;
  return [
    [t * x * x + c, t * x * y - s * z, t * x * z + s * y],
    [t * x * y + s * z, t * y * y + c, t * y * z - s * x],
    [t * x * z - s * y, t * y * z + s * x, t * z * z + c],
  ];
}

/**
 * The full symmetric tensor from the contract's inertia list: [Ixx, Iyy, Izz] or
 * [Ixx, Iyy, Izz, Ixy, Ixz, Iyz] (the tensor's own off-diagonal entries).
 */
export function inertiaTensor(list: readonly number[]): Mat3 {
  const [xx, yy, zz] = list;
  const xy = list[3] ?? 0;
  const xz = list[4] ?? 0;
  const yz = list[5] ?? 0;
  return [
    [xx, xy, xz],
    [xy, yy, yz],
    [xz, yz, zz],
  ];
}

/** R·J·Rᵀ: a tensor expressed in a rotated frame. */
export function rotateTensor(r: Mat3, j: Mat3): Mat3 {
  return mul3(mul3(r, j), transpose3(r));
}

/** Parallel-axis term m(|d|²E − d dᵀ): the inertia of a point mass m at offset d. */
export function pointMassTensor(m: number, d: Vec3 | number[]): Mat3 {
  const d2 = d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
  return [
    [m * (d2 - d[0] * d[0]), -m * d[0] * d[1], -m * d[0] * d[2]],
    [-m * d[1] * d[0], m * (d2 - d[1] * d[1]), -m * d[1] * d[2]],
    [-m * d[2] * d[0], -m * d[2] * d[1], m * (d2 - d[2] * d[2])],
  ];
}

/** a + b */
export function add3(a: Mat3, b: Mat3): Mat3 {
  return [
    [a[0][0] + b[0][0], a[0][1] + b[0][1], a[0][2] + b[0][2]],
    [a[1][0] + b[1][0], a[1][1] + b[1][1], a[1][2] + b[1][2]],
    [a[2][0] + b[2][0], a[2][1] + b[2][1], a[2][2] + b[2][2]],
  ];
}
