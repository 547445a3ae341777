import { Canvas } from '@react-three/fiber';
import { useMemo } from 'react';

import { RehearsalScene, type RehearsalSceneProps } from './RehearsalScene';
import { scenePalette } from './scene-palette';

/** Props of {@link RehearsalCanvas}: the scene's own props plus the canvas's accessible description. */
export interface RehearsalCanvasProps extends RehearsalSceneProps {
  /** Accessible description of the view. */
  label?: string;
}

/** The WebGL canvas of the rehearsal view (fills its parent). */
export default function RehearsalCanvas({ label, ...sceneProps }: RehearsalCanvasProps) {
  const style = useMemo(() => ({ width: '100%', height: '100%', background: scenePalette.background, touchAction: 'none' as const }), []);
  return (
    <Canvas
      style={style}
      dpr={[1, 2]}
      camera={{ fov: 45, near: 0.05, far: 200, position: [3, 0.6, 0.5] }}
      // No MSAA: on phones the device pixel ratio already smooths edges, and multisampling is the
      // costliest part of a frame in software WebGL.
      gl={{ antialias: false, powerPreference: 'high-performance' }}
      aria-label={label}
      data-testid="rehearsal-canvas"
    >
      <RehearsalScene {...sceneProps} />
    </Canvas>
  );
}
