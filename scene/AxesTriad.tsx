/* eslint-disable react/no-unknown-property -- three.js element props (geometry, position, intensity…) are not DOM attributes */
import { type ThreeElements } from '@react-three/fiber';
import { useLayoutEffect, useMemo } from 'react';
import { BufferGeometry, Float32BufferAttribute, LineBasicMaterial } from 'three';

import { scenePalette } from './scene-palette';

/** Own props of {@link AxesTriad}. */
export interface AxesTriadProps {
  /** Arrow length, m (default 0.45). */
  length?: number;
  /** Opacity (default 1; the target markers use less). */
  opacity?: number;
}

/** Body axes x (anterior), y (left), z (head) as three coloured lines from the origin of its group. */
export function AxesTriad({ length = 0.45, opacity = 1, ...group }: ThreeElements['group'] & AxesTriadProps) {
  const lines = useMemo(() => {
    const make = (dir: [number, number, number], color: string) => {
      const g = new BufferGeometry();
      g.setAttribute('position', new Float32BufferAttribute([0, 0, 0, dir[0] * length, dir[1] * length, dir[2] * length], 3));
      return { g, m: new LineBasicMaterial({ color, transparent: opacity < 1, opacity }) };
    };
    return [make([1, 0, 0], scenePalette.axisX), make([0, 1, 0], scenePalette.axisY), make([0, 0, 1], scenePalette.axisZ)];
  }, [length, opacity]);
  useLayoutEffect(() => () => lines.forEach(({ g, m }) => { g.dispose(); m.dispose(); }), [lines]);
  return (
    <group {...group}>
      {lines.map(({ g, m }, i) => (
        <lineSegments key={i} geometry={g} material={m} />
      ))}
    </group>
  );
}
