/**
 * Inertia tensors against closed forms from the standard tables of mass moments of inertia (solid
 * cuboid m(b² + c²)/12 about its centre; slender rod mL²/12 about its centre and mL²/3 about its
 * end — from memory, as in any engineering-dynamics textbook's appendix), the parallel-axis theorem,
 * and the one validity rule (positive moments, triangle inequality, INERTIA_TOLERANCE).
 */
import { describe, expect, it } from 'vitest';

import { checkInertia, INERTIA_TOLERANCE, inertiaList, inertiaTensor, pointMassTensor, rotateTensor } from '../../shared/math/inertia.ts';
import { mat3Add } from '../../shared/math/mat3.ts';
import { quatFromAxisAngle, quatToMatrix } from '../../shared/math/quaternion.ts';
import { symmetricEigen3 } from '../../shared/math/symmetric-eigen.ts';

/** Solid cuboid of mass m and edges a (x), b (y), c (z), about its centre. */
const cuboid = (m: number, a: number, b: number, c: number): [number, number, number] =>
  [(m * (b * b + c * c)) / 12, (m * (a * a + c * c)) / 12, (m * (a * a + b * b)) / 12];

describe('inertia tensors', () => {
  it('inertiaTensor places the off-diagonal entries symmetrically; inertiaList takes them back', () => {
    const list: [number, number, number, number, number, number] = [1.2, 1.0, 0.35, 0.01, -0.02, 0.03];
    expect(inertiaTensor(list)).toEqual([1.2, 0.01, -0.02, 0.01, 1.0, 0.03, -0.02, 0.03, 0.35]);
    expect(inertiaList(inertiaTensor(list))).toEqual(list);
    expect(inertiaList(inertiaTensor([1.2, 1.0, 0.35]))).toEqual([1.2, 1.0, 0.35]);
  });

  it('parallel axis: a slender rod mL²/12 about its centre plus m(L/2)² is mL²/3 about its end', () => {
    const m = 2.2, L = 0.3;
    const aboutEnd = mat3Add(inertiaTensor([(m * L * L) / 12, (m * L * L) / 12, 0]), pointMassTensor(m, [0, 0, L / 2]));
    expect(aboutEnd[0]).toBeCloseTo((m * L * L) / 3, 14);
    expect(aboutEnd[4]).toBeCloseTo((m * L * L) / 3, 14);
    expect(aboutEnd[8]).toBe(0);
  });

  it('a point mass off every axis: m(|d|²E − d dᵀ) entry by entry', () => {
    const m = 3, d = [0.1, -0.2, 0.3];
    const I = pointMassTensor(m, d);
    expect(I[0]).toBeCloseTo(m * (d[1] ** 2 + d[2] ** 2), 15);
    expect(I[1]).toBeCloseTo(-m * d[0] * d[1], 15);
    expect(I[5]).toBeCloseTo(-m * d[1] * d[2], 15);
    expect(I[3]).toBe(I[1]);
  });

  it('rotateTensor: a cuboid turned 90° about z swaps Ixx and Iyy; any turn keeps the principal moments', () => {
    const J = inertiaTensor(cuboid(10, 0.4, 0.2, 0.6));
    const quarter = rotateTensor(quatToMatrix(quatFromAxisAngle([0, 0, 1], Math.PI / 2)), J);
    expect(quarter[0]).toBeCloseTo(J[4], 14);
    expect(quarter[4]).toBeCloseTo(J[0], 14);
    const turned = rotateTensor(quatToMatrix(quatFromAxisAngle([1, 2, -0.5], 1.1)), J);
    const sorted = [J[0], J[4], J[8]].sort((u, v) => u - v);
    symmetricEigen3(turned).values.forEach((v, k) => expect(v).toBeCloseTo(sorted[k], 14));
  });
});

describe('checkInertia: the one validity rule', () => {
  it('a solid cuboid passes as a segment', () => {
    expect(checkInertia(cuboid(10, 0.4, 0.2, 0.6), 'definite').problem).toBeNull();
  });

  it('a thin rod (one moment 0) fails as a segment, passes as added gear; zero (a point mass) passes as gear', () => {
    expect(checkInertia([0.1, 0.1, 0], 'definite').problem).toBe('not_positive');
    expect(checkInertia([0.1, 0.1, 0], 'semidefinite').problem).toBeNull();
    expect(checkInertia([0, 0, 0], 'semidefinite').problem).toBeNull();
  });

  it('a negative principal moment fails both, also when only the off-diagonal terms make it negative', () => {
    expect(checkInertia([-0.1, 1, 1], 'semidefinite').problem).toBe('not_positive');
    expect(checkInertia([1, 1, 1, 2, 0, 0], 'definite').problem).toBe('not_positive');
  });

  it('triangle inequality: a thin plate (I₁ + I₂ = I₃ exactly) passes, 1e-6 beyond fails', () => {
    const [ixx, iyy] = cuboid(1, 0.3, 0.5, 0);
    expect(checkInertia([ixx, iyy, ixx + iyy], 'definite').problem).toBeNull();
    expect(checkInertia([ixx, iyy, (ixx + iyy) * (1 + 1e-6)], 'definite').problem).toBe('triangle');
    expect(checkInertia([ixx, iyy, (ixx + iyy) * (1 + 1e-6)], 'semidefinite').problem).toBe('triangle');
  });

  it(`rounding within INERTIA_TOLERANCE (${INERTIA_TOLERANCE}) of the largest moment passes, 10× that fails`, () => {
    expect(checkInertia([0.3, 0.5, 0.8 * (1 + INERTIA_TOLERANCE / 10)], 'definite').problem).toBeNull();
    expect(checkInertia([0.3, 0.5, 0.8 * (1 + INERTIA_TOLERANCE * 10)], 'definite').problem).toBe('triangle');
    expect(checkInertia([-0.8 * INERTIA_TOLERANCE / 10, 0.8, 0.8], 'semidefinite').problem).toBeNull();
  });

  it('NaN fails loudly as not positive', () => {
    expect(checkInertia([Number.NaN, 1, 1], 'semidefinite').problem).toBe('not_positive');
  });
});
