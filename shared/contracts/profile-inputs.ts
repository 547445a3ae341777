import { z } from 'zod';

import { gearItemSchema, suitConfigSchema } from './suit.ts';

const length = (what: string) =>
  z.number().finite().positive(`${what} must be positive`).max(1.2, `${what} must be at most 1.2 m`);

/**
 * Measured segment lengths (m) that replace the stature-scaled ones, with de Leva's (1996)
 * landmarks: head VERT–MIDG (vertex to mid-gonion), upperTrunk SUPR–XYPH (suprasternale to
 * xiphoid), middleTrunk XYPH–OMPH (xiphoid to navel), lowerTrunk OMPH–MIDH (navel to mid hip joint
 * centres), upperArm shoulder–elbow joint centres, forearm elbow–wrist, hand wrist–3rd metacarpale,
 * thigh hip–knee, shank knee–ankle, foot heel–toe tip; ankleHeight: ankle joint centre above the
 * sole. One value serves both sides.
 */
export const segmentLengthsSchema = z
  .object({
    head: length('head length'),
    upperTrunk: length('upper trunk length'),
    middleTrunk: length('middle trunk length'),
    lowerTrunk: length('lower trunk length'),
    upperArm: length('upper arm length'),
    forearm: length('forearm length'),
    hand: length('hand length'),
    thigh: length('thigh length'),
    shank: length('shank length'),
    foot: length('foot length'),
    ankleHeight: length('ankle height'),
  })
  .partial()
  .strict();
/** Measured segment lengths, m; any subset. */
export type SegmentLengths = z.infer<typeof segmentLengthsSchema>;
/** The keys of {@link SegmentLengths}. */
export type SegmentLengthKey = keyof SegmentLengths;

/**
 * The inputs of an inertia profile: what the planner enters. The standard human model derives the
 * segment table (the body contract) from them.
 */
export const profileInputsSchema = z.object({
  /** Which of de Leva's tables applies. */
  sex: z.enum(['female', 'male']),
  /** Stature, m (adults: 1.2–2.3). */
  stature: z.number().finite().min(1.2, 'stature must be at least 1.2 m').max(2.3, 'stature must be at most 2.3 m'),
  /** Body mass without suit or gear, kg (30–200). */
  mass: z.number().finite().min(30, 'mass must be at least 30 kg').max(200, 'mass must be at most 200 kg'),
  /** Measured segment lengths replacing the stature-scaled ones. */
  lengths: segmentLengthsSchema.default({}),
  /** Biacromial breadth, m; places the shoulder joints. Default: a fraction of stature (see server/model/proportions.ts). */
  biacromialBreadth: z.number().finite().min(0.2, 'biacromial breadth must be at least 0.2 m').max(0.7, 'biacromial breadth must be at most 0.7 m').optional(),
  /** Distance between the hip joint centres, m; places the hips. Default: a fraction of stature. */
  hipBreadth: z.number().finite().min(0.08, 'hip breadth must be at least 0.08 m').max(0.5, 'hip breadth must be at most 0.5 m').optional(),
  /** The suit configuration worn (embedded, so a saved profile version is self-contained); null: none. */
  suit: suitConfigSchema.nullable().default(null),
  /** Carried gear items. */
  gear: z.array(gearItemSchema).max(50, 'at most 50 gear items').default([]),
});
/** Validated profile inputs (defaults applied). */
export type ProfileInputs = z.infer<typeof profileInputsSchema>;
/** Profile inputs as a client sends them (optional fields may be omitted). */
export type ProfileInputsInput = z.input<typeof profileInputsSchema>;
