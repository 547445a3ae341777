/**
 * de Leva P. (1996) Adjustments to Zatsiorsky-Seluyanov's segment inertia parameters.
 * J. Biomech. 29(9):1223-1230, Table 4 — from the project's shared transcription
 * (../shared/data/de-leva-1996-table4.csv, itself transcribed from two stored reproductions of the
 * table that agree on every value compared), copied verbatim beside this file as
 * de-leva-1996-table4.csv. The tests compare this constant with that copy.
 *
 * mass: fraction of body mass; com: CoM position from the first-named landmark (`from`) as a
 * fraction of segment length; rgSag / rgTrans / rgLong: radii of gyration about the segment CoM as
 * fractions of segment length; lengthM: mean segment length of the reference subjects (m).
 * Axis mapping used by the model (pinned by tests/model/standard-human.test.ts): `rgSag` is about
 * the sagittal (anteroposterior, body x) axis, `rgTrans` about the transverse (mediolateral, body y)
 * axis, `rgLong` about the segment's long axis — in the anatomical position (palms forward); for the
 * foot, whose long axis is body x, `rgSag` is about body z.
 */

/** Landmarks: VERT vertex, MIDG mid-gonion, SUPR suprasternale, XYPH xiphoid, OMPH omphalion,
 *  MIDH mid hip-joint centres, SJC/EJC/WJC/HJC/KJC/AJC shoulder/elbow/wrist/hip/knee/ankle joint
 *  centres, MET3 3rd metacarpale, HEEL heel, TTIP tip of the longest toe. */
export type DeLevaSegment =
  | 'head'
  | 'trunk'
  | 'upper_trunk'
  | 'middle_trunk'
  | 'lower_trunk'
  | 'upper_arm'
  | 'forearm'
  | 'hand'
  | 'thigh'
  | 'shank'
  | 'foot';

/** One row of Table 4. */
export interface DeLevaRow {
  from: string;
  to: string;
  mass: number;
  com: number;
  rgSag: number;
  rgTrans: number;
  rgLong: number;
  lengthM: number;
}

/** Sex as the table splits it. */
export type Sex = 'female' | 'male';

const row = (
  from: string, to: string, mass: number, com: number,
  rgSag: number, rgTrans: number, rgLong: number, lengthM: number,
): DeLevaRow => ({ from, to, mass, com, rgSag, rgTrans, rgLong, lengthM });

/** de Leva (1996) Table 4, both sexes. */
export const DE_LEVA_TABLE_4: Record<Sex, Record<DeLevaSegment, DeLevaRow>> = {
  male: {
    head: row('VERT', 'MIDG', 0.0694, 0.5976, 0.362, 0.376, 0.312, 0.2033),
    trunk: row('SUPR', 'MIDH', 0.4346, 0.4486, 0.372, 0.347, 0.191, 0.5319),
    upper_trunk: row('SUPR', 'XYPH', 0.1596, 0.2999, 0.716, 0.454, 0.659, 0.1707),
    middle_trunk: row('XYPH', 'OMPH', 0.1633, 0.4502, 0.482, 0.383, 0.468, 0.2155),
    lower_trunk: row('OMPH', 'MIDH', 0.1117, 0.6115, 0.615, 0.551, 0.587, 0.1457),
    upper_arm: row('SJC', 'EJC', 0.0271, 0.5772, 0.285, 0.269, 0.158, 0.2817),
    forearm: row('EJC', 'WJC', 0.0162, 0.4574, 0.276, 0.265, 0.121, 0.2689),
    hand: row('WJC', 'MET3', 0.0061, 0.79, 0.628, 0.513, 0.401, 0.0862),
    thigh: row('HJC', 'KJC', 0.1416, 0.4095, 0.329, 0.329, 0.149, 0.4222),
    shank: row('KJC', 'AJC', 0.0433, 0.4395, 0.251, 0.246, 0.102, 0.4403),
    foot: row('HEEL', 'TTIP', 0.0137, 0.4415, 0.257, 0.245, 0.124, 0.2581),
  },
  female: {
    head: row('VERT', 'MIDG', 0.0668, 0.5894, 0.33, 0.359, 0.318, 0.2002),
    trunk: row('SUPR', 'MIDH', 0.4257, 0.4151, 0.357, 0.339, 0.171, 0.5293),
    upper_trunk: row('SUPR', 'XYPH', 0.1545, 0.2077, 0.746, 0.502, 0.718, 0.1425),
    middle_trunk: row('XYPH', 'OMPH', 0.1465, 0.4512, 0.433, 0.354, 0.415, 0.2053),
    lower_trunk: row('OMPH', 'MIDH', 0.1247, 0.492, 0.433, 0.402, 0.444, 0.1815),
    upper_arm: row('SJC', 'EJC', 0.0255, 0.5754, 0.278, 0.26, 0.148, 0.2751),
    forearm: row('EJC', 'WJC', 0.0138, 0.4559, 0.261, 0.257, 0.094, 0.2643),
    hand: row('WJC', 'MET3', 0.0056, 0.7474, 0.531, 0.454, 0.335, 0.078),
    thigh: row('HJC', 'KJC', 0.1478, 0.3612, 0.369, 0.364, 0.162, 0.3685),
    shank: row('KJC', 'AJC', 0.0481, 0.4352, 0.267, 0.263, 0.092, 0.4386),
    foot: row('HEEL', 'TTIP', 0.0129, 0.4014, 0.299, 0.279, 0.139, 0.2283),
  },
};

/**
 * Mean stature of de Leva's reference subjects (m), from the same source's reference-sample
 * description as carried in the shared transcription's header (male 73.0 kg, 1.741 m; female
 * 61.9 kg, 1.735 m). Segment lengths scale from these.
 */
export const DE_LEVA_REFERENCE_STATURE_M: Record<Sex, number> = { male: 1.741, female: 1.735 };
