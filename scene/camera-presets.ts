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

/** Vertical field of view of the observer camera, degrees. */
export const OBSERVER_FOV_DEG = 45;
/** Vertical field of view of the body-fixed camera, degrees: wide, as the eyes see arms and legs. */
export const BODY_FOV_DEG = 100;

/**
 * Observer distance (m) that keeps a sphere of `radius` m about the CoM wholly in view: the sphere
 * must fit the narrower of the horizontal field and the part of the vertical field the overlays
 * leave free (`topInset` px of `height` at the top; the view is centred below it), with a margin.
 */
export function fitDistance(radius: number, width: number, height: number, topInset = 0, fovDeg = OBSERVER_FOV_DEG, margin = 1.08): number {
  const tanV = Math.tan((fovDeg * Math.PI) / 360);
  if (!(width > 0 && height > 0)) return radius * margin / Math.sin(Math.atan(tanV));
  const free = Math.max(0.3, (height - Math.max(0, topInset)) / height);
  const half = Math.min(Math.atan(tanV * free), Math.atan((tanV * width) / height));
  return (radius * margin) / Math.sin(half);
}

/**
 * Body-fixed camera from the eyes (root frame, m): the eye point a hand's length in front of the
 * face, looking down so both the arms in front and the legs below stay in the wide field of view.
 * `headTop` is the vertex height above the root origin; `feet` the height of the soles (negative).
 */
export function bodyCamera(headTop: number, feet: number): { eye: [number, number, number]; lookAt: [number, number, number] } {
  // a little in front of the face, so the chest does not hide the legs below
  const eyeZ = headTop - 0.08;
  return { eye: [0.34, 0, eyeZ], lookAt: [0.22, 0, feet * 0.55] };
}
