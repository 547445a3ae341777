/**
 * 3×3 matrix helpers on flat arrays, row-major: m[3*r + c] is row r, column c.
 * Small and allocation-free so the engine's hot path and the 3D view can share them.
 */

/** A flat 3×3 matrix, row-major (index 3*row + col). */
export type Mat3 = Float64Array | number[];
/** A 3-vector [x, y, z]. */
export type Vec3 = Float64Array | number[];

/** out = a · b (row-major 3×3). `out` may not alias `a` or `b`. */
export function mat3Multiply(a: ArrayLike<number>, b: ArrayLike<number>, out: Mat3, ao = 0, bo = 0, oo = 0): Mat3 {
  for (let r = 0; r < 3; r++) {
    const a0 = a[ao + 3 * r], a1 = a[ao + 3 * r + 1], a2 = a[ao + 3 * r + 2];
    out[oo + 3 * r] = a0 * b[bo] + a1 * b[bo + 3] + a2 * b[bo + 6];
    out[oo + 3 * r + 1] = a0 * b[bo + 1] + a1 * b[bo + 4] + a2 * b[bo + 7];
    out[oo + 3 * r + 2] = a0 * b[bo + 2] + a1 * b[bo + 5] + a2 * b[bo + 8];
  }
  return out;
}

/** out = m · v for a row-major 3×3 m. `out` may not alias `v`. */
export function mat3MulVec(m: ArrayLike<number>, v: ArrayLike<number>, out: Vec3, mo = 0, vo = 0, oo = 0): Vec3 {
  const x = v[vo], y = v[vo + 1], z = v[vo + 2];
  out[oo] = m[mo] * x + m[mo + 1] * y + m[mo + 2] * z;
  out[oo + 1] = m[mo + 3] * x + m[mo + 4] * y + m[mo + 5] * z;
  out[oo + 2] = m[mo + 6] * x + m[mo + 7] * y + m[mo + 8] * z;
  return out;
}

/** out = mᵀ (row-major 3×3). */
export function mat3Transpose(m: ArrayLike<number>, out: Mat3): Mat3 {
  const t = [m[0], m[3], m[6], m[1], m[4], m[7], m[2], m[5], m[8]];
  for (let i = 0; i < 9; i++) out[i] = t[i];
  return out;
}

/**
 * Rotation matrix for a right-handed rotation by `angle` (rad) about the unit `axis`
 * (Rodrigues' formula), written row-major into out at offset oo.
 */
export function mat3FromAxisAngle(axis: ArrayLike<number>, angle: number, out: Mat3, ao = 0, oo = 0): Mat3 {
  const x = axis[ao], y = axis[ao + 1], z = axis[ao + 2];
  const c = Math.cos(angle), s = Math.sin(angle), t = 1 - c;
  out[oo] = t * x * x + c; out[oo + 1] = t * x * y - s * z; out[oo + 2] = t * x * z + s * y;
  out[oo + 3] = t * x * y + s * z; out[oo + 4] = t * y * y + c; out[oo + 5] = t * y * z - s * x;
  out[oo + 6] = t * x * z - s * y; out[oo + 7] = t * y * z + s * x; out[oo + 8] = t * z * z + c;
  return out;
}

/** Solves the symmetric positive-definite system S·x = b (S row-major 3×3) by Cholesky; returns false if S is not SPD. */
export function solveSpd3(S: ArrayLike<number>, b: ArrayLike<number>, out: Vec3): boolean {
  const l00 = S[0];
  if (!(l00 > 0)) return false;
  const L00 = Math.sqrt(l00);
  const L10 = S[3] / L00, L20 = S[6] / L00;
  const d1 = S[4] - L10 * L10;
  if (!(d1 > 0)) return false;
  const L11 = Math.sqrt(d1);
  const L21 = (S[7] - L20 * L10) / L11;
  const d2 = S[8] - L20 * L20 - L21 * L21;
  if (!(d2 > 0)) return false;
  const L22 = Math.sqrt(d2);
  // Forward substitution L·y = b, then back substitution Lᵀ·x = y.
  const y0 = b[0] / L00;
  const y1 = (b[1] - L10 * y0) / L11;
  const y2 = (b[2] - L20 * y0 - L21 * y1) / L22;
  const x2 = y2 / L22;
  const x1 = (y1 - L21 * x2) / L11;
  const x0 = (y0 - L10 * x1 - L20 * x2) / L00;
  out[0] = x0; out[1] = x1; out[2] = x2;
  return true;
}

/**
 * Eigenvalues of a symmetric 3×3 matrix (row-major), ascending, by the closed-form trigonometric
 * method (Smith 1961, "Eigenvalues of a symmetric 3×3 matrix", Commun. ACM 4(4):168).
 */
export function symmetricEigenvalues3(m: ArrayLike<number>): [number, number, number] {
  const a = m[0], b = m[4], c = m[8], d = m[1], e = m[5], f = m[2];
  const p1 = d * d + e * e + f * f;
  if (p1 === 0) return [a, b, c].sort((u, v) => u - v) as [number, number, number];
  const q = (a + b + c) / 3;
  const p2 = (a - q) ** 2 + (b - q) ** 2 + (c - q) ** 2 + 2 * p1;
  const p = Math.sqrt(p2 / 6);
  // B = (A − qI)/p; r = det(B)/2 clamped to [−1, 1] against rounding.
  const ba = (a - q) / p, bb = (b - q) / p, bc = (c - q) / p, bd = d / p, be = e / p, bf = f / p;
  const det = ba * (bb * bc - be * be) - bd * (bd * bc - be * bf) + bf * (bd * be - bb * bf);
  const r = Math.min(1, Math.max(-1, det / 2));
  const phi = Math.acos(r) / 3;
  const l3 = q + 2 * p * Math.cos(phi);
  const l1 = q + 2 * p * Math.cos(phi + (2 * Math.PI) / 3);
  const l2 = 3 * q - l1 - l3;
  return [l1, l2, l3];
}
