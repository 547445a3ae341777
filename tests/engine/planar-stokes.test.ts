/**
 * Planar body: the net rotation of a closed loop in joint space equals the area integral of the
 * connection's curvature over the enclosed region (Stokes' theorem; for planar bodies rotations
 * commute, so the holonomy is exactly −∬ (∂A₂/∂s₁ − ∂A₁/∂s₂) ds₁ds₂). Computed here by 2-D
 * composite Simpson quadrature of a connection written out independently, with no ODE solver.
 */
import { describe, expect, it } from 'vitest';

import { simulate } from '../../server/engine/simulate.ts';
import { loadBody, mustSequence } from './fixtures.ts';

const DEG = Math.PI / 180;

// The fixture planar-three-link.json, transcribed: masses (kg), z moments (kg·m²), geometry (m).
const mM = 10, JM = 0.4;
const mL = 4, JL = 0.1, hingeL = -0.2, comL = -0.25;
const mR = 3, JR = 0.06, hingeR = 0.2, comR = 0.2;
const M = mM + mL + mR;

/** The connection A(s) = (A₁, A₂): ω_z = −A·ṡ, from L = I_lock ω + Σ_k (J_k + m_k d_k × ∂p_k/∂s_k) ṡ_k = 0. */
function connection(s1: number, s2: number): [number, number] {
  const pL = [hingeL + comL * Math.cos(s1), comL * Math.sin(s1)];
  const pR = [hingeR + comR * Math.cos(s2), comR * Math.sin(s2)];
  const c = [(mL * pL[0] + mR * pR[0]) / M, (mL * pL[1] + mR * pR[1]) / M];
  const dM = [-c[0], -c[1]], dL = [pL[0] - c[0], pL[1] - c[1]], dR = [pR[0] - c[0], pR[1] - c[1]];
  const lock = JM + JL + JR + mM * (dM[0] ** 2 + dM[1] ** 2) + mL * (dL[0] ** 2 + dL[1] ** 2) + mR * (dR[0] ** 2 + dR[1] ** 2);
  const dpL = [-comL * Math.sin(s1), comL * Math.cos(s1)];
  const dpR = [-comR * Math.sin(s2), comR * Math.cos(s2)];
  const h1 = JL + mL * (dL[0] * dpL[1] - dL[1] * dpL[0]);
  const h2 = JR + mR * (dR[0] * dpR[1] - dR[1] * dpR[0]);
  return [h1 / lock, h2 / lock];
}

/** Curvature F = ∂A₂/∂s₁ − ∂A₁/∂s₂ by central differences. */
function curvature(s1: number, s2: number): number {
  const e = 1e-5;
  return (connection(s1 + e, s2)[1] - connection(s1 - e, s2)[1]) / (2 * e)
    - (connection(s1, s2 + e)[0] - connection(s1, s2 - e)[0]) / (2 * e);
}

/** Composite Simpson's rule in 2-D with n (even) intervals per side. */
function simpson2d(f: (x: number, y: number) => number, a: number, b: number, c: number, d: number, n: number): number {
  const hx = (b - a) / n, hy = (d - c) / n;
  const w = (i: number) => (i === 0 || i === n ? 1 : i % 2 ? 4 : 2);
  let sum = 0;
  for (let i = 0; i <= n; i++) for (let j = 0; j <= n; j++) sum += w(i) * w(j) * f(a + i * hx, c + j * hy);
  return (sum * hx * hy) / 9;
}

describe('planar body: loop rotation = area integral of the connection curvature (Stokes)', () => {
  const body = loadBody('planar-three-link');
  const [a, b, c, d] = [-60, 50, -40, 70];
  const rectangle = (dir: 1 | -1) => {
    const corners = dir === 1 ? [[b, c], [b, d], [a, d], [a, c]] : [[a, d], [b, d], [b, c], [a, c]];
    return mustSequence({
      start: { left_hinge: a, right_hinge: c },
      steps: corners.map(([x, y], i) => ({ kind: 'move', duration: 0.8 + 0.1 * i, to: { left_hinge: x, right_hinge: y } })),
    }, body);
  };
  const expected = -simpson2d(curvature, a * DEG, b * DEG, c * DEG, d * DEG, 120);

  it('the quadrature is non-trivial', () => {
    expect(Math.abs(expected)).toBeGreaterThan(0.01);
  });

  it('counter-clockwise rectangle: engine yaw equals −∬F to 1e-8 rad', () => {
    const r = simulate(body, rectangle(1));
    expect(Math.abs(r.final.yprDeg.pitch) + Math.abs(r.final.yprDeg.roll)).toBeLessThan(1e-9);
    expect(Math.abs(r.final.yprDeg.yaw * DEG - expected)).toBeLessThan(1e-8);
  });

  it('clockwise rectangle: engine yaw equals +∬F to 1e-8 rad', () => {
    const r = simulate(body, rectangle(-1));
    expect(Math.abs(r.final.yprDeg.yaw * DEG + expected)).toBeLessThan(1e-8);
  });
});
