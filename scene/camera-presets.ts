/**
 * Camera placements in three.js world coordinates. The scene maps the inertial frame (x anterior at
 * t = 0, y left, z head) into three.js (y up) by a −90° turn about x: inertial (x, y, z) → (x, z, −y).
 */

/** Preset observer views. */
export type ViewPreset = 'front' | 'side' | 'above';
/** Camera mode: fixed in the inertial frame (orbit), or fixed to the body. */
export type CameraMode = 'observer' | 'body';

/** Maps an inertial-frame point (m) to three.js world coordinates. */
export function inertialToThree(x: number, y: number, z: number): [number, number, number] {
  return [x, z, -y];
}

/**
 * Observer camera position for a preset at `distance` m from the CoM: front = in front of the
 * initial chest (+x), side = at the person's left (+y), above = over the head (+z, slightly forward
 * so the orbit has a defined up direction).
 */
export function presetPosition(preset: ViewPreset, distance: number): [number, number, number] {
  switch (preset) {
    case 'front': return inertialToThree(distance, distance * 0.18, distance * 0.22);
    case 'side': return inertialToThree(distance * 0.12, distance, distance * 0.2);
    case 'above': return inertialToThree(distance * 0.08, 0.001, distance);
  }
}

/** Body-fixed camera: eye behind and above the shoulders, looking past the head (root frame, m). */
export const BODY_CAMERA_EYE: [number, number, number] = [-1.5, 0, 0.95];
export const BODY_CAMERA_LOOK_AT: [number, number, number] = [0.9, 0, 0.05];
