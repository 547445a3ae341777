import type { Sex } from './data/de-leva-1996-table4.ts';

/**
 * Body proportions the regression table does not give, as fractions of stature. Each is an
 * approximation; the planner overrides them with measurements where they matter.
 */

/**
 * Height of the ankle joint centre above the sole: 0.039 × stature (Drillis & Contini 1966 body
 * proportions as reproduced in Winter, Biomechanics and Motor Control of Human Movement, Fig. 4.1 —
 * typed from memory).
 */
export const ANKLE_HEIGHT_PER_STATURE = 0.039;

/**
 * Drop of the shoulder (glenohumeral) joint centre below suprasternale: 0.03 × stature (≈5 cm in an
 * adult; common practice approximation, from memory). With de Leva's lengths this puts the shoulder
 * joint near 0.81 × stature and the fingertips near 0.38 × stature, as Winter's proportions have them.
 */
export const SHOULDER_DROP_PER_STATURE = 0.03;

/**
 * Default biacromial breadth per stature when not measured (the shoulder joint centres are placed
 * half of it either side of the midline, under the acromia — an approximation). Ratios of mean
 * biacromial breadth to mean stature in the 2012 US Army anthropometric survey (ANSUR II):
 * men ≈ 406/1756 mm, women ≈ 366/1628 mm — typed from memory.
 */
export const BIACROMIAL_PER_STATURE: Record<Sex, number> = { male: 0.231, female: 0.225 };

/**
 * Default distance between the hip joint centres per stature when not measured: 0.1 × stature
 * (≈0.17–0.18 m in adults; common practice approximation, from memory).
 */
export const HIP_JOINT_SPACING_PER_STATURE = 0.1;

/**
 * The heel point lies behind the ankle joint centre by 0.2 × foot length (common practice
 * approximation, from memory); the foot's CoM lies halfway between the sole and the ankle joint
 * centre (approximation).
 */
export const HEEL_BEHIND_ANKLE_PER_FOOT_LENGTH = 0.2;

/**
 * Carrying angle: in the anatomical position (elbows straight, palms forward) the forearm and hand
 * angle away from the body by this much relative to the upper arm, so the hands hang beside the
 * hips rather than under the shoulders. Typical adult values of 10–15°, larger in women (anatomy
 * texts, from memory): men 11°, women 14° here. This places forearm and hand mass further from the
 * long axis, which brings the long-axis moment closer to measured subjects (tests/model/whole-body-inertia.test.ts).
 */
export const CARRYING_ANGLE_DEG: Record<Sex, number> = { male: 11, female: 14 };
