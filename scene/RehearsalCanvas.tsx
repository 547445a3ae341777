import { Canvas } from '@react-three/fiber';
import { useMemo } from 'react';

import type { CameraMode, ViewPreset } from './camera-presets';
import type { PlaybackClock } from './playback/playback-clock';
import { RehearsalScene } from './RehearsalScene';
import type { SceneModel } from './scene-model';
import { scenePalette } from './scene-palette';

/** Props of {@link RehearsalCanvas}. */
export interface RehearsalCanvasProps {
  scene: SceneModel;
  clock: PlaybackClock;
  /** Default observer. */
  cameraMode?: CameraMode;
  /** Default front. */
  preset?: ViewPreset;
  /** Bump to re-apply the same preset. Default 0. */
  presetNonce?: number;
  /** Pixels at the top covered by overlays; default 0. */
  topInset?: number;
  /** Accessible description of the view. */
  label?: string;
}

/** The WebGL canvas of the rehearsal view (fills its parent). */
export default function RehearsalCanvas({ scene, clock, cameraMode, preset, presetNonce, topInset, label }: RehearsalCanvasProps) {
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
      <RehearsalScene scene={scene} clock={clock} cameraMode={cameraMode} preset={preset} presetNonce={presetNonce} topInset={topInset} />
    </Canvas>
  );
}
