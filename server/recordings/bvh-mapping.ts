/**
 * BVH joint rotations → the standard human model's dofs. Each mapped model segment takes one BVH
 * joint's world orientation; the rest pose is aligned bone by bone (a T-pose arm becomes 90°
 * abduction), and the segment's rotation relative to its model parent is split into the joint's
 * dof angles in the joint's own axis order (three's Euler decomposition).
 */
import { Euler, Quaternion, Vector3 } from 'three';

import type { BvhMapping, MappedSegment } from '../../shared/contracts/recording.ts';
import type { DofName } from '../../shared/model/dof-names.ts';
import { DOF_AXES } from '../model/joints.ts';
import type { BvhMotion } from './bvh-file.ts';

/** Each mapped segment: its model parent, its dofs in joint order, and its bone's rest direction in the model (reference posture). */
const SEGMENTS: Record<MappedSegment, { parent: MappedSegment | null; dofs: DofName[]; restDirection: [number, number, number] | null }> = {
  upper_trunk: { parent: null, dofs: [], restDirection: null },
  lower_trunk: { parent: 'upper_trunk', dofs: ['waist_rot', 'waist_flex'], restDirection: null },
  l_upper_arm: { parent: 'upper_trunk', dofs: ['l_sh_flex', 'l_sh_abd', 'l_sh_rot'], restDirection: [0, 0, -1] },
  l_forearm: { parent: 'l_upper_arm', dofs: ['l_elbow_flex'], restDirection: [0, 0, -1] },
  r_upper_arm: { parent: 'upper_trunk', dofs: ['r_sh_flex', 'r_sh_abd', 'r_sh_rot'], restDirection: [0, 0, -1] },
  r_forearm: { parent: 'r_upper_arm', dofs: ['r_elbow_flex'], restDirection: [0, 0, -1] },
  l_thigh: { parent: 'lower_trunk', dofs: ['l_hip_flex', 'l_hip_abd', 'l_hip_rot'], restDirection: [0, 0, -1] },
  l_shank: { parent: 'l_thigh', dofs: ['l_knee_flex'], restDirection: [0, 0, -1] },
  r_thigh: { parent: 'lower_trunk', dofs: ['r_hip_flex', 'r_hip_abd', 'r_hip_rot'], restDirection: [0, 0, -1] },
  r_shank: { parent: 'r_thigh', dofs: ['r_knee_flex'], restDirection: [0, 0, -1] },
};

/** Default joint names: the widespread Hips / Spine / Chest / … / LeftUpLeg / LeftLeg naming. */
const DEFAULT_NAMES: Record<MappedSegment, string[]> = {
  upper_trunk: ['Chest', 'Spine1', 'Spine'],
  lower_trunk: ['Hips'],
  l_upper_arm: ['LeftArm'],
  l_forearm: ['LeftForeArm'],
  r_upper_arm: ['RightArm'],
  r_forearm: ['RightForeArm'],
  l_thigh: ['LeftUpLeg'],
  l_shank: ['LeftLeg'],
  r_thigh: ['RightUpLeg'],
  r_shank: ['RightLeg'],
};

/** The default mapping for a file's joints: the first default name present per segment, else unmapped. */
export function defaultBvhMapping(jointNames: readonly string[]): BvhMapping {
  const present = new Set(jointNames);
  const joints = Object.fromEntries(
    (Object.keys(DEFAULT_NAMES) as MappedSegment[]).map((s) => [s, DEFAULT_NAMES[s].find((n) => present.has(n)) ?? '']),
  ) as Record<MappedSegment, string>;
  return { joints, facing: '+z' };
}

/** A BVH-axes quaternion [x,y,z,w] as a model-axes quaternion (x anterior, y left, z up). */
function toModel(x: number, y: number, z: number, w: number, facing: BvhMapping['facing'], out: Quaternion): Quaternion {
  // Facing +Z: model (x, y, z) = file (Z, X, Y), a cyclic permutation (a proper rotation, so the
  // vector part maps like a vector). Facing −Z: model = (−Z, −X, Y).
  return facing === '+z' ? out.set(z, x, y, w) : out.set(-z, -x, y, w);
}

/** The axis order of a joint's dofs for three's Euler ('YXZ' for flexion, abduction, rotation), completed with the unused axes. */
function eulerOrder(dofs: DofName[]): { order: 'XYZ' | 'XZY' | 'YXZ' | 'YZX' | 'ZXY' | 'ZYX'; picks: { axis: 'x' | 'y' | 'z'; sign: number }[] } {
  const picks = dofs.map((d) => {
    const a = DOF_AXES[d];
    const k = a.findIndex((v) => v !== 0);
    return { axis: (['x', 'y', 'z'] as const)[k], sign: Math.sign(a[k]) };
  });
  const used = picks.map((p) => p.axis.toUpperCase());
  const order = [...used, ...['X', 'Y', 'Z'].filter((a) => !used.includes(a))].join('') as ReturnType<typeof eulerOrder>['order'];
  return { order, picks };
}

/**
 * An Euler triple (a, b, c) and its twin (a ± π, π − b, c ± π) describe the same rotation; three
 * returns the one with |b| ≤ 90°. The smaller total angle is kept, so an arm raised past 90°
 * reads as abduction 110° rather than flexion 180°, abduction 70°, rotation 180°.
 */
function pickEulerBranch([a, b, c]: number[]): number[] {
  const wrap = (v: number) => (v > Math.PI ? v - 2 * Math.PI : v <= -Math.PI ? v + 2 * Math.PI : v);
  const twin = [wrap(a + Math.PI), wrap(Math.PI - b), wrap(c + Math.PI)];
  const cost = (t: number[]) => Math.abs(t[0]) + Math.abs(t[1]) + Math.abs(t[2]);
  return cost(twin) < cost([a, b, c]) - 1e-9 ? twin : [a, b, c];
}

/** What a mapping assumes, in words for the mapping screen. */
export function mappingAssumptions(mapping: BvhMapping, motion: BvhMotion): string[] {
  const out = [
    `The file's Y axis is up and the figure faces ${mapping.facing === '+z' ? '+Z (its left is +X)' : '−Z (its left is −X)'}; change "facing" if the figure turns the wrong way.`,
    'The trunk joints are upright in the file\'s rest pose; each limb\'s rest direction comes from its first child\'s offset (a T-pose arm counts as 90° abduction), with no twist about the bone at rest.',
    'Joints between two mapped joints (for example LeftShoulder between Chest and LeftArm) are folded into the child\'s dofs; root translation, head, hands and feet are not used.',
    `Frames are ${(1 / motion.frameTime).toFixed(3)} Hz in the file (Frame Time ${motion.frameTime} s).`,
  ];
  const unmapped = (Object.keys(SEGMENTS) as MappedSegment[]).filter((s) => !mapping.joints[s]);
  if (unmapped.length) out.push(`Not mapped (their dofs stay where the previous step left them): ${unmapped.join(', ')}.`);
  return out;
}

/** Problems with a mapping against a file: unknown joint names, a segment mapped without its parent. */
export function mappingIssues(mapping: BvhMapping, motion: BvhMotion): string[] {
  const names = new Set(motion.joints.map((j) => j.name));
  const out: string[] = [];
  for (const s of Object.keys(SEGMENTS) as MappedSegment[]) {
    const j = mapping.joints[s];
    if (!j) continue;
    if (!names.has(j)) out.push(`${s}: the file has no joint '${j}'`);
    const parent = SEGMENTS[s].parent;
    if (parent && !mapping.joints[parent]) out.push(`${s}: its parent segment ${parent} must be mapped too`);
  }
  if (!(Object.keys(SEGMENTS) as MappedSegment[]).some((s) => SEGMENTS[s].dofs.length && mapping.joints[s])) out.push('no segment with dofs is mapped');
  return out;
}

/**
 * Dof angles (degrees) per frame for a mapping that passed `mappingIssues`. Angles are unwrapped
 * frame to frame so a sweep past ±180° stays continuous.
 */
export function applyBvhMapping(motion: BvhMotion, mapping: BvhMapping): { dofs: DofName[]; frames: number[][] } {
  const segs = (Object.keys(SEGMENTS) as MappedSegment[]).filter((s) => mapping.joints[s]);
  const wanted = mapping.dofs ? new Set(mapping.dofs) : null;
  const dofs = segs.flatMap((s) => SEGMENTS[s].dofs).filter((d) => !wanted || wanted.has(d));
  // Rest alignment per segment: shortest arc from the model's rest direction to the file's bone.
  const rest = new Map<MappedSegment, Quaternion>();
  const tmp = new Quaternion();
  for (const s of segs) {
    const dir = SEGMENTS[s].restDirection, bone = motion.boneDirections.get(mapping.joints[s]);
    if (!dir || !bone || Math.hypot(...bone) === 0) { rest.set(s, new Quaternion()); continue; }
    toModel(bone[0], bone[1], bone[2], 0, mapping.facing, tmp);
    rest.set(s, new Quaternion().setFromUnitVectors(new Vector3(...dir), new Vector3(tmp.x, tmp.y, tmp.z).normalize()));
  }
  const order = new Map(segs.map((s) => [s, eulerOrder(SEGMENTS[s].dofs)]));
  const world = new Map(motion.joints.map((j) => [j.name, new Quaternion()]));
  const frame = new Map(segs.map((s) => [s, new Quaternion()]));
  const rel = new Quaternion(), e = new Euler();
  const frames: number[][] = [];
  for (let f = 0; f < motion.frameCount; f++) {
    // World orientation of every file joint (parents come first in the file).
    for (const j of motion.joints) {
      const l = motion.local.get(j.name)!;
      const w = world.get(j.name)!.set(l[4 * f], l[4 * f + 1], l[4 * f + 2], l[4 * f + 3]);
      if (j.parent) w.premultiply(world.get(j.parent)!);
    }
    // Model segment frames, then each joint's rotation relative to its parent, split into dof angles.
    for (const s of segs) {
      const w = world.get(mapping.joints[s])!;
      toModel(w.x, w.y, w.z, w.w, mapping.facing, frame.get(s)!).multiply(rest.get(s)!);
    }
    const byDof = new Map<DofName, number>();
    for (const s of segs) {
      const { parent, dofs: sd } = SEGMENTS[s];
      if (!parent || !sd.length) continue;
      rel.copy(frame.get(parent)!).invert().multiply(frame.get(s)!);
      const { order: o, picks } = order.get(s)!;
      e.setFromQuaternion(rel, o);
      const angles = pickEulerBranch([e[o[0].toLowerCase() as 'x'], e[o[1].toLowerCase() as 'x'], e[o[2].toLowerCase() as 'x']]);
      const byAxis = { [o[0].toLowerCase()]: angles[0], [o[1].toLowerCase()]: angles[1], [o[2].toLowerCase()]: angles[2] };
      sd.forEach((d, k) => byDof.set(d, (picks[k].sign * byAxis[picks[k].axis] * 180) / Math.PI));
    }
    const row = dofs.map((d) => byDof.get(d)!);
    // Unwrap against the previous frame.
    const prev = frames[frames.length - 1];
    if (prev) for (let k = 0; k < row.length; k++) row[k] += 360 * Math.round((prev[k] - row[k]) / 360);
    frames.push(row);
  }
  return { dofs, frames };
}
