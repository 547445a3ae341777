/**
 * Everything static the 3D view derives from one motion, computed once when it loads: the compiled
 * body, drawing shapes and sides, the sample track, the target ghost's pose and the head-axis path.
 */
import type { MotionResponse } from '@/shared/contracts/motion';
import { type BodyModel, compileBody } from '@/shared/kinematics/body-model';
import { createBodyPose, forwardKinematics } from '@/shared/kinematics/forward-kinematics';

import { bodyCamera } from './camera-presets';
import { trackStateAt } from './pose/interpolate';
import { createMotionTrack, type MotionTrack } from './pose/motion-track';
import { type BodySide, type SegmentShape, segmentShapes, segmentSide } from './pose/segment-shapes';
import { computeWorldPose, createWorldPose, type WorldPose } from './pose/world-pose';

/** Radius of the sphere the head-axis trail is drawn on, m. */
export const TRAIL_RADIUS_M = 1.35;

/** The static part of the scene. */
export interface SceneModel {
  model: BodyModel;
  shapes: SegmentShape[];
  sides: BodySide[];
  track: MotionTrack;
  /** Segment whose +z axis the trail follows (head if present, else the root). */
  headSegment: number;
  /** Target ghost: final posture at the target attitude. */
  ghost: WorldPose;
  /** Head-axis direction × TRAIL_RADIUS_M per sample, inertial frame, m; 3 per sample. */
  trail: Float32Array;
  /** Where the head axis points at the target attitude (final posture), m (3). */
  targetHeadPoint: Float32Array;
  /** Largest distance of any segment origin from the CoM over the motion, m (for camera framing). */
  reach: number;
  /** Body-fixed camera from the eyes: eye point and aim point in the root frame, m. */
  eyes: { eye: [number, number, number]; lookAt: [number, number, number] };
}

/** Builds the scene model; throws with a clear message if the samples do not fit the body. */
export function buildSceneModel(motion: Pick<MotionResponse, 'body' | 'samples' | 'targetAttitude'>): SceneModel {
  const model = compileBody(motion.body);
  const shapes = segmentShapes(model);
  // Sides from the reference posture.
  const ref = createBodyPose(model);
  forwardKinematics(model, new Float64Array(model.dofCount), ref);
  const sides = model.segmentNames.map((name, i) => segmentSide(name, ref.comPos[3 * i + 1]));
  const track = createMotionTrack(model, motion.samples);
  const headIdx = model.segmentNames.findIndex((n) => /head/i.test(n));
  const headSegment = headIdx >= 0 ? headIdx : 0;

  // Head-axis path and reach over every sample.
  const pose = createWorldPose(model);
  const att = new Float64Array(4), q = new Float64Array(model.dofCount);
  const trail = new Float32Array(3 * track.count);
  let reach = 0.5;
  for (let k = 0; k < track.count; k++) {
    trackStateAt(track, track.times[k], att, q);
    computeWorldPose(model, att, q, pose);
    const r = 9 * headSegment;
    trail[3 * k] = pose.rot[r + 2] * TRAIL_RADIUS_M;
    trail[3 * k + 1] = pose.rot[r + 5] * TRAIL_RADIUS_M;
    trail[3 * k + 2] = pose.rot[r + 8] * TRAIL_RADIUS_M;
    // the drawn extent: segment origin plus its shape's centre and longest semi-axis
    for (let i = 0; i < model.segmentCount; i++) {
      const sh = shapes[i];
      const extent = Math.hypot(sh.centre[0], sh.centre[1], sh.centre[2]) + Math.max(sh.semiAxes[0], sh.semiAxes[1], sh.semiAxes[2]);
      reach = Math.max(reach, Math.hypot(pose.pos[3 * i], pose.pos[3 * i + 1], pose.pos[3 * i + 2]) + extent);
    }
  }

  // Ghost: the last sample's joint angles at the target attitude.
  const ghost = createWorldPose(model);
  trackStateAt(track, track.duration, att, q);
  const t = motion.targetAttitude;
  computeWorldPose(model, [t.w, t.x, t.y, t.z], q, ghost);
  const r = 9 * headSegment;
  const targetHeadPoint = new Float32Array([ghost.rot[r + 2] * TRAIL_RADIUS_M, ghost.rot[r + 5] * TRAIL_RADIUS_M, ghost.rot[r + 8] * TRAIL_RADIUS_M]);
  // the eyes' camera: from the head's top and the soles in the reference posture (root frame)
  let feet = 0;
  for (let i = 0; i < model.segmentCount; i++) feet = Math.min(feet, ref.comPos[3 * i + 2] - shapes[i].semiAxes[2]);
  const headTop = ref.comPos[3 * headSegment + 2] + shapes[headSegment].semiAxes[2];
  const eyes = bodyCamera(headTop, feet);
  return { model, shapes, sides, track, headSegment, ghost, trail, targetHeadPoint, reach, eyes };
}
