import { describe, expect, it } from 'vitest';

import { deriveBody, type DerivedBody } from '../../server/model/derive-body.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';
import { createBodyPose, forwardKinematics } from '../../shared/kinematics/forward-kinematics.ts';
import { DOF_NAMES } from '../../shared/model/dof-names.ts';
import { mirrorSegmentName } from '../../shared/model/segment-names.ts';
import { wholeBodyInertia } from '../../shared/model/whole-body.ts';
import { PEOPLE, who } from './people.ts';
import { jointRangeRows } from './reference-tables.ts';

/** Floating-point agreement. */
const EXACT = 1e-12;

/** Root-frame position of each segment's frame origin (its proximal joint centre) in a posture (degrees). */
function jointPositions(body: DerivedBody, posture: Record<string, number>): Record<string, number[]> {
  const model = compileBody(body);
  const q = new Float64Array(model.dofCount);
  for (const [name, deg] of Object.entries(posture)) q[model.dofIndex.get(name)!] = (deg * Math.PI) / 180;
  const pose = createBodyPose(model);
  forwardKinematics(model, q, pose);
  return Object.fromEntries(model.segmentNames.map((n, i) => [n, Array.from(pose.pos.slice(3 * i, 3 * i + 3))]));
}

describe('left/right symmetry', () => {
  for (const person of PEOPLE) {
    const { body } = deriveBody(person);
    it(`${who(person)}: mirrored segments have mirrored CoM, joint origin and axes, equal mass, inertia and ranges`, () => {
      for (const s of body.segments) {
        const m = body.segments.find((x) => x.name === mirrorSegmentName(s.name))!;
        expect(m.mass).toBe(s.mass);
        expect(m.com).toEqual([s.com[0], -s.com[1] + 0, s.com[2]]);
        // mirrored in the sagittal plane: the products of inertia with y (Ixy, Iyz) change sign
        const mirrored = s.inertia.length === 6 ? [s.inertia[0], s.inertia[1], s.inertia[2], -s.inertia[3] + 0, s.inertia[4], -s.inertia[5] + 0] : s.inertia;
        expect(m.inertia.map((v) => v + 0)).toEqual(mirrored);
        // midline joints (waist) are their own mirror image: no pair to compare
        if (!s.joint || m === s) continue;
        expect(m.joint!.origin).toEqual([s.joint.origin[0], -s.joint.origin[1] + 0, s.joint.origin[2]]);
        s.joint.dofs.forEach((d, k) => {
          const md = m.joint!.dofs[k];
          // an axial vector mirrored in the sagittal plane keeps y and flips x and z
          expect(md.axis.map((v) => v + 0)).toEqual([-d.axis[0] + 0, d.axis[1], -d.axis[2] + 0]);
          expect([md.min, md.max]).toEqual([d.min, d.max]);
        });
      }
    });

    it(`${who(person)}: standing, the whole-body CoM is on the midline and y is a principal axis`, () => {
      const w = wholeBodyInertia(body);
      expect(Math.abs(w.com[1])).toBeLessThan(EXACT);
      expect(Math.abs(w.inertia[1])).toBeLessThan(EXACT);
      expect(Math.abs(w.inertia[5])).toBeLessThan(EXACT);
    });
  }

  it('mirrored postures give mirrored whole-body inertia (left arm raised vs right arm raised)', () => {
    const { body } = deriveBody({ sex: 'female', stature: 1.68, mass: 63 });
    const l = wholeBodyInertia(body, { l_sh_abd: 70, l_sh_flex: 30, l_elbow_flex: 45 });
    const r = wholeBodyInertia(body, { r_sh_abd: 70, r_sh_flex: 30, r_elbow_flex: 45 });
    expect(r.com[1]).toBeCloseTo(-l.com[1], 12);
    expect(r.inertia[1]).toBeCloseTo(-l.inertia[1], 12);
    r.principalMoments.forEach((v, k) => expect(v).toBeCloseTo(l.principalMoments[k], 12));
  });
});

describe('joint sign convention: positive angles are anatomical on both sides', () => {
  const { body } = deriveBody({ sex: 'male', stature: 1.75, mass: 75 });
  const rest = jointPositions(body, {});
  for (const side of ['l', 'r'] as const) {
    const out = side === 'l' ? 1 : -1; // lateral direction along y
    it(`${side}: shoulder flexion 90° brings the hand forward (+x)`, () => {
      const p = jointPositions(body, { [`${side}_sh_flex`]: 90 });
      expect(p[`${side}_hand`][0] - p[`${side}_upper_arm`][0]).toBeGreaterThan(0.5);
    });
    it(`${side}: shoulder abduction 90° brings the hand out to the side`, () => {
      const p = jointPositions(body, { [`${side}_sh_abd`]: 90 });
      expect(out * (p[`${side}_hand`][1] - p[`${side}_upper_arm`][1])).toBeGreaterThan(0.5);
    });
    it(`${side}: medial shoulder rotation 90° with the elbow flexed 90° points the forearm across the body`, () => {
      const p = jointPositions(body, { [`${side}_sh_rot`]: 90, [`${side}_elbow_flex`]: 90 });
      expect(out * (p[`${side}_hand`][1] - p[`${side}_forearm`][1])).toBeLessThan(-0.2);
    });
    it(`${side}: elbow flexion 90° brings the wrist forward`, () => {
      const p = jointPositions(body, { [`${side}_elbow_flex`]: 90 });
      expect(p[`${side}_hand`][0] - p[`${side}_forearm`][0]).toBeGreaterThan(0.2);
    });
    it(`${side}: hip flexion 90° brings the knee forward; abduction 30° moves it out`, () => {
      const f = jointPositions(body, { [`${side}_hip_flex`]: 90 });
      expect(f[`${side}_shank`][0] - f[`${side}_thigh`][0]).toBeGreaterThan(0.3);
      const a = jointPositions(body, { [`${side}_hip_abd`]: 30 });
      expect(out * (a[`${side}_shank`][1] - rest[`${side}_shank`][1])).toBeGreaterThan(0.15);
    });
    it(`${side}: knee flexion 90° takes the ankle backward`, () => {
      const p = jointPositions(body, { [`${side}_knee_flex`]: 90 });
      expect(p[`${side}_foot`][0] - p[`${side}_shank`][0]).toBeLessThan(-0.3);
    });
  }
  it('waist flexion 30° tilts the chest forward over the pelvis; waist rotation 30° turns the chest left', () => {
    // positions in the pelvis frame: with the chest as root, rotate back by the pelvis rotation
    const headInPelvis = (posture: Record<string, number>) => {
      const model = compileBody(body);
      const q = new Float64Array(model.dofCount);
      for (const [n, d] of Object.entries(posture)) q[model.dofIndex.get(n)!] = (d * Math.PI) / 180;
      const pose = createBodyPose(model);
      forwardKinematics(model, q, pose);
      const i = model.segmentNames.indexOf('lower_trunk');
      const h = model.segmentNames.indexOf('l_upper_arm');
      const R = pose.rot.slice(9 * i, 9 * i + 9);
      const d = [0, 1, 2].map((k) => pose.pos[3 * h + k] - pose.pos[3 * i + k]);
      // Rᵀ d: the left shoulder seen from the pelvis
      return [0, 1, 2].map((c) => R[c] * d[0] + R[3 + c] * d[1] + R[6 + c] * d[2]);
    };
    expect(headInPelvis({ waist_flex: 30 })[0]).toBeGreaterThan(0.1);
    // chest turned left: the left shoulder moves backward
    expect(headInPelvis({ waist_rot: 30 })[0]).toBeLessThan(-0.05);
  });
});

describe('unsuited ranges come from the published range-of-motion table', () => {
  // AAOS via Norkin & White, Measurement of Joint Motion, Table A.1 (upper limb);
  // Merck Manual range-of-motion table (lower limb) — the shared transcription.
  const rom = (joint: string, motion: string) => jointRangeRows().find((r) => r.joint === joint && r.motion === motion)!.range_deg;
  const { body } = deriveBody({ sex: 'female', stature: 1.6, mass: 55 });
  const dof = (name: string) => body.segments.flatMap((s) => s.joint?.dofs ?? []).find((d) => d.name === name)!;

  it('the body carries every dof of the model exactly once', () => {
    expect(body.segments.flatMap((s) => s.joint?.dofs.map((d) => d.name) ?? [])).toEqual([...DOF_NAMES]);
  });
  for (const side of ['l', 'r']) {
    it(`${side}: shoulder, elbow, hip and knee limits equal the table`, () => {
      expect([dof(`${side}_sh_flex`).min, dof(`${side}_sh_flex`).max]).toEqual([-rom('shoulder', 'extension'), rom('shoulder', 'flexion')]);
      expect(dof(`${side}_sh_abd`).max).toBe(rom('shoulder', 'abduction'));
      expect([dof(`${side}_sh_rot`).min, dof(`${side}_sh_rot`).max]).toEqual([-rom('shoulder', 'lateral_rotation'), rom('shoulder', 'medial_rotation')]);
      expect(dof(`${side}_elbow_flex`).max).toBe(rom('elbow', 'flexion'));
      expect([dof(`${side}_hip_flex`).min, dof(`${side}_hip_flex`).max]).toEqual([-rom('hip', 'hyperextension'), rom('hip', 'flexion')]);
      expect([dof(`${side}_hip_abd`).min, dof(`${side}_hip_abd`).max]).toEqual([-rom('hip', 'adduction'), rom('hip', 'abduction')]);
      expect([dof(`${side}_hip_rot`).min, dof(`${side}_hip_rot`).max]).toEqual([-rom('hip', 'lateral_rotation'), rom('hip', 'medial_rotation')]);
      expect(dof(`${side}_knee_flex`).max).toBe(rom('knee', 'flexion'));
    });
  }
});
