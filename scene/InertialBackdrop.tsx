/* eslint-disable react/no-unknown-property -- three.js element props (geometry, position, intensity…) are not DOM attributes */
import { useLayoutEffect, useMemo } from 'react';
import { BufferGeometry, Float32BufferAttribute, PointsMaterial } from 'three';

import { seededRandom } from '@/shared/math/seeded-random';

import { scenePalette } from './scene-palette';

/** Number of stars. */
const STAR_COUNT = 700;
/** Star sphere radius, m. */
const STAR_RADIUS = 40;

/**
 * The inertial frame made visible: a fixed star field and a square grid (the cabin deck plane,
 * 1.3 m below the centre of mass), both in three.js's world coordinates (y up = inertial z).
 */
export function InertialBackdrop() {
  const stars = useMemo(() => {
    // Seeded, so the sky is the same on every visit.
    const rnd = seededRandom(20251);
    const p: number[] = [];
    for (let i = 0; i < STAR_COUNT; i++) {
      // Uniform on the sphere.
      const z = 2 * rnd() - 1, phi = 2 * Math.PI * rnd(), r = Math.sqrt(1 - z * z);
      p.push(STAR_RADIUS * r * Math.cos(phi), STAR_RADIUS * z, STAR_RADIUS * r * Math.sin(phi));
    }
    const g = new BufferGeometry();
    g.setAttribute('position', new Float32BufferAttribute(p, 3));
    return { g, m: new PointsMaterial({ color: scenePalette.star, size: 2, sizeAttenuation: false }) };
  }, []);
  useLayoutEffect(() => () => { stars.g.dispose(); stars.m.dispose(); }, [stars]);
  return (
    <>
      <points geometry={stars.g} material={stars.m} />
      <gridHelper args={[8, 16, scenePalette.gridCentre, scenePalette.grid]} position={[0, -1.3, 0]} />
    </>
  );
}
