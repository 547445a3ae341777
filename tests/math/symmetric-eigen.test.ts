/**
 * The symmetric 3×3 eigen-decomposition against closed forms: the tridiagonal Toeplitz matrix
 * (eigenvalues a + 2b·cos(kπ/4), k = 1..3, a textbook closed form), matrices built as R·diag(λ)·Rᵀ
 * with R from gl-matrix, repeated eigenvalues, and the characteristic polynomial's invariants.
 */
import { glMatrix, mat3, quat } from 'gl-matrix';
import { beforeAll, describe, expect, it } from 'vitest';

import { mat3Multiply, mat3Transpose } from '../../shared/math/mat3.ts';
import { symmetricEigen3 } from '../../shared/math/symmetric-eigen.ts';

beforeAll(() => { glMatrix.setMatrixArrayType(Float64Array as unknown as Float32ArrayConstructor); });

/** Checks A·v = λ·v and |v| = 1 for every pair, and that the vectors are mutually orthogonal. */
function expectEigenPairs(a: number[], digits: number): void {
  const { values, vectors } = symmetricEigen3(a);
  vectors.forEach((v, k) => {
    expect(Math.hypot(...v)).toBeCloseTo(1, 12);
    for (let r = 0; r < 3; r++) expect(a[3 * r] * v[0] + a[3 * r + 1] * v[1] + a[3 * r + 2] * v[2]).toBeCloseTo(values[k] * v[r], digits);
  });
  for (const [i, j] of [[0, 1], [0, 2], [1, 2]]) {
    expect(vectors[i][0] * vectors[j][0] + vectors[i][1] * vectors[j][1] + vectors[i][2] * vectors[j][2]).toBeCloseTo(0, 12);
  }
}

describe('symmetricEigen3', () => {
  it('tridiagonal Toeplitz [a b 0; b a b; 0 b a]: λ = a + 2b·cos(kπ/4), ascending', () => {
    const a = 2, b = -1;
    const { values } = symmetricEigen3([a, b, 0, b, a, b, 0, b, a]);
    const closed = [1, 2, 3].map((k) => a + 2 * b * Math.cos((k * Math.PI) / 4)).sort((u, v) => u - v);
    values.forEach((v, k) => expect(v).toBeCloseTo(closed[k], 14));
    expectEigenPairs([a, b, 0, b, a, b, 0, b, a], 13);
  });

  it('R·diag(λ)·Rᵀ with R from gl-matrix: the λ come back, and the vectors are R\'s columns up to sign', () => {
    const lambdas = [0.35, 1.0, 1.2];
    for (const [axis, angle] of [[[1, 2, 3], 0.7], [[0, 0, 1], Math.PI / 2], [[-1, 0.5, 0.25], 2.9]] as const) {
      const n = Math.hypot(...axis);
      const q = quat.setAxisAngle(quat.create(), [axis[0] / n, axis[1] / n, axis[2] / n], angle);
      const R = mat3Transpose(mat3.fromQuat(mat3.create(), q)); // gl-matrix is column-major
      const A = mat3Multiply(mat3Multiply(R, [lambdas[0], 0, 0, 0, lambdas[1], 0, 0, 0, lambdas[2]]), mat3Transpose(R));
      const { values, vectors } = symmetricEigen3(A);
      values.forEach((v, k) => expect(v).toBeCloseTo(lambdas[k], 13));
      vectors.forEach((v, k) => expect(Math.abs(v[0] * R[k] + v[1] * R[3 + k] + v[2] * R[6 + k])).toBeCloseTo(1, 12));
      expectEigenPairs(A, 13);
    }
  });

  it('a repeated eigenvalue (axially symmetric body): values exact, vectors still orthonormal', () => {
    const A = [2, 1, 0, 1, 2, 0, 0, 0, 3];
    const { values } = symmetricEigen3(A);
    [1, 3, 3].forEach((l, k) => expect(values[k]).toBeCloseTo(l, 14));
    expectEigenPairs(A, 13);
  });

  it('diagonal input: sorted diagonal, unit axes', () => {
    const { values, vectors } = symmetricEigen3([3, 0, 0, 0, 1, 0, 0, 0, 2]);
    expect(values).toEqual([1, 2, 3]);
    expect(vectors).toEqual([[0, 1, 0], [0, 0, 1], [1, 0, 0]]);
  });

  it('invariants of the characteristic polynomial: Σλ = trace, Πλ = det, Σλᵢλⱼ = sum of principal 2×2 minors', () => {
    const A = [4.1, -0.3, 0.8, -0.3, 2.2, 0.05, 0.8, 0.05, 1.7];
    const [l1, l2, l3] = symmetricEigen3(A).values;
    const det = A[0] * (A[4] * A[8] - A[5] * A[7]) - A[1] * (A[3] * A[8] - A[5] * A[6]) + A[2] * (A[3] * A[7] - A[4] * A[6]);
    const minors = A[0] * A[4] - A[1] * A[3] + A[0] * A[8] - A[2] * A[6] + A[4] * A[8] - A[5] * A[7];
    expect(l1 + l2 + l3).toBeCloseTo(A[0] + A[4] + A[8], 13);
    expect(l1 * l2 * l3).toBeCloseTo(det, 12);
    expect(l1 * l2 + l1 * l3 + l2 * l3).toBeCloseTo(minors, 12);
  });
});
