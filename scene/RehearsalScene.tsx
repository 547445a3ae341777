/* eslint-disable react/no-unknown-property -- three.js element props (geometry, position, intensity…) are not DOM attributes */
import { OrbitControls } from '@react-three/drei/core/OrbitControls';
import { type RootState, useFrame, useThree } from '@react-three/fiber';
import { type RefObject, useEffect, useLayoutEffect, useMemo, useRef } from 'react';
import {
  BufferGeometry, type Camera, Float32BufferAttribute, Line, LineBasicMaterial, Matrix4, type Mesh, MeshBasicMaterial, type Object3D,
  PerspectiveCamera, Quaternion, RingGeometry, SphereGeometry, Vector3,
} from 'three';
import type { OrbitControls as OrbitControlsImpl } from 'three-stdlib';

import { AxesTriad } from './AxesTriad';
import { applyPose, BodyFigure } from './BodyFigure';
import { BODY_FOV_DEG, type CameraMode, fitDistance, OBSERVER_FOV_DEG, presetPosition, type ViewPreset } from './camera-presets';
import { InertialBackdrop } from './InertialBackdrop';
import type { PlaybackClock } from './playback/playback-clock';
import { trackStateAt } from './pose/interpolate';
import { computeWorldPose, createWorldPose, type WorldPose } from './pose/world-pose';
import type { SceneModel } from './scene-model';
import { scenePalette } from './scene-palette';

/** Own props of {@link RehearsalScene}. */
export interface RehearsalSceneProps {
  scene: SceneModel;
  /** Drives the time; advanced here every frame. */
  clock: PlaybackClock;
  /** Observer (orbit, inertial) or body-fixed camera; default observer. */
  cameraMode?: CameraMode;
  /** Observer preset; re-applied whenever `presetNonce` changes. Default front. */
  preset?: ViewPreset;
  presetNonce?: number;
  /** Pixels at the top of the canvas covered by overlays (the cue card); the view centres below them. Default 0. */
  topInset?: number;
}

/** Inertial → three.js world: −90° about x (inertial z up becomes three.js y up). */
const INERTIAL_ROTATION: [number, number, number] = [-Math.PI / 2, 0, 0];
const qInertial = new Quaternion().setFromAxisAngle(new Vector3(1, 0, 0), -Math.PI / 2);

// Scratch for the render loop (never allocate per frame).
const _q = new Quaternion();
const _v = new Vector3();
const _eye = new Vector3();

/** Camera orientation relative to the root frame for the body-fixed view (from the eyes, per body). */
function cameraInBody(eyes: SceneModel['eyes']): Quaternion {
  const m = new Matrix4().lookAt(new Vector3(...eyes.eye), new Vector3(...eyes.lookAt), new Vector3(0, 0, 1));
  return new Quaternion().setFromRotationMatrix(m);
}

/** The camera's vertical field of view, degrees: wide from the eyes, narrower for the observer. */
function setFieldOfView(camera: Camera, fovDeg: number): void {
  if (!(camera instanceof PerspectiveCamera) || camera.fov === fovDeg) return;
  camera.fov = fovDeg;
  camera.updateProjectionMatrix();
}

/** Puts the observer camera at a preset, aimed at the CoM (the orbit's centre). */
function placeObserverCamera(camera: Camera, controls: OrbitControlsImpl | null, preset: ViewPreset, distance: number): void {
  camera.position.set(...presetPosition(preset, distance));
  camera.up.set(0, 1, 0);
  camera.lookAt(0, 0, 0);
  controls?.target.set(0, 0, 0);
  controls?.update();
}

/**
 * Shifts the projection so the view's centre sits in the middle of the part of the canvas that
 * overlays do not cover (`topInset` px at the top), keeping the CoM there in every camera.
 */
function centreBelowInset(camera: Camera, width: number, height: number, topInset: number): void {
  if (!(camera instanceof PerspectiveCamera) || width <= 0 || height <= 0) return;
  if (topInset > 0) camera.setViewOffset(width, height, 0, -topInset / 2, width, height);
  else camera.clearViewOffset();
  camera.updateProjectionMatrix();
}

/** Everything one frame reads and writes. */
interface FrameContext {
  scene: SceneModel;
  clock: PlaybackClock;
  work: { pose: WorldPose; att: Float64Array; q: Float64Array };
  segments: RefObject<(Object3D | null)[]>;
  triad: RefObject<Object3D | null>;
  ring: RefObject<Mesh | null>;
  trail: Line;
  cameraMode: CameraMode;
  /** Body-fixed camera orientation in the root frame. */
  qCamInBody: Quaternion;
}

/**
 * One frame: advance the clock, interpolate the samples, pose the body, move the triad, extend the
 * trail, fade the beat ring, and carry the body-fixed camera. Mutates only preallocated objects.
 */
function advanceFrame(c: FrameContext, state: RootState, delta: number): void {
  const { scene, clock, work } = c;
  const now = state.clock.elapsedTime;
  clock.advance(delta, now);
  trackStateAt(scene.track, clock.t, work.att, work.q);
  computeWorldPose(scene.model, work.att, work.q, work.pose);
  applyPose(work.pose, c.segments.current);
  // from the eyes the own head is not in view
  const head = c.segments.current[scene.headSegment];
  if (head) head.visible = c.cameraMode !== 'body';
  // Body triad on the root segment.
  const triad = c.triad.current;
  if (triad) {
    triad.position.set(work.pose.pos[0], work.pose.pos[1], work.pose.pos[2]);
    triad.quaternion.set(work.pose.quat[1], work.pose.quat[2], work.pose.quat[3], work.pose.quat[0]);
  }
  // Trail up to the current sample.
  const n = scene.track.count;
  const k = Math.min(n, Math.max(1, Math.round((clock.t / Math.max(1e-9, scene.track.duration)) * (n - 1)) + 1));
  c.trail.geometry.setDrawRange(0, k);
  // Beat ring: bright at the beat, fading over 0.4 s while it grows a little.
  const ring = c.ring.current;
  if (ring) {
    const age = now - clock.lastBeatWall;
    const a = age >= 0 && age < 0.4 ? 1 - age / 0.4 : 0;
    (ring.material as MeshBasicMaterial).opacity = 0.85 * a;
    const s = 0.9 + 0.25 * (1 - a);
    ring.scale.set(s, s, s);
  }
  // Body-fixed camera: rigidly attached to the root segment.
  if (c.cameraMode === 'body') {
    _q.set(work.pose.quat[1], work.pose.quat[2], work.pose.quat[3], work.pose.quat[0]);
    const e = scene.eyes.eye;
    _eye.set(e[0], e[1], e[2]).applyQuaternion(_q);
    _v.set(work.pose.pos[0], work.pose.pos[1], work.pose.pos[2]).add(_eye).applyQuaternion(qInertial);
    state.camera.position.copy(_v);
    state.camera.quaternion.copy(qInertial).multiply(_q).multiply(c.qCamInBody);
  }
}

/**
 * The rehearsal scene: the body posed from the samples every frame (CoM at the origin), its axes,
 * the target ghost with its axes, the head-axis trail, a beat ring, the inertial backdrop, and the
 * observer or body-fixed camera. Everything per frame mutates preallocated objects.
 */
export function RehearsalScene({ scene, clock, cameraMode = 'observer', preset = 'front', presetNonce = 0, topInset = 0 }: RehearsalSceneProps) {
  const { model } = scene;
  const segments = useRef<(Object3D | null)[]>([]);
  const ghostSegments = useRef<(Object3D | null)[]>([]);
  const triad = useRef<Object3D>(null);
  const ring = useRef<Mesh>(null);
  const controls = useRef<OrbitControlsImpl>(null);
  const camera = useThree((s) => s.camera);
  const size = useThree((s) => s.size);
  useLayoutEffect(() => centreBelowInset(camera, size.width, size.height, topInset), [camera, size.width, size.height, topInset]);

  // Per-motion buffers, made once.
  const work = useMemo(() => ({ pose: createWorldPose(model), att: new Float64Array(4), q: new Float64Array(model.dofCount) }), [model]);
  const trail = useMemo(() => {
    const g = new BufferGeometry();
    g.setAttribute('position', new Float32BufferAttribute(scene.trail, 3));
    g.setDrawRange(0, 1);
    return new Line(g, new LineBasicMaterial({ color: scenePalette.trail, transparent: true, opacity: 0.9 }));
  }, [scene.trail]);
  const marks = useMemo(() => ({
    target: new SphereGeometry(0.035, 12, 8),
    targetMat: new MeshBasicMaterial({ color: scenePalette.ghost }),
    ring: new RingGeometry(0.98, 1.0, 64),
    ringMat: new MeshBasicMaterial({ color: scenePalette.beat, transparent: true, opacity: 0, depthWrite: false }),
  }), []);
  useEffect(() => () => {
    trail.geometry.dispose(); (trail.material).dispose();
    marks.target.dispose(); marks.targetMat.dispose(); marks.ring.dispose(); marks.ringMat.dispose();
  }, [trail, marks]);

  // Observer presets: place the camera and aim the orbit at the CoM, far enough that the whole body
  // (its reach over the motion) fits the part of the view the overlays leave free.
  const distance = fitDistance(scene.reach, size.width, size.height, topInset);
  useLayoutEffect(() => {
    setFieldOfView(camera, cameraMode === 'body' ? BODY_FOV_DEG : OBSERVER_FOV_DEG);
    if (cameraMode === 'observer') placeObserverCamera(camera, controls.current, preset, distance);
  }, [camera, cameraMode, preset, presetNonce, distance]);
  const qCamInBody = useMemo(() => cameraInBody(scene.eyes), [scene.eyes]);

  useFrame((state, delta) => advanceFrame({ scene, clock, work, segments, triad, ring, trail, cameraMode, qCamInBody }, state, delta));

  return (
    <>
      <color attach="background" args={[scenePalette.background]} />
      <ambientLight intensity={0.55} />
      <directionalLight position={[3, 5, 4]} intensity={1.6} />
      <directionalLight position={[-4, -2, -3]} intensity={0.45} />
      <InertialBackdrop />
      <group rotation={INERTIAL_ROTATION}>
        <BodyFigure shapes={scene.shapes} sides={scene.sides} parents={model.parent} headSegment={scene.headSegment} segmentRefs={segments} />
        <BodyFigure shapes={scene.shapes} sides={scene.sides} parents={model.parent} headSegment={-1} segmentRefs={ghostSegments} ghost staticPose={scene.ghost} />
        <group ref={triad}>
          <AxesTriad length={0.5} />
        </group>
        <AxesTriad
          length={0.5}
          opacity={0.45}
          position={[scene.ghost.pos[0], scene.ghost.pos[1], scene.ghost.pos[2]]}
          quaternion={[scene.ghost.quat[1], scene.ghost.quat[2], scene.ghost.quat[3], scene.ghost.quat[0]]}
        />
        <primitive object={trail} />
        <mesh geometry={marks.target} material={marks.targetMat} position={[scene.targetHeadPoint[0], scene.targetHeadPoint[1], scene.targetHeadPoint[2]]} />
        <mesh ref={ring} geometry={marks.ring} material={marks.ringMat} />
      </group>
      <OrbitControls ref={controls} makeDefault enabled={cameraMode === 'observer'} enablePan={false} minDistance={1.2} maxDistance={12} />
    </>
  );
}
