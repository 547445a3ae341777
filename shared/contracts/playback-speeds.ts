/**
 * The player's speeds, without zod (shared/contracts/rehearsal.ts re-exports them beside its
 * schemas), so the 3D player's chunk does not carry the zod runtime.
 */

/** Playback speeds the player offers (multiples of real time). */
export const PLAYBACK_SPEEDS = [0.25, 0.5, 1, 1.5, 2] as const;
/** Slowest and fastest playback, × real time. */
export const PLAYBACK_SPEED_RANGE = { min: 0.25, max: 2 } as const;
