/**
 * Recording imports: a joint-angle CSV (uniform and not, resampled with the natural spline) and a
 * BVH file written here (parsed by three's BVHLoader, mapped to the standard model's dofs), and bad
 * files rejected by row and column.
 */
import { Euler, Quaternion, Vector3 } from 'three';
import { describe, expect, it } from 'vitest';

import { checkBvh, readBvh } from '../../server/recordings/bvh-file.ts';
import { defaultBvhMapping } from '../../server/recordings/bvh-mapping.ts';
import { bvhTrack } from '../../server/recordings/bvh-track.ts';
import { readJointAngleCsv } from '../../server/recordings/joint-angle-csv.ts';
import { naturalCubicSpline, splineValue } from '../../shared/math/natural-cubic-spline.ts';
import { referenceSpline } from '../support/reference-spline.ts';
import { type BvhFrame, writeBvh } from './bvh-writer.ts';

/** Degrees to radians. */
const R = Math.PI / 180;

describe('joint-angle CSV', () => {
  it('keeps uniform frames as recorded at the file rate', () => {
    const rows = Array.from({ length: 11 }, (_, k) => `${(k / 50).toFixed(2)},${10 + k},${-k}`);
    const t = readJointAngleCsv(['time_s,r_sh_flex,r_sh_abd', ...rows].join('\n'));
    expect(t.errors).toEqual([]);
    expect(t.rateHz).toBe(50);
    expect(t.dofs).toEqual(['r_sh_flex', 'r_sh_abd']);
    expect(t.frames[3]).toEqual([13, -3]);
    expect(t.frames).toHaveLength(11);
  });

  it('resamples non-uniform times through the natural spline, agreeing with the cubic-spline package to 1e-9°', () => {
    const times = [0, 0.013, 0.031, 0.05, 0.058, 0.081, 0.1, 0.117, 0.142, 0.16, 0.2];
    const vals = times.map((x) => 40 * Math.sin(9 * x) + 5);
    const t = readJointAngleCsv(['time_s,l_elbow_flex', ...times.map((x, k) => `${x},${vals[k]}`)].join('\n'), 100);
    expect(t.errors).toEqual([]);
    expect(t.rateHz).toBe(100);
    expect(t.frames).toHaveLength(21);
    const ref = referenceSpline(times, vals);
    t.frames.forEach((f, k) => expect(Math.abs(f[0] - ref.at(k / 100))).toBeLessThan(1e-9));
    expect(t.assumptions.join(' ')).toMatch(/not uniform.*resampled at 100 Hz/);
  });

  const bad: [string, string, { row: number; column: string; reason: RegExp }[]][] = [
    ['an unknown column', 'time_s,r_sh_flex,r_shoulder\n0,1,2\n0.1,1,2\n0.2,1,2\n0.3,1,2', [{ row: 1, column: 'r_shoulder', reason: /unknown column/ }]],
    ['a missing time column', 'r_sh_flex\n1\n2\n3\n4', [{ row: 1, column: 'time_s', reason: /required column is missing/ }]],
    ['text in a number', 'time_s,r_sh_flex\n0,1\n0.1,2\n0.2,abc\n0.3,4', [{ row: 4, column: 'r_sh_flex', reason: /"abc" is not a number/ }]],
    ['a time going back', 'time_s,r_sh_flex\n0,1\n0.1,2\n0.05,3\n0.3,4\n0.4,5', [{ row: 4, column: 'time_s', reason: /not after the previous row's 0.1 s/ }]],
    ['a gap in time', 'time_s,r_sh_flex\n0,1\n0.1,2\n0.2,3\n0.9,4\n1.0,5\n1.1,6', [{ row: 5, column: 'time_s', reason: /a gap of 0.7000 s/ }]],
    ['an empty cell', 'time_s,r_sh_flex\n0,1\n0.1,\n0.2,3\n0.3,4', [{ row: 3, column: 'r_sh_flex', reason: /missing value/ }]],
    ['a short row', 'time_s,r_sh_flex,r_sh_abd\n0,1,2\n0.1,2\n0.2,3,4\n0.3,4,5', [{ row: 3, column: '', reason: /2 cells but the header has 3/ }]],
    ['three rows only', 'time_s,r_sh_flex\n0,1\n0.1,2\n0.2,3', [{ row: 0, column: '', reason: /at least 4 are needed/ }]],
  ];
  for (const [name, csv, want] of bad) {
    it(`rejects ${name}, naming row ${want[0].row} and column '${want[0].column}'`, () => {
      const t = readJointAngleCsv(csv);
      expect(t.frames).toEqual([]);
      for (const w of want) expect(t.errors.some((e) => e.row === w.row && e.column === w.column && w.reason.test(e.reason)), JSON.stringify(t.errors)).toBe(true);
    });
  }
});

describe('BVH', () => {
  it('reads the written skeleton with three\'s BVHLoader: joints, parents, channels, frame time', () => {
    const r = readBvh(writeBvh([{}, {}, {}, {}], 1 / 120));
    expect(r.errors).toEqual([]);
    expect(r.motion!.joints.map((j) => j.name)).toContain('LeftForeArm');
    expect(r.motion!.joints.find((j) => j.name === 'LeftArm')!.parent).toBe('LeftShoulder');
    expect(r.motion!.joints.find((j) => j.name === 'Hips')!.rotationChannels).toEqual(['Zrotation', 'Xrotation', 'Yrotation']);
    expect(r.motion!.frameTime).toBeCloseTo(1 / 120, 15);
    expect(r.motion!.frameCount).toBe(4);
  });

  it('maps single-axis rotations to the named dofs (arms hanging, Y up, facing +Z)', () => {
    // Shoulder flexion swings the arm toward +Z: −X rotation; right abduction toward −X: −Z rotation;
    // knee flexion swings the shank back: +X rotation; the chest turning left over the hips: +Y on Spine.
    const f: BvhFrame = { LeftArm: [0, -30, 0], LeftForeArm: [0, -40, 0], RightArm: [-20, 0, 0], LeftLeg: [0, 25, 0], Spine: [0, 0, 15], RightUpLeg: [0, -35, 0] };
    const r = readBvh(writeBvh([f, f, f, f], 1 / 60));
    const t = bvhTrack(r.motion!, defaultBvhMapping(r.motion!.joints.map((j) => j.name)));
    if (!t.ok) throw new Error(t.issues.join('; '));
    const at = (d: string) => t.frames[0][t.dofs.indexOf(d)];
    const want: Record<string, number> = { l_sh_flex: 30, l_sh_abd: 0, l_elbow_flex: 40, r_sh_abd: 20, r_sh_flex: 0, l_knee_flex: 25, waist_rot: 15, waist_flex: 0, r_hip_flex: 35 };
    for (const [d, v] of Object.entries(want)) expect(at(d), d).toBeCloseTo(v, 4);
    expect(t.rateHz).toBeCloseTo(60, 9);
  });

  it('a T-pose rest counts as 90° abduction; the right arm raised 20° above it reads 110°', () => {
    const r = readBvh(writeBvh([{ RightArm: [-20, 0, 0] }, {}, {}, {}], 1 / 30, 't-pose'));
    const t = bvhTrack(r.motion!, defaultBvhMapping(r.motion!.joints.map((j) => j.name)));
    if (!t.ok) throw new Error(t.issues.join('; '));
    expect(t.frames[0][t.dofs.indexOf('l_sh_abd')]).toBeCloseTo(90, 4);
    expect(t.frames[0][t.dofs.indexOf('r_sh_abd')]).toBeCloseTo(110, 4);
    expect(t.frames[0][t.dofs.indexOf('r_sh_flex')]).toBeCloseTo(0, 4);
    expect(t.assumptions.join(' ')).toMatch(/T-pose arm counts as 90° abduction/);
  });

  it('recovers combined shoulder angles: the model joint Rot(−y, flex)·Rot(x, abd)·Rot(−z, rot) written as the file\'s ZXY channels', () => {
    // Left shoulder dof axes in the model: flexion −y, abduction +x, rotation −z (server/model/joints.ts).
    const cases = [[40, 25, 10], [-20, 60, -30], [100, 15, 45]];
    const frames: BvhFrame[] = cases.map(([fl, ab, ro]) => {
      const qm = new Quaternion().setFromAxisAngle(new Vector3(0, -1, 0), fl * R)
        .multiply(new Quaternion().setFromAxisAngle(new Vector3(1, 0, 0), ab * R))
        .multiply(new Quaternion().setFromAxisAngle(new Vector3(0, 0, -1), ro * R));
      // Model (x, y, z) = file (Z, X, Y): file quaternion (x, y, z) = model (y, z, x).
      const qf = new Quaternion(qm.y, qm.z, qm.x, qm.w);
      const e = new Euler().setFromQuaternion(qf, 'ZXY');
      return { LeftArm: [e.z / R, e.x / R, e.y / R] };
    });
    frames.push({}, {});
    const r = readBvh(writeBvh(frames, 0.01));
    const t = bvhTrack(r.motion!, defaultBvhMapping(r.motion!.joints.map((j) => j.name)));
    if (!t.ok) throw new Error(t.issues.join('; '));
    cases.forEach(([fl, ab, ro], k) => {
      expect(t.frames[k][t.dofs.indexOf('l_sh_flex')]).toBeCloseTo(fl, 3);
      expect(t.frames[k][t.dofs.indexOf('l_sh_abd')]).toBeCloseTo(ab, 3);
      expect(t.frames[k][t.dofs.indexOf('l_sh_rot')]).toBeCloseTo(ro, 3);
    });
  });

  it('resampling a BVH track follows the natural spline through the file frames', () => {
    const frames: BvhFrame[] = Array.from({ length: 13 }, (_, k) => ({ LeftForeArm: [0, -(30 + 40 * Math.sin(k / 2)), 0] }));
    const r = readBvh(writeBvh(frames, 0.04));
    const t = bvhTrack(r.motion!, defaultBvhMapping(r.motion!.joints.map((j) => j.name)), 100);
    if (!t.ok) throw new Error(t.issues.join('; '));
    const s = naturalCubicSpline(frames.map((_, k) => k * 0.04), frames.map((_, k) => 30 + 40 * Math.sin(k / 2)));
    const j = t.dofs.indexOf('l_elbow_flex');
    t.frames.forEach((f, k) => expect(f[j]).toBeCloseTo(splineValue(s, k / 100), 3));
  });

  const good = writeBvh([{}, {}, {}, {}], 0.01);
  const lineOf = (text: string, needle: string) => text.split('\n').findIndex((l) => l.includes(needle)) + 1;
  const bad: [string, () => string, (text: string) => { row: number; column: string; reason: RegExp }][] = [
    ['a joint\'s channels missing from a frame', () => good.replace(/\n(0 90 0 [^\n]*) 0 0 0\n/, '\n$1\n'), (x) => ({ row: lineOf(x, 'Frame Time') + 1, column: '', reason: /has 57 values but the hierarchy declares 60 channels/ })],
    ['text in a number', () => good.replace(/(Frame Time: 0.01\n0 90 0 )0/, '$1abc'), (x) => ({ row: lineOf(x, 'Frame Time') + 1, column: 'Hips Zrotation', reason: /"abc" is not a number/ })],
    ['a frame count mismatch', () => good.replace('Frames: 4', 'Frames: 5'), (x) => ({ row: x.split('\n').length, column: 'Frames', reason: /"Frames: 5" but the file holds 4 frame lines/ })],
    ['a joint without CHANNELS', () => good.replace(/(JOINT Neck\n\{\nOFFSET 0 15 0\n)CHANNELS 3 Zrotation Xrotation Yrotation\n/, '$1'), (x) => ({ row: lineOf(x, 'JOINT Neck'), column: 'CHANNELS', reason: /'Neck' has no CHANNELS line/ })],
    ['an unknown channel', () => good.replace('CHANNELS 3 Zrotation Xrotation Yrotation', 'CHANNELS 3 Zrotation Xrotation Wrotation'), (x) => ({ row: lineOf(x, 'Wrotation'), column: 'CHANNELS', reason: /unknown channel 'Wrotation'/ })],
    ['no MOTION section', () => good.slice(0, good.indexOf('MOTION')), (x) => ({ row: x.split('\n').length, column: 'MOTION', reason: /MOTION section is missing/ })],
  ];
  for (const [name, make, want] of bad) {
    it(`rejects ${name}, naming the line`, () => {
      const text = make();
      expect(text).not.toBe(good);
      const w = want(text);
      const { errors } = checkBvh(text);
      expect(errors.some((e) => e.row === w.row && e.column === w.column && w.reason.test(e.reason)), JSON.stringify(errors)).toBe(true);
      expect(readBvh(text).motion).toBeNull();
    });
  }
});
