/**
 * How a recorded execution compares with the plan, step by step: for every sweep (harmonic step) of
 * the plan and every recorded dof it moves, the recorded angle inside the step is fitted with
 * c + a·sin(ω′τ) + b·cos(ω′τ) by linear least squares at each trial frequency ω′ (a 1-D search,
 * refined by golden section), giving the period ratio (ω/ω′), the amplitude ratio (√(a²+b²)/|A|) and
 * the phase lag at the step's start, in seconds (positive: the recording is late). The recording's
 * first frame is taken as the plan's t = 0.
 */
import type { Sequence, TrackStep } from '../../shared/contracts/sequence.ts';
import { stepDuration } from '../../shared/contracts/sequence.ts';
import { type CubicSpline, naturalCubicSpline, splineValue, uniformKnots } from '../../shared/math/natural-cubic-spline.ts';

/** A recorded track: frames (degrees, order of `dofs`) at a uniform rate. */
export interface RecordedTrack {
  rateHz: number;
  dofs: string[];
  frames: number[][];
}

/** One dof's figures in one sweep step. */
export interface DofTiming {
  dof: string;
  /** Recorded period / planned period. */
  periodRatio: number;
  /** Recorded amplitude / planned amplitude. */
  amplitudeRatio: number;
  /** Seconds the recording lags the plan at the step's start (negative: early), within ±half a period. */
  phaseLagS: number;
  /** RMS of the fit's residual, degrees (how sinusoidal the recorded motion was). */
  fitRmsDeg: number;
}

/** The figures of one plan step (amplitude-weighted means over its dofs). */
export interface StepTiming {
  /** Index of the step in the compiled sequence. */
  step: number;
  startS: number;
  endS: number;
  periodRatio: number;
  amplitudeRatio: number;
  phaseLagS: number;
  dofs: DofTiming[];
}

/** Share of each end of a step left out of the fit (the joins to the neighbouring steps). */
const EDGE_SHARE = 0.1;
/** Fit points per planned period. */
const POINTS_PER_PERIOD = 40;
/** Trial frequencies ω′/ω searched, then refined. */
const RATIO_RANGE: [number, number] = [0.5, 2];

/** Least squares of y ≈ c + a·sin(wτ) + b·cos(wτ): coefficients and residual sum of squares. */
function fitSinusoid(tau: number[], y: number[], w: number): { c: number; a: number; b: number; sse: number } {
  // Normal equations (3×3), solved by Cramer's rule.
  let n = 0, S = 0, C = 0, SS = 0, CC = 0, SC = 0, Y = 0, YS = 0, YC = 0;
  for (let k = 0; k < tau.length; k++) {
    const s = Math.sin(w * tau[k]), c = Math.cos(w * tau[k]), v = y[k];
    n++; S += s; C += c; SS += s * s; CC += c * c; SC += s * c; Y += v; YS += v * s; YC += v * c;
  }
  const M = [[n, S, C], [S, SS, SC], [C, SC, CC]], r = [Y, YS, YC];
  const det = (m: number[][]) => m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) - m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) + m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0]);
  const D = det(M);
  const col = (k: number) => det(M.map((row, i) => row.map((v, j) => (j === k ? r[i] : v))));
  const c0 = col(0) / D, a = col(1) / D, b = col(2) / D;
  let sse = 0;
  for (let k = 0; k < tau.length; k++) { const e = y[k] - (c0 + a * Math.sin(w * tau[k]) + b * Math.cos(w * tau[k])); sse += e * e; }
  return { c: c0, a, b, sse };
}

/** Wraps an angle to (−π, π]. */
const wrapPi = (x: number) => x - 2 * Math.PI * Math.floor((x + Math.PI) / (2 * Math.PI));

/** One dof of one harmonic step against the recorded spline. */
function dofTiming(spline: CubicSpline, t0: number, t1: number, period: number, j: { offset: number; amplitude: number; phase: number }, dof: string): DofTiming {
  const w = (2 * Math.PI) / period;
  // Planned as |A|·sin(ωτ + φ): a negative amplitude is a half-turn of phase.
  const A = Math.abs(j.amplitude), phi = (j.phase * Math.PI) / 180 + (j.amplitude < 0 ? Math.PI : 0);
  const a0 = t0 + EDGE_SHARE * (t1 - t0), a1 = t1 - EDGE_SHARE * (t1 - t0);
  const n = Math.max(16, Math.ceil(((a1 - a0) / period) * POINTS_PER_PERIOD));
  const tau: number[] = [], y: number[] = [];
  for (let k = 0; k <= n; k++) { const t = a0 + ((a1 - a0) * k) / n; tau.push(t - t0); y.push(splineValue(spline, t)); }
  // Coarse search of ω′, then golden section around the best.
  let best = RATIO_RANGE[0], bestSse = Infinity;
  for (let k = 0; k <= 150; k++) {
    const ratio = RATIO_RANGE[0] * Math.pow(RATIO_RANGE[1] / RATIO_RANGE[0], k / 150);
    const f = fitSinusoid(tau, y, w * ratio);
    if (f.sse < bestSse) { bestSse = f.sse; best = ratio; }
  }
  let lo = best / 1.01, hi = best * 1.01;
  const g = (Math.sqrt(5) - 1) / 2;
  for (let it = 0; it < 60; it++) {
    const m1 = hi - g * (hi - lo), m2 = lo + g * (hi - lo);
    if (fitSinusoid(tau, y, w * m1).sse < fitSinusoid(tau, y, w * m2).sse) hi = m2; else lo = m1;
  }
  const ratio = (lo + hi) / 2, wr = w * ratio;
  const f = fitSinusoid(tau, y, wr);
  const Ar = Math.hypot(f.a, f.b), phir = Math.atan2(f.b, f.a);
  // A recording late by δ: |A|·sin(ω′(τ − δ) + φ), so φ_r = φ − ω′δ.
  return {
    dof, periodRatio: 1 / ratio, amplitudeRatio: A > 0 ? Ar / A : NaN,
    phaseLagS: wrapPi(phi - phir) / wr, fitRmsDeg: Math.sqrt(f.sse / tau.length),
  };
}

/** Per sweep step of the plan, the timing and amplitude of the recorded motion (dofs the recording lacks are skipped). */
export function compareExecution(plan: Sequence, recording: RecordedTrack): StepTiming[] {
  const knots = uniformKnots(recording.frames.length, recording.rateHz);
  const splines = new Map(recording.dofs.map((d, j) => [d, naturalCubicSpline(knots, recording.frames.map((f) => f[j]))]));
  const out: StepTiming[] = [];
  let t = 0;
  plan.steps.forEach((step, index) => {
    const t0 = t, t1 = t + stepDuration(step);
    t = t1;
    if (step.kind !== 'harmonic') return;
    const dofs = Object.entries(step.joints)
      .filter(([d, j]) => splines.has(d) && j.amplitude !== 0 && t1 <= knots[knots.length - 1] + 1e-9)
      .map(([d, j]) => ({ j, timing: dofTiming(splines.get(d)!, t0, t1, step.period, j, d) }));
    if (!dofs.length) return;
    const wsum = dofs.reduce((s, d) => s + Math.abs(d.j.amplitude), 0);
    const mean = (k: 'periodRatio' | 'amplitudeRatio' | 'phaseLagS') => dofs.reduce((s, d) => s + Math.abs(d.j.amplitude) * d.timing[k], 0) / wsum;
    out.push({ step: index, startS: t0, endS: t1, periodRatio: mean('periodRatio'), amplitudeRatio: mean('amplitudeRatio'), phaseLagS: mean('phaseLagS'), dofs: dofs.map((d) => d.timing) });
  });
  return out;
}

/**
 * The recording as a sequence to simulate: one track step from the plan's start posture, with the
 * recorded dofs starting at their first frame.
 */
export function recordingSequence(plan: Sequence, recording: RecordedTrack): Sequence {
  const start = { ...plan.start };
  recording.dofs.forEach((d, j) => (start[d] = recording.frames[0][j]));
  const step: TrackStep = { kind: 'track', rateHz: recording.rateHz, dofs: [...recording.dofs], frames: recording.frames };
  return { start, steps: [step] };
}
