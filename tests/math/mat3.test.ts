/**
 * The flat row-major 3×3 helpers against gl-matrix (64-bit arrays), a general-purpose reference
 * library. gl-matrix is column-major: a row-major array read column-major is the transpose, so
 * row-major A·B is gl-matrix's multiply(B, A).
 */
import { glMatrix, mat3 } from 'gl-matrix';
import { beforeAll, describe, expect, it } from 'vitest';

import { mat3Add, mat3Multiply, mat3Transpose, solveSpd3 } from '../../shared/math/mat3.ts';

const TOL_DIGITS = 12;

/** Fixed pseudo-random matrices (an LCG: reproducible inputs). */
function testMatrices(count: number): number[][] {
  let seed = 2024;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31) * 4 - 2;
  return Array.from({ length: count }, () => Array.from({ length: 9 }, rnd));
}

beforeAll(() => { glMatrix.setMatrixArrayType(Float64Array as unknown as Float32ArrayConstructor); });

describe('mat3 against gl-matrix', () => {
  const ms = testMatrices(40);

  it('multiply: row-major A·B equals gl-matrix multiply(B, A)', () => {
    for (let i = 0; i + 1 < ms.length; i++) {
      const ref = mat3.multiply(mat3.create(), ms[i + 1], ms[i]);
      mat3Multiply(ms[i], ms[i + 1]).forEach((v, k) => expect(v).toBeCloseTo(ref[k], TOL_DIGITS));
    }
  });

  it('transpose and add equal gl-matrix transpose and add', () => {
    for (let i = 0; i + 1 < ms.length; i++) {
      const t = mat3.transpose(mat3.create(), ms[i]);
      mat3Transpose(ms[i]).forEach((v, k) => expect(v).toBe(t[k]));
      const s = mat3.add(mat3.create(), ms[i], ms[i + 1]);
      mat3Add(ms[i], ms[i + 1]).forEach((v, k) => expect(v).toBe(s[k]));
    }
  });

  it('solveSpd3: S·x = b for symmetric positive-definite S = AᵀA + I, equal to gl-matrix invert(S)·b', () => {
    for (const a of ms) {
      const S = mat3Add(mat3Multiply(mat3Transpose(a), a), [1, 0, 0, 0, 1, 0, 0, 0, 1]);
      const b = [a[0], a[4], a[8]];
      const x = [0, 0, 0];
      expect(solveSpd3(S, b, x)).toBe(true);
      // Symmetric S: its column-major reading is S itself.
      const inv = mat3.invert(mat3.create(), S)!;
      for (let r = 0; r < 3; r++) expect(x[r]).toBeCloseTo(inv[r] * b[0] + inv[r + 3] * b[1] + inv[r + 6] * b[2], 10);
    }
  });

  it('solveSpd3 refuses a matrix that is not positive definite (a zero or negative pivot)', () => {
    const x = [0, 0, 0];
    expect(solveSpd3([1, 0, 0, 0, 0, 0, 0, 0, 1], [1, 1, 1], x)).toBe(false);
    expect(solveSpd3([1, 2, 0, 2, 1, 0, 0, 0, 1], [1, 1, 1], x)).toBe(false);
    expect(solveSpd3([Number.NaN, 0, 0, 0, 1, 0, 0, 0, 1], [1, 1, 1], x)).toBe(false);
  });
});
