/* eslint-disable react/no-unknown-property -- three.js element props (geometry, position, intensity…) are not DOM attributes */
import { type ThreeElements } from '@react-three/fiber';
import { useLayoutEffect, useMemo, useRef } from 'react';
import { MeshStandardMaterial, type Object3D, SphereGeometry } from 'three';

import type { SegmentShape, BodySide } from './pose/segment-shapes';
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

/**
 * The body: one ellipsoid per segment (sized from its inertia, centred on its CoM) in the side's
 * colour, a ball at each joint, a face marker on the head. Geometry and materials are created once.
 */
export function BodyFigure({ shapes, sides, parents, headSegment, segmentRefs, ghost = false, staticPose, ...group }: ThreeElements['group'] & BodyFigureProps) {
  const res = useMemo(() => {
    const sphere = new SphereGeometry(1, ghost ? 14 : 20, ghost ? 10 : 14);
    const mat = (color: string, roughness = 0.55) =>
      new MeshStandardMaterial({ color: ghost ? scenePalette.ghost : color, roughness, metalness: 0.05, transparent: ghost, opacity: ghost ? 0.22 : 1, depthWrite: !ghost });
    return {
      sphere,
      materials: { left: mat(scenePalette.left), right: mat(scenePalette.right), centre: mat(scenePalette.centre) },
      joint: mat(scenePalette.joint, 0.7),
      visor: mat(scenePalette.visor, 0.3),
    };
  }, [ghost]);
  // Free GPU resources when the figure goes away.
  useLayoutEffect(() => () => {
    res.sphere.dispose();
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
            <mesh geometry={res.sphere} material={res.materials[sides[i]]} position={s.centre} scale={s.semiAxes} />
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
