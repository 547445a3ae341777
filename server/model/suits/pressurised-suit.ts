import type { SuitConfigInput } from '../../../shared/contracts/suit.ts';
import { sameOnBothSides } from '../../../shared/model/body-sides.ts';

/**
 * A pressurised suit with a life-support backpack. ILLUSTRATIVE values throughout: suited ranges of
 * motion were not found in a readable published table, so the ranges below are placeholders that
 * show how a suit narrows motion; masses are placeholders in the order of magnitude published for
 * EVA suits (up to about 140 kg including life support — Kim et al., "Human modeling tools for
 * spacesuit and hardware design"). Added inertias are those of simple shapes (boxes, cylinders,
 * a spherical shell) of plausible size, about the added mass's own CoM, segment frame.
 */
export const PRESSURISED_SUIT = {
  id: 'pressurised-suit',
  name: 'Pressurised suit',
  illustrative: true,
  note:
    'Illustrative values, not measured. Suited ranges are placeholders (no readable published table of suited ranges was found); ' +
    'about 116 kg added: hard upper torso and backpack 70 kg (CoM 0.15 m behind the trunk axis), helmet 5 kg, lower torso 8 kg, ' +
    'arm and leg assemblies, gloves and boots. Waist flexion is locked by the hard upper torso. Replace with the actual suit\'s data.',
  segments: {
    // hard upper torso 20 kg at the trunk axis + backpack 50 kg (box 0.2 × 0.5 × 0.55 m) 0.21 m behind it
    upper_trunk: { mass: 70, com: [-0.15, 0, 0.3], inertia: [2.9, 2.56, 2.34] },
    // helmet: thin spherical shell, radius 0.2 m
    head_neck: { mass: 5, inertia: [0.13, 0.13, 0.13] },
    // lower torso assembly: cylinder r 0.2 m, h 0.25 m
    lower_trunk: { mass: 8, inertia: [0.12, 0.12, 0.16] },
    ...sameOnBothSides({
      // arm assemblies: cylinders r 0.07 / 0.06 m along the segment
      upper_arm: { mass: 3, inertia: [0.026, 0.026, 0.0074] },
      forearm: { mass: 2.5, inertia: [0.0174, 0.0174, 0.0045] },
      hand: { mass: 0.8, inertia: [0.002, 0.002, 0.001] },
      // leg assemblies: cylinders r 0.09 / 0.07 m along the segment
      thigh: { mass: 4, inertia: [0.0669, 0.0669, 0.0162] },
      shank: { mass: 3.5, inertia: [0.0608, 0.0608, 0.0086] },
      // boots: long axis along x
      foot: { mass: 2.5, inertia: [0.004, 0.02, 0.02] },
    }),
  },
  ranges: {
    waist_rot: { min: -15, max: 15 },
    ...sameOnBothSides({
      sh_flex: { min: -20, max: 130 },
      sh_abd: { min: 0, max: 110 },
      sh_rot: { min: -40, max: 40 },
      elbow_flex: { min: 0, max: 120 },
      hip_flex: { min: -10, max: 70 },
      hip_abd: { min: -10, max: 25 },
      hip_rot: { min: -20, max: 20 },
      knee_flex: { min: 0, max: 90 },
    }),
  },
  lockedDofs: ['waist_flex'],
} satisfies SuitConfigInput;
