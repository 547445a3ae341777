/**
 * The 3D view's pose from the engine's samples: at the sample times it equals the engine's own
 * forward kinematics (joint angles from the engine's motion plan, attitude from its result) and an
 * independent scene graph built with three.js; the system CoM stays at the origin.
 */
import { Object3D, Quaternion, Vector3 } from 'three';
import { beforeAll, describe, expect, it } from 'vitest';

import { trackStateAt } from '../../scene/pose/interpolate.ts';
import { createMotionTrack, type MotionTrack } from '../../scene/pose/motion-track.ts';
import { computeWorldPose, createWorldPose, segmentPointToWorld } from '../../scene/pose/world-pose.ts';
import { anglesAt, compileMotion } from '../../server/engine/joint-motion.ts';
import { simulate } from '../../server/engine/simulate.ts';
import { deriveBody } from '../../server/model/derive-body.ts';
import { type Body, validateBody } from '../../shared/contracts/body.ts';
import type { SimulationResult } from '../../shared/contracts/result.ts';
import { type Sequence, validateSequence } from '../../shared/contracts/sequence.ts';
import { type BodyModel, compileBody } from '../../shared/kinematics/body-model.ts';
import { createBodyPose, forwardKinematics } from '../../shared/kinematics/forward-kinematics.ts';
import { quatToMatrix } from '../../shared/math/quaternion.ts';
import { ARM_SWEEP } from '../rehearse/rehearsal-fixture.ts';

/** Agreement of two computations of the same pose in double precision, m and unitless. */
const POSE_TOL = 1e-12;
/** three.js composes in double precision too, but through its own matrix order: a looser bound. */
const THREE_TOL = 1e-9;

let body: Body, sequence: Sequence, model: BodyModel, result: SimulationResult, track: MotionTrack;
beforeAll(() => {
  const b = validateBody(deriveBody({ sex: 'male', stature: 1.79, mass: 78 }).body);
  if (!b.ok) throw new Error(b.issues[0].message);
  body = b.value;
  const s = validateSequence(ARM_SWEEP, body);
  if (!s.ok) throw new Error(s.issues[0].message);
  sequence = s.value;
  model = compileBody(body);
  result = simulate(body, sequence, { rateHz: 20 });
  track = createMotionTrack(model, result.samples);
});

/** World positions of every segment origin from the engine's plan and result at sample k. */
function enginePose(k: number): { pos: number[][]; R: number[][] } {
  const plan = compileMotion(model, sequence);
  const q = new Float64Array(model.dofCount);
  const t = result.samples.frames[k].t;
  anglesAt(plan, t, q);
  const pose = createBodyPose(model);
  forwardKinematics(model, q, pose);
  let c = [0, 0, 0];
  for (let i = 0; i < model.segmentCount; i++) c = c.map((v, a) => v + model.mass[i] * pose.comPos[3 * i + a]);
  c = c.map((v) => v / model.totalMass);
  const a = result.samples.frames[k].attitude;
  const A = quatToMatrix([a.w, a.x, a.y, a.z]);
  const pos: number[][] = [], R: number[][] = [];
  for (let i = 0; i < model.segmentCount; i++) {
    const d = [0, 1, 2].map((e) => pose.pos[3 * i + e] - c[e]);
    pos.push([0, 1, 2].map((r) => A[3 * r] * d[0] + A[3 * r + 1] * d[1] + A[3 * r + 2] * d[2]));
    const Ri: number[] = [];
    for (let r = 0; r < 3; r++) for (let col = 0; col < 3; col++) Ri.push(A[3 * r] * pose.rot[9 * i + col] + A[3 * r + 1] * pose.rot[9 * i + 3 + col] + A[3 * r + 2] * pose.rot[9 * i + 6 + col]);
    R.push(Ri);
  }
  return { pos, R };
}

describe('view pose at the sample times', () => {
  it('equals the engine’s forward kinematics for every segment at samples spread over all four steps', () => {
    const view = createWorldPose(model);
    const att = new Float64Array(4), q = new Float64Array(model.dofCount);
    for (const k of [0, 7, 20, 55, 90, 118, result.samples.frames.length - 1]) {
      trackStateAt(track, result.samples.frames[k].t, att, q);
      computeWorldPose(model, att, q, view);
      const ref = enginePose(k);
      for (let i = 0; i < model.segmentCount; i++) {
        for (let e = 0; e < 3; e++) expect(Math.abs(view.pos[3 * i + e] - ref.pos[i][e]), `t=${result.samples.frames[k].t} ${model.segmentNames[i]}`).toBeLessThan(POSE_TOL);
        for (let e = 0; e < 9; e++) expect(Math.abs(view.rot[9 * i + e] - ref.R[i][e])).toBeLessThan(POSE_TOL);
      }
    }
  });

  it('matches an independent three.js scene graph (Object3D per segment, one rotation per dof) at t = 3.2 s', () => {
    const k = result.samples.frames.findIndex((f) => Math.abs(f.t - 3.2) < 1e-9);
    expect(k).toBeGreaterThan(0);
    const att = new Float64Array(4), q = new Float64Array(model.dofCount);
    trackStateAt(track, 3.2, att, q);
    const view = createWorldPose(model);
    computeWorldPose(model, att, q, view);
    // three.js reference: the root under an object holding the attitude; each joint is a chain of objects.
    const world = new Object3D();
    world.quaternion.set(att[1], att[2], att[3], att[0]);
    const frames: Object3D[] = [];
    body.segments.forEach((s, i) => {
      let parentObj = s.parent === undefined ? world : frames[body.segments.findIndex((p) => p.name === s.parent)];
      const joint = new Object3D();
      if (s.joint) joint.position.set(...s.joint.origin);
      parentObj.add(joint);
      parentObj = joint;
      for (const d of s.joint?.dofs ?? []) {
        const r = new Object3D();
        r.quaternion.copy(new Quaternion().setFromAxisAngle(new Vector3(...d.axis).normalize(), q[model.dofIndex.get(d.name)!]));
        parentObj.add(r);
        parentObj = r;
      }
      frames[i] = parentObj;
    });
    world.updateMatrixWorld(true);
    // CoM of the three.js pose, then compare origins relative to it.
    const com = new Vector3();
    frames.forEach((f, i) => com.addScaledVector(f.localToWorld(new Vector3(...body.segments[i].com)), model.mass[i] / model.totalMass));
    frames.forEach((f, i) => {
      const p = f.getWorldPosition(new Vector3()).sub(com);
      expect(Math.abs(p.x - view.pos[3 * i])).toBeLessThan(THREE_TOL);
      expect(Math.abs(p.y - view.pos[3 * i + 1])).toBeLessThan(THREE_TOL);
      expect(Math.abs(p.z - view.pos[3 * i + 2])).toBeLessThan(THREE_TOL);
      const wq = f.getWorldQuaternion(new Quaternion());
      // Same rotation: |⟨q1, q2⟩| = 1.
      const dot = Math.abs(wq.w * view.quat[4 * i] + wq.x * view.quat[4 * i + 1] + wq.y * view.quat[4 * i + 2] + wq.z * view.quat[4 * i + 3]);
      expect(1 - dot).toBeLessThan(THREE_TOL);
    });
  });

  it('keeps the system centre of mass at the origin between samples (t = 2.437 s, mid-cycle)', () => {
    const att = new Float64Array(4), q = new Float64Array(model.dofCount);
    trackStateAt(track, 2.437, att, q);
    const view = createWorldPose(model);
    computeWorldPose(model, att, q, view);
    const c = [0, 0, 0], p = [0, 0, 0];
    for (let i = 0; i < model.segmentCount; i++) {
      segmentPointToWorld(view, i, model.com[3 * i], model.com[3 * i + 1], model.com[3 * i + 2], p);
      for (let e = 0; e < 3; e++) c[e] += (model.mass[i] * p[e]) / model.totalMass;
    }
    for (const v of c) expect(Math.abs(v)).toBeLessThan(POSE_TOL);
  });

  it('refuses samples that name a dof the body lacks, naming it', () => {
    expect(() => createMotionTrack(model, { dofs: ['tail_wag'], frames: [{ t: 0, attitude: { w: 1, x: 0, y: 0, z: 0 }, jointsDeg: [0] }] })).toThrow(/tail_wag/);
  });
});
