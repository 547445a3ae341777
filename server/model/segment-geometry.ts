import type { ProfileInputs, SegmentLengthKey } from '../../shared/contracts/profile-inputs.ts';
import { DE_LEVA_REFERENCE_STATURE_M, DE_LEVA_TABLE_4, type DeLevaSegment } from './data/de-leva-1996-table4.ts';
import { ANKLE_HEIGHT_PER_STATURE, BIACROMIAL_PER_STATURE, HIP_JOINT_SPACING_PER_STATURE, SHOULDER_DROP_PER_STATURE } from './proportions.ts';

/** Every length the model places segments with, m. */
export interface SegmentGeometry {
  /** Segment lengths between de Leva's landmarks (see segmentLengthsSchema), m. */
  lengths: Required<Omit<Record<SegmentLengthKey, number>, 'ankleHeight'>>;
  /** Ankle joint centre above the sole, m. */
  ankleHeight: number;
  /** Suprasternale to vertex (neck plus head), m: what stature leaves after legs and trunk. */
  supraToVertex: number;
  /** Shoulder joint centre below suprasternale, m. */
  shoulderDrop: number;
  /** Biacromial breadth, m (shoulder joint centres at ± half of it). */
  biacromialBreadth: number;
  /** Hip joint centre spacing, m. */
  hipBreadth: number;
  /** Which values came from defaults (stature scaling or proportions) rather than measurement. */
  defaulted: string[];
}

/** Profile input key → de Leva segment. */
const LENGTH_SEGMENT: Record<Exclude<SegmentLengthKey, 'ankleHeight'>, DeLevaSegment> = {
  head: 'head',
  upperTrunk: 'upper_trunk',
  middleTrunk: 'middle_trunk',
  lowerTrunk: 'lower_trunk',
  upperArm: 'upper_arm',
  forearm: 'forearm',
  hand: 'hand',
  thigh: 'thigh',
  shank: 'shank',
  foot: 'foot',
};

/** Thrown when inputs are individually valid but do not fit together; names the field. */
export class ProfileGeometryError extends Error {
  constructor(readonly field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = 'ProfileGeometryError';
  }
}

/**
 * Segment lengths and placements for one person. A length not measured is de Leva's (1996, Table 4)
 * mean length for the sex scaled by stature / the reference sample's mean stature (geometric
 * similarity: every length in proportion to stature). Suprasternale-to-vertex is what stature
 * leaves after ankle height, shank, thigh and trunk, so the standing body is exactly as tall as
 * the person.
 */
export function segmentGeometry(inputs: ProfileInputs): SegmentGeometry {
  const scale = inputs.stature / DE_LEVA_REFERENCE_STATURE_M[inputs.sex];
  const table = DE_LEVA_TABLE_4[inputs.sex];
  const defaulted: string[] = [];
  const lengths = {} as SegmentGeometry['lengths'];
  for (const [key, seg] of Object.entries(LENGTH_SEGMENT) as [keyof typeof LENGTH_SEGMENT, DeLevaSegment][]) {
    const measured = inputs.lengths[key];
    if (measured === undefined) defaulted.push(`lengths.${key}`);
    lengths[key] = measured ?? table[seg].lengthM * scale;
  }
  const ankleHeight = inputs.lengths.ankleHeight ?? ANKLE_HEIGHT_PER_STATURE * inputs.stature;
  if (inputs.lengths.ankleHeight === undefined) defaulted.push('lengths.ankleHeight');
  const biacromialBreadth = inputs.biacromialBreadth ?? BIACROMIAL_PER_STATURE[inputs.sex] * inputs.stature;
  if (inputs.biacromialBreadth === undefined) defaulted.push('biacromialBreadth');
  const hipBreadth = inputs.hipBreadth ?? HIP_JOINT_SPACING_PER_STATURE * inputs.stature;
  if (inputs.hipBreadth === undefined) defaulted.push('hipBreadth');

  const supraToVertex =
    inputs.stature - ankleHeight - lengths.shank - lengths.thigh - lengths.lowerTrunk - lengths.middleTrunk - lengths.upperTrunk;
  // mid-gonion lies above suprasternale, so the head (vertex to mid-gonion) must fit in what is left
  if (!(supraToVertex > lengths.head)) {
    throw new ProfileGeometryError(
      'lengths',
      `ankle height, shank, thigh and trunk lengths (${(inputs.stature - supraToVertex).toFixed(3)} m) plus the head ` +
        `(${lengths.head.toFixed(3)} m) exceed the stature (${inputs.stature} m)`,
    );
  }
  const shoulderDrop = SHOULDER_DROP_PER_STATURE * inputs.stature;
  if (shoulderDrop >= lengths.upperTrunk + lengths.middleTrunk) {
    throw new ProfileGeometryError('lengths.upperTrunk', 'upper and middle trunk are too short to hold the shoulder joints');
  }
  return { lengths, ankleHeight, supraToVertex, shoulderDrop, biacromialBreadth, hipBreadth, defaulted };
}
