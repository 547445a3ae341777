/* eslint-disable react/no-unknown-property -- three.js element props (geometry, position, intensity…) are not DOM attributes */
import { type ThreeElements } from '@react-three/fiber';
import { useLayoutEffect, useMemo, useRef } from 'react';
import { CapsuleGeometry, MeshStandardMaterial, type Object3D, SphereGeometry } from 'three';

import type { BodySide, SegmentShape } from './pose/segment-shapes';
import type { WorldPose } from './pose/world-pose';
import { scenePalette } from './scene-palette';

/** Own props of {@link BodyFigure}. */
export interface BodyFigureProps {
  /** Drawing shape per segment (model order). */
  shapes: readonly SegmentShape[];
  /** Side per segment: picks the colour. */
  sides: readonly BodySide[];
  /** Parent index per segment (−1 root): roots get no joint ball. */
  parents: ArrayLike<number>;
  /** Index of the head segment (gets a face marker), or −1. */
  headSegment: number;
  /** Filled with one Object3D per segment, placed at the segment frame; the caller poses them. */
  segmentRefs: React.MutableRefObject<(Object3D | null)[]>;
  /** Draw as a translucent ghost (default false). */
  ghost?: boolean;
  /** A fixed pose applied once (for the ghost); default none (the caller poses every frame). */
  staticPose?: WorldPose;
}

/** Applies a world pose to segment objects (no allocation; safe in the render loop). */
export function applyPose(pose: WorldPose, objects: readonly (Object3D | null)[]): void {
  for (let i = 0; i < objects.length; i++) {
    const o = objects[i];
    if (!o) continue;
    o.position.set(pose.pos[3 * i], pose.pos[3 * i + 1], pose.pos[3 * i + 2]);
    o.quaternion.set(pose.quat[4 * i + 1], pose.quat[4 * i + 2], pose.quat[4 * i + 3], pose.quat[4 * i]);
  }
}

/** Rotation that turns a capsule built along three's +y onto the segment's long axis (x, y or z). */
const ALONG: Record<0 | 1 | 2, [number, number, number]> = { 0: [0, 0, -Math.PI / 2], 1: [0, 0, 0], 2: [Math.PI / 2, 0, 0] };

/**
 * A rounded limb shape for one segment: a capsule as long as the segment's equivalent cylinder
 * (segment-shapes.ts), its round section stretched to the two cross-section semi-axes, so it is
 * sized from the profile's mass and inertia like the ellipsoid it replaces.
 */
function limbCapsule(s: SegmentShape, ghost: boolean): { geometry: CapsuleGeometry; rotation: [number, number, number]; scale: [number, number, number] } {
  const k = s.longAxis;
  const [i, j] = [((k + 1) % 3) as 0 | 1 | 2, ((k + 2) % 3) as 0 | 1 | 2];
  const r = Math.sqrt(s.semiAxes[i] * s.semiAxes[j]);
  const straight = Math.max(0, 2 * s.semiAxes[k] - 2 * r);
  const geometry = new CapsuleGeometry(r, straight, ghost ? 4 : 6, ghost ? 12 : 18);
  // the capsule's section is round (radius r): stretch it to the two semi-axes in the segment frame
  const scale: [number, number, number] = [1, 1, 1];
  scale[i] = s.semiAxes[i] / r;
  scale[j] = s.semiAxes[j] / r;
  // scale applies in the mesh's own (rotated) frame: map segment axes to three's capsule axes
  const local: [number, number, number] = k === 2 ? [scale[0], 1, scale[1]] : k === 0 ? [scale[1], 1, scale[2]] : [scale[0], 1, scale[2]];
  return { geometry, rotation: ALONG[k], scale: local };
}

/**
 * The body: one rounded limb shape (capsule) per segment (sized from its inertia, centred on its CoM) in the side's
 * colour, a ball at each joint, a face marker on the head. Geometry and materials are created once.
 */
export function BodyFigure({ shapes, sides, parents, headSegment, segmentRefs, ghost = false, staticPose, ...group }: ThreeElements['group'] & BodyFigureProps) {
  const res = useMemo(() => {
    const sphere = new SphereGeometry(1, ghost ? 14 : 20, ghost ? 10 : 14);
    const limbs = shapes.map((s) => limbCapsule(s, ghost));
    const mat = (color: string, roughness = 0.55) =>
      new MeshStandardMaterial({ color: ghost ? scenePalette.ghost : color, roughness, metalness: 0.05, transparent: ghost, opacity: ghost ? 0.22 : 1, depthWrite: !ghost });
    return {
      sphere,
      limbs,
      materials: { left: mat(scenePalette.left), right: mat(scenePalette.right), centre: mat(scenePalette.centre) },
      joint: mat(scenePalette.joint, 0.7),
      visor: mat(scenePalette.visor, 0.3),
    };
  }, [ghost, shapes]);
  // Free GPU resources when the figure goes away.
  useLayoutEffect(() => () => {
    res.sphere.dispose();
    res.limbs.forEach((l) => l.geometry.dispose());
    Object.values(res.materials).forEach((m) => m.dispose());
    res.joint.dispose();
    res.visor.dispose();
  }, [res]);
  const local = useRef<(Object3D | null)[]>([]);
  useLayoutEffect(() => {
    if (staticPose) applyPose(staticPose, local.current);
  }, [staticPose]);

  return (
    <group {...group}>
      {shapes.map((s, i) => {
        const jointR = Math.min(s.semiAxes[0], s.semiAxes[1], s.semiAxes[2]) * 0.9;
        return (
          <group
            key={i}
            ref={(o) => {
              local.current[i] = o;
              segmentRefs.current[i] = o;
            }}
          >
            <mesh geometry={res.limbs[i].geometry} material={res.materials[sides[i]]} position={s.centre} rotation={res.limbs[i].rotation} scale={res.limbs[i].scale} />
            {parents[i] >= 0 && !ghost ? <mesh geometry={res.sphere} material={res.joint} scale={jointR} /> : null}
            {i === headSegment && !ghost ? (
              <mesh
                geometry={res.sphere}
                material={res.visor}
                position={[s.centre[0] + s.semiAxes[0] * 0.78, s.centre[1], s.centre[2] + s.semiAxes[2] * 0.15]}
                scale={[s.semiAxes[0] * 0.3, s.semiAxes[1] * 0.7, s.semiAxes[2] * 0.32]}
              />
            ) : null}
          </group>
        );
      })}
    </group>
  );
}
