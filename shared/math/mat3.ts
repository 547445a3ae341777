/**
 * 3×3 matrix helpers on flat arrays, row-major: m[3*r + c] is row r, column c. The one matrix
 * representation of the project: the engine's hot path, the body model and the 3D view share it.
 */

/** A flat 3×3 matrix, row-major (index 3*row + col). */
export type Mat3 = Float64Array | number[];

/** a · b (row-major 3×3), as a new array. */
export function mat3Multiply(a: ArrayLike<number>, b: ArrayLike<number>): number[] {
  const out = new Array<number>(9);
  for (let r = 0; r < 3; r++) {
    const a0 = a[3 * r], a1 = a[3 * r + 1], a2 = a[3 * r + 2];
    out[3 * r] = a0 * b[0] + a1 * b[3] + a2 * b[6];
    out[3 * r + 1] = a0 * b[1] + a1 * b[4] + a2 * b[7];
    out[3 * r + 2] = a0 * b[2] + a1 * b[5] + a2 * b[8];
  }
  return out;
}

/** mᵀ (row-major 3×3), as a new array. */
export function mat3Transpose(m: ArrayLike<number>): number[] {
  return [m[0], m[3], m[6], m[1], m[4], m[7], m[2], m[5], m[8]];
}

/** a + b, as a new array. */
export function mat3Add(a: ArrayLike<number>, b: ArrayLike<number>): number[] {
  return Array.from({ length: 9 }, (_, i) => a[i] + b[i]);
}

/** Solves the symmetric positive-definite system S·x = b (S row-major 3×3) by Cholesky; returns false if S is not SPD. */
export function solveSpd3(S: ArrayLike<number>, b: ArrayLike<number>, out: Float64Array | number[]): boolean {
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
