/**
 * The joint degrees of freedom of the standard human model, in the order the derived body lists
 * them, with their display labels (screens, the composer and cue cards). Angles in degrees; 0 is
 * the reference posture (standing, arms at the sides, palms forward). Positive values are
 * anatomical on both sides: flexion, abduction, medial (internal) rotation; `waist_rot` positive
 * turns the chest to the person's left relative to the pelvis.
 */
import { labelledNames } from '../contracts/labelled-names.ts';
import { limbOnBothSides } from './body-sides.ts';

const DOFS = labelledNames([
  ...limbOnBothSides([
    ['sh_flex', 'shoulder flexion'],
    ['sh_abd', 'shoulder abduction'],
    ['sh_rot', 'shoulder medial rotation'],
    ['elbow_flex', 'elbow flexion'],
  ]),
  ['waist_rot', 'Waist rotation (chest to the left +)'],
  ['waist_flex', 'Waist flexion'],
  ...limbOnBothSides([
    ['hip_flex', 'hip flexion'],
    ['hip_abd', 'hip abduction'],
    ['hip_rot', 'hip medial rotation'],
    ['knee_flex', 'knee flexion'],
  ]),
]);

export const DOF_NAMES = DOFS.names;

/** One dof name of the standard human model. */
export type DofName = (typeof DOF_NAMES)[number];

export const DOF_LABELS = DOFS.labels;

/** True when `name` is one of the standard human model's dofs. */
export const isDofName = DOFS.has;
