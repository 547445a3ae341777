import type { ProfileInputsInput } from '../../shared/contracts/profile-inputs.ts';

/** Fixed adult inputs spanning both sexes and a range of sizes (invented people). */
export const PEOPLE: ProfileInputsInput[] = [
  { sex: 'male', stature: 1.75, mass: 75 },
  { sex: 'female', stature: 1.65, mass: 60 },
  { sex: 'male', stature: 1.62, mass: 58 },
  { sex: 'female', stature: 1.8, mass: 82 },
  { sex: 'male', stature: 1.92, mass: 101 },
];

/** A short label for test names. */
export const who = (p: ProfileInputsInput) => `${p.sex} ${p.stature} m ${p.mass} kg`;
