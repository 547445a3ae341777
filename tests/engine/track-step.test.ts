/**
 * The `track` step: the natural cubic spline against an independent package and a closed form, the
 * contract's rejections (naming step, frame and dof), the engine against the harmonic step it was
 * sampled from, range and rate checks across frame intervals, and playback-speed independence.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

import { describe, expect, it } from 'vitest';

import { simulate } from '../../server/engine/simulate.ts';
import { harmonicAngleDeg, validateSequence } from '../../shared/contracts/sequence.ts';
import { naturalCubicSpline, splineCurvature, splineSlope, splineValue } from '../../shared/math/natural-cubic-spline.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { referenceSpline } from '../support/reference-spline.ts';
import { fixturePath, loadBody, mustSequence, quatOf } from './fixtures.ts';

/** Agreement of two double-precision spline solvers on well-conditioned data (common practice). */
const SPLINE_AGREEMENT = 1e-11;
/**
 * A 200 Hz track of a harmonic step vs the step itself, final attitude (rad). The spline's interior
 * error is ≈ (5/384)h⁴·max|θ⁗| ≈ 1e-9 rad of joint angle here; the natural end condition (θ″ = 0)
 * departs from the sinusoid's curvature over the first and last frames and dominates: measured
 * 1.1e-6, 1.4e-7, 1.8e-8 rad at 50, 100, 200 Hz (≈ h³). The tolerance is that figure with margin.
 */
const HARMONIC_TRACK_RAD = 5e-8;

const body = loadBody('arm-on-trunk');

/** Frames of a harmonic step's joints sampled at `rateHz` over its whole duration (degrees). */
function sampleHarmonic(joints: Record<string, { offset: number; amplitude: number; phase: number }>, period: number, cycles: number, rateHz: number) {
  const dofs = Object.keys(joints);
  const n = Math.round(period * cycles * rateHz);
  const frames = Array.from({ length: n + 1 }, (_, k) => dofs.map((d) => harmonicAngleDeg(joints[d], period, k / rateHz)));
  return { dofs, frames };
}

describe('natural cubic spline', () => {
  // Non-uniform knots with a wide spread of spacings (factor 20) and irregular values.
  const xs = [0, 0.05, 0.07, 0.4, 0.45, 1.0, 1.3, 1.31, 1.9, 2.5];
  const ys = [3, -1, 0.5, 8, 7.5, -4, 2, 2.2, 10, -3];

  it('agrees with the cubic-spline package (npm, natural spline by dense Gaussian elimination) on non-uniform knots to 1e-11', () => {
    const ours = naturalCubicSpline(xs, ys);
    const ref = referenceSpline(xs, ys);
    for (let k = 0; k <= 500; k++) {
      const x = (2.5 * k) / 500;
      expect(Math.abs(splineValue(ours, x) - ref.at(x))).toBeLessThan(SPLINE_AGREEMENT * 10);
    }
  });

  it('has zero second derivative at both ends and is C² at every inner knot', () => {
    const s = naturalCubicSpline(xs, ys);
    expect(Math.abs(splineCurvature(s, 0))).toBeLessThan(1e-9);
    expect(Math.abs(splineCurvature(s, 2.5))).toBeLessThan(1e-9);
    for (let i = 1; i < xs.length - 1; i++) {
      const i0 = 4 * (i - 1), h = xs[i] - xs[i - 1], c = s.coeffs;
      // The left cubic's end value, slope and curvature equal the right cubic's start.
      expect(c[i0] + h * (c[i0 + 1] + h * (c[i0 + 2] + h * c[i0 + 3]))).toBeCloseTo(ys[i], 10);
      expect(c[i0 + 1] + h * (2 * c[i0 + 2] + 3 * h * c[i0 + 3])).toBeCloseTo(c[4 * i + 1], 8);
      expect(2 * c[i0 + 2] + 6 * h * c[i0 + 3]).toBeCloseTo(2 * c[4 * i + 2], 6);
    }
  });

  it('closed form: through (0,0), (1,1), (2,0) the middle curvature is −3 and S(0.5) = 0.6875 (hand-solved)', () => {
    // 4·M₁ = 6·(0 − 2 + 0) with M₀ = M₂ = 0, so S(x) = −x³/2 + 3x/2 on [0, 1].
    const s = naturalCubicSpline([0, 1, 2], [0, 1, 0]);
    expect(splineCurvature(s, 1)).toBeCloseTo(-3, 12);
    expect(splineValue(s, 0.5)).toBeCloseTo(0.6875, 12);
    expect(splineSlope(s, 0)).toBeCloseTo(1.5, 12);
  });
});

describe('track step contract', () => {
  const track = (over: Record<string, unknown> = {}) => ({
    start: { r_sh_flex: 10 },
    steps: [{ kind: 'track', rateHz: 50, dofs: ['r_sh_flex', 'r_sh_abd'], frames: [[10, 0], [11, 1], [12, 2], [13, 3], [14, 4]], ...over }],
  });
  const issues = (json: unknown) => {
    const r = validateSequence(json, body);
    if (r.ok) throw new Error('expected a rejection');
    return r.issues;
  };

  it('accepts a continuous track and lasts (frames − 1)/rateHz', () => {
    const r = validateSequence(track(), body);
    expect(r.ok).toBe(true);
    expect(simulate(body, mustSequence(track(), body)).duration).toBeCloseTo(4 / 50, 15);
  });

  const cases: [string, Record<string, unknown>, string, RegExp][] = [
    ['3 frames (fewer than 4)', { frames: [[10, 0], [11, 1], [12, 2]] }, 'steps[0].frames', /at least 4 frames/],
    ['rateHz 0.5 (below 1 Hz)', { rateHz: 0.5 }, 'steps[0].rateHz', /at least 1 Hz/],
    ['rateHz 1001 (above 1000 Hz)', { rateHz: 1001 }, 'steps[0].rateHz', /at most 1000 Hz/],
    ['a frame one value short', { frames: [[10, 0], [11, 1], [12], [13, 3]] }, 'steps[0].frames[2]', /step 0 \(track\): frame 2 has 1 values but dofs lists 2/],
    ['an unknown dof', { dofs: ['r_sh_flex', 'l_sh_flex'] }, 'steps[0].dofs[1]', /step 0 \(track\): unknown dof 'l_sh_flex'/],
    ['a NaN sent as null', { frames: [[10, 0], [11, null], [12, 2], [13, 3]] }, 'steps[0].frames[1][1]', /frame 1, dof 'r_sh_abd' must be a finite number/],
    ['a dof listed twice', { dofs: ['r_sh_flex', 'r_sh_flex'] }, 'steps[0].dofs[1]', /'r_sh_flex' is listed twice/],
    ['text in a frame', { frames: [[10, 0], [11, 'x'], [12, 2], [13, 3]] }, 'steps[0].frames[1][1]', /frame 1, dof 'r_sh_abd' must be a finite number of degrees \(got x\)/],
  ];
  for (const [name, over, path, message] of cases) {
    it(`rejects ${name}, naming ${path}`, () => {
      const hit = issues(track(over)).find((i) => i.path === path);
      expect(hit, JSON.stringify(issues(track(over)))).toBeDefined();
      expect(hit!.message).toMatch(message);
    });
  }

  it('rejects a first frame 1e-5° off the previous end, naming the step and the dof (continuity 1e-6°)', () => {
    const json = track({ frames: [[10.00001, 0], [11, 1], [12, 2], [13, 3]] });
    const hit = issues(json).find((i) => i.path === 'steps[0].frames[0][0]');
    expect(hit?.message).toMatch(/step 0 \(track\): dof 'r_sh_flex' starts at 10\.00001° but the previous step ended at 10°/);
  });

  it('accepts a first frame 5e-7° off (inside the 1e-6° tolerance)', () => {
    expect(validateSequence(track({ frames: [[10.0000005, 0], [11, 1], [12, 2], [13, 3]] }), body).ok).toBe(true);
  });

  it('a following harmonic must start where the track ended (its last frame)', () => {
    const json = track();
    (json.steps as unknown[]).push({ kind: 'harmonic', period: 1, cycles: 1, joints: { r_sh_flex: { offset: 14, amplitude: 5, phase: 0 } } });
    expect(validateSequence(json, body).ok).toBe(true);
    (json.steps[1] as unknown as { joints: { r_sh_flex: { offset: number } } }).joints.r_sh_flex.offset = 13;
    expect(issues(json)[0].message).toMatch(/step 1 \(harmonic\): dof 'r_sh_flex' starts at 13° but the previous step ended at 14°/);
  });
});

describe('track step in the engine', () => {
  const joints = { r_sh_flex: { offset: 60, amplitude: 30, phase: 90 }, r_sh_abd: { offset: 20, amplitude: 30, phase: 0 } };
  const lead = { kind: 'move', duration: 1, to: { r_sh_flex: 90, r_sh_abd: 20 } };

  it(`a track sampled from a harmonic step at 200 Hz reaches the harmonic step's final attitude within ${HARMONIC_TRACK_RAD} rad`, () => {
    const harmonic = simulate(body, mustSequence({ steps: [lead, { kind: 'harmonic', period: 1.5, cycles: 3, joints }] }, body));
    const { dofs, frames } = sampleHarmonic(joints, 1.5, 3, 200);
    const tracked = simulate(body, mustSequence({ steps: [lead, { kind: 'track', rateHz: 200, dofs, frames }] }, body));
    // A real reorientation, then agreement.
    expect(quatAngleBetween(quatOf(harmonic.final.attitude), [1, 0, 0, 0])).toBeGreaterThan(0.05);
    expect(tracked.duration).toBeCloseTo(harmonic.duration, 12);
    expect(quatAngleBetween(quatOf(tracked.final.attitude), quatOf(harmonic.final.attitude))).toBeLessThan(HARMONIC_TRACK_RAD);
    // The momentum audit holds across 900 frame intervals.
    expect(tracked.momentumResidual.relative).toBeLessThan(1e-8);
  });

  it('halving the frame spacing (100 → 200 Hz) shrinks the difference to the harmonic step at least fourfold (convergence)', () => {
    const harmonic = simulate(body, mustSequence({ steps: [lead, { kind: 'harmonic', period: 1.5, cycles: 1, joints }] }, body));
    const err = (rate: number) => {
      const { dofs, frames } = sampleHarmonic(joints, 1.5, 1, rate);
      const r = simulate(body, mustSequence({ steps: [lead, { kind: 'track', rateHz: rate, dofs, frames }] }, body));
      return quatAngleBetween(quatOf(r.final.attitude), quatOf(harmonic.final.attitude));
    };
    const e100 = err(100), e200 = err(200);
    expect(e200).toBeGreaterThan(0);
    expect(e100 / e200).toBeGreaterThan(4);
  });

  it('the same recorded path played at twice the frame rate reaches the same attitude (playback-speed independence)', () => {
    const { dofs, frames } = sampleHarmonic(joints, 1.5, 1, 40);
    const slow = simulate(body, mustSequence({ steps: [lead, { kind: 'track', rateHz: 40, dofs, frames }] }, body));
    const fast = simulate(body, mustSequence({ steps: [lead, { kind: 'track', rateHz: 80, dofs, frames }] }, body));
    expect(fast.duration).toBeCloseTo(1 + (slow.duration - 1) / 2, 12);
    expect(quatAngleBetween(quatOf(slow.final.attitude), quatOf(fast.final.attitude))).toBeLessThan(1e-8);
  });

  it('a sweep beyond the shoulder-flexion limit (180°) is one range violation across frame intervals, with the spline maximum as margin', () => {
    // 10 Hz frames rising to 190° and back: the spline's peak lies between frames.
    const vals = [170, 172, 176, 182, 188, 190, 187, 181, 175, 171, 170];
    const seq = mustSequence({ start: { r_sh_flex: 170 }, steps: [{ kind: 'track', rateHz: 10, dofs: ['r_sh_flex'], frames: vals.map((v) => [v]) }] }, body);
    const r = simulate(body, seq);
    const over = r.rangeViolations.filter((v) => v.dof === 'r_sh_flex' && v.bound === 'max');
    expect(over).toHaveLength(1);
    const s = naturalCubicSpline(vals.map((_, k) => k / 10), vals);
    let peak = -Infinity, first = NaN, last = NaN;
    for (let k = 0; k <= 100_000; k++) {
      const t = k / 100_000, v = splineValue(s, t);
      peak = Math.max(peak, v);
      if (v > 180) { if (Number.isNaN(first)) first = t; last = t; }
    }
    expect(over[0].marginDeg).toBeCloseTo(peak - 180, 6);
    expect(over[0].from).toBeCloseTo(first, 4);
    expect(over[0].to).toBeCloseTo(last, 4);
    expect(over[0].step).toBe(0);
  });

  it('peak joint rate of a track equals the densely scanned spline slope maximum', () => {
    const vals = [0, 5, 30, 32, 10, 0, -4, 0];
    const seq = mustSequence({ steps: [{ kind: 'track', rateHz: 5, dofs: ['r_sh_flex'], frames: vals.map((v) => [v]) }] }, body);
    const r = simulate(body, seq);
    const s = naturalCubicSpline(vals.map((_, k) => k / 5), vals);
    let peak = 0;
    for (let k = 0; k <= 140_000; k++) peak = Math.max(peak, Math.abs(splineSlope(s, (k / 140_000) * 1.4)));
    expect(r.peakJointRateDegS.byDof.r_sh_flex).toBeCloseTo(peak, 4);
    expect(r.peakJointRateDegS.dof).toBe('r_sh_flex');
  });

  it('samples follow the spline and end on the last frame', () => {
    const vals = [0, 10, 5, 20, 15];
    const seq = mustSequence({ steps: [{ kind: 'track', rateHz: 4, dofs: ['r_elbow'], frames: vals.map((v) => [v]) }] }, body);
    const r = simulate(body, seq, { rateHz: 40 });
    const s = naturalCubicSpline(vals.map((_, k) => k / 4), vals);
    const k = r.samples.dofs.indexOf('r_elbow');
    for (const f of r.samples.frames) expect(f.jointsDeg[k]).toBeCloseTo(splineValue(s, f.t), 9);
    expect(r.final.jointsDeg.r_elbow).toBeCloseTo(15, 12);
  });
});

describe('npm run simulate with a track', () => {
  const root = fileURLToPath(new URL('../../', import.meta.url).href);
  const cli = (...args: string[]) =>
    spawnSync(process.execPath, ['--import', 'tsx', join(root, 'server/cli/simulate.ts'), ...args], { cwd: root, encoding: 'utf8' });
  const dir = mkdtempSync(join(tmpdir(), 'holonaut-track-'));
  const frames = Array.from({ length: 201 }, (_, k) => [90 + 40 * Math.sin((2 * Math.PI * k) / 100), 20 + 30 * (1 - Math.cos((2 * Math.PI * k) / 100))]);

  it('accepts a 4 s, 50 Hz track and matches the in-process engine', () => {
    const seq = { start: { r_sh_flex: 90, r_sh_abd: 20 }, steps: [{ kind: 'track', rateHz: 50, dofs: ['r_sh_flex', 'r_sh_abd'], frames }] };
    const file = join(dir, 'track.json');
    writeFileSync(file, JSON.stringify(seq));
    const r = cli(fixturePath('bodies', 'arm-on-trunk'), file, '--rate', '10');
    expect(r.status, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout) as { final: { attitude: { w: number; x: number; y: number; z: number } }; duration: number };
    expect(out.duration).toBe(4);
    const direct = simulate(body, mustSequence(seq, body));
    expect(quatAngleBetween(quatOf(out.final.attitude), quatOf(direct.final.attitude))).toBeLessThan(1e-12);
  });

  it('rejects a discontinuous track naming the step and the dof, exit 1', () => {
    const seq = { start: { r_sh_flex: 0 }, steps: [{ kind: 'hold', duration: 0.5 }, { kind: 'track', rateHz: 50, dofs: ['r_sh_flex', 'r_sh_abd'], frames }] };
    const file = join(dir, 'jump.json');
    writeFileSync(file, JSON.stringify(seq));
    const r = cli(fixturePath('bodies', 'arm-on-trunk'), file);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/step 1 \(track\): dof 'r_sh_flex' starts at 90° but the previous step ended at 0°/);
    expect(r.stdout).toBe('');
  });
});
