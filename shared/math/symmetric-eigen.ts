import type { Vec3 } from './vec3.ts';

/** Eigen-decomposition of a symmetric 3×3 matrix. */
export interface SymmetricEigen {
  /** Eigenvalues, ascending. */
  values: Vec3;
  /** Unit eigenvectors; vectors[k] belongs to values[k]. */
  vectors: [Vec3, Vec3, Vec3];
}

const PAIRS = [[0, 1], [0, 2], [1, 2]] as const;

/**
 * Eigenvalues and eigenvectors of a symmetric 3×3 matrix (flat, row-major) by cyclic Jacobi
 * rotations (Golub & Van Loan, Matrix Computations, §8.5). Hand-written: none of the project's
 * packages offers it. Jacobi keeps small eigenvalues to full relative accuracy, which the inertia
 * checks (positive definite, triangle inequality) rely on.
 */
export function symmetricEigen3(m: ArrayLike<number>): SymmetricEigen {
  const a = [[m[0], m[1], m[2]], [m[3], m[4], m[5]], [m[6], m[7], m[8]]];
  const v = [[1, 0, 0], [0, 1, 0], [0, 0, 1]];
  for (let sweep = 0; sweep < 50; sweep++) {
    const off = a[0][1] ** 2 + a[0][2] ** 2 + a[1][2] ** 2;
    const scale = a[0][0] ** 2 + a[1][1] ** 2 + a[2][2] ** 2;
    if (off <= 1e-30 * scale || off === 0) break;
    for (const [p, q] of PAIRS) {
      if (a[p][q] === 0) continue;
      // rotation angle that zeroes a[p][q]
      const theta = (a[q][q] - a[p][p]) / (2 * a[p][q]);
      const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
      const c = 1 / Math.sqrt(t * t + 1);
      const s = t * c;
      for (let k = 0; k < 3; k++) {
        const akp = a[k][p], akq = a[k][q];
        a[k][p] = c * akp - s * akq;
        a[k][q] = s * akp + c * akq;
      }
      for (let k = 0; k < 3; k++) {
        const apk = a[p][k], aqk = a[q][k];
        a[p][k] = c * apk - s * aqk;
        a[q][k] = s * apk + c * aqk;
      }
      for (let k = 0; k < 3; k++) {
        const vkp = v[k][p], vkq = v[k][q];
        v[k][p] = c * vkp - s * vkq;
        v[k][q] = s * vkp + c * vkq;
      }
    }
  }
  const [i0, i1, i2] = [0, 1, 2].sort((i, j) => a[i][i] - a[j][j]);
  const column = (i: number): Vec3 => [v[0][i], v[1][i], v[2][i]];
  return { values: [a[i0][i0], a[i1][i1], a[i2][i2]], vectors: [column(i0), column(i1), column(i2)] };
}
