import type { BodyShape, Vec3 } from './body-shape.ts';
import { axisAngleMatrix, identity3, mul3, mulVec3, type Mat3 } from './mat3.ts';
import type { Posture } from './reference-posture.ts';

/** A segment's pose in the root frame: its frame's origin (m) and rotation (segment → root). */
export interface SegmentPose {
  name: string;
  origin: Vec3;
  rotation: Mat3;
}

/**
 * Forward kinematics of a contract body for one posture, in the root segment's frame.
 * A child's frame = parent frame moved by `joint.origin`, then rotated by Rot(axis₁,θ₁)·Rot(axis₂,θ₂)·…
 * (DESIGN.md, "Body contract"). `posture` holds degrees by dof name; omitted dofs are 0.
 * Written here (pure, no server imports) so the member page can show posture-dependent inertia.
 */
export function segmentPoses(body: BodyShape, posture: Posture = {}): SegmentPose[] {
  const byName = new Map<string, SegmentPose>();
  const poses: SegmentPose[] = [];
  for (const seg of body.segments) {
    let pose: SegmentPose;
    if (seg.parent === undefined) {
      pose = { name: seg.name, origin: [0, 0, 0], rotation: identity3() };
    } else {
      const parent = byName.get(seg.parent);
      if (!parent) throw new Error(`segment "${seg.name}": parent "${seg.parent}" is not listed before it`);
      if (!seg.joint) throw new Error(`segment "${seg.name}": a child segment needs a joint`);
      const offset = mulVec3(parent.rotation, seg.joint.origin);
      let rotation = parent.rotation;
      for (const dof of seg.joint.dofs) {
        const deg = posture[dof.name] ?? 0;
        if (!Number.isFinite(deg)) throw new Error(`posture: dof "${dof.name}" is not a finite number`);
        rotation = mul3(rotation, axisAngleMatrix(dof.axis, (deg * Math.PI) / 180));
      }
      pose = {
        name: seg.name,
        origin: [parent.origin[0] + offset[0], parent.origin[1] + offset[1], parent.origin[2] + offset[2]],
        rotation,
      };
    }
    byName.set(seg.name, pose);
    poses.push(pose);
  }
  return poses;
}
