import type { ProfileInputs } from '../../shared/contracts/profile-inputs.ts';
import { rotateTensor } from '../../shared/math/inertia.ts';
import { quatFromAxisAngle, quatToMatrix } from '../../shared/math/quaternion.ts';
import type { Vec3 } from '../../shared/math/vec3.ts';
import type { DofName } from '../../shared/model/dof-names.ts';
import type { SegmentName } from '../../shared/model/segment-names.ts';
import { DE_LEVA_TABLE_4, type DeLevaSegment, type Sex } from './data/de-leva-1996-table4.ts';
import { type ModelDof,unsuitedDofs } from './joints.ts';
import { combineMassProperties, type MassProperties } from './mass-properties.ts';
import { CARRYING_ANGLE_DEG, HEEL_BEHIND_ANKLE_PER_FOOT_LENGTH } from './proportions.ts';
import type { SegmentGeometry } from './segment-geometry.ts';
import { deLevaPrincipalInertia, type LongAxis } from './segment-inertia.ts';

/** A segment of the model before it is written out as contract JSON. */
export interface ModelSegment {
  name: SegmentName;
  /** Parent segment; undefined for the root. */
  parent?: SegmentName;
  /** Mass, CoM (segment frame, m) and inertia about the CoM (segment frame, kg·m²). */
  props: MassProperties;
  /** Joint to the parent: origin in the parent frame (m) and dofs; undefined for the root. */
  joint?: { origin: Vec3; dofs: ModelDof[] };
}

/** The 14 segments of de Leva's model (trunk as upper, middle and lower trunk; limbs twice). */
const MODEL_SEGMENTS: readonly DeLevaSegment[] = [
  'head', 'upper_trunk', 'middle_trunk', 'lower_trunk',
  'upper_arm', 'upper_arm', 'forearm', 'forearm', 'hand', 'hand',
  'thigh', 'thigh', 'shank', 'shank', 'foot', 'foot',
];

/**
 * Sum of the table's mass fractions over the model's segments. The published fractions are rounded
 * to four places: they sum to 1.0000 for men and 0.9999 for women. Each segment's mass is its
 * published fraction × body mass / this sum, so the residue (0.01 % for women) is spread over the
 * segments in proportion to their fractions and the body weighs exactly what was entered.
 */
export function tableMassSum(sex: Sex): number {
  const t = DE_LEVA_TABLE_4[sex];
  return MODEL_SEGMENTS.reduce((sum, seg) => sum + t[seg].mass, 0);
}

/**
 * The unsuited standard human model for one person: 15 segments from de Leva (1996) Table 4.
 * Frames (all parallel to the body frame in the reference posture: x anterior, y left, z head;
 * standing, arms at the sides, palms forward):
 * - upper_trunk (root): origin at the waist joint — omphalion (navel) level on the midline. It holds
 *   de Leva's upper trunk (SUPR–XYPH) and the whole middle trunk (XYPH–OMPH), combined by the
 *   parallel-axis theorem: the thorax and the abdomen above the navel turn with the chest, so the
 *   waist joint sits at the omphalion, de Leva's boundary between middle and lower trunk.
 * - lower_trunk: de Leva's lower trunk (OMPH–MIDH, the pelvis), origin at the waist joint.
 * - head_neck: origin at suprasternale (rigid neck); CoM on the midline at de Leva's fraction of
 *   VERT–MIDG below the vertex, the vertex at stature height.
 * - limbs: origin at the proximal joint centre, the long axis along −z, CoM on it at de Leva's
 *   fraction from the proximal joint; forearm and hand slant outward by the carrying angle
 *   (proportions.ts), their inertia turned with them. Shoulder joint centres at ± half the biacromial breadth, hip
 *   joint centres at ± half the hip breadth. Feet lie along +x below the ankle.
 * All segment CoMs lie in the sagittal plane of their segment (x = 0) except the foot's.
 */
export function standardHumanSegments(inputs: ProfileInputs, g: SegmentGeometry, carryingAngleDeg: number = CARRYING_ANGLE_DEG[inputs.sex]): ModelSegment[] {
  const t = DE_LEVA_TABLE_4[inputs.sex];
  const L = g.lengths;
  // the published fractions keep their precision; their rounding residue is spread in proportion
  const massScale = inputs.mass / tableMassSum(inputs.sex);
  const part = (seg: DeLevaSegment, length: number, com: Vec3, longAxis: LongAxis = 'z'): MassProperties => {
    const mass = t[seg].mass * massScale;
    return { mass, com, inertia: deLevaPrincipalInertia(t[seg], mass, length, longAxis) };
  };
  const zXyph = L.middleTrunk;
  const zSupr = L.middleTrunk + L.upperTrunk;

  // trunk above the waist: upper trunk + middle trunk
  const upperTrunk = combineMassProperties(
    part('upper_trunk', L.upperTrunk, [0, 0, zSupr - t.upper_trunk.com * L.upperTrunk]),
    part('middle_trunk', L.middleTrunk, [0, 0, zXyph - t.middle_trunk.com * L.middleTrunk]),
  );
  const segments: ModelSegment[] = [
    { name: 'upper_trunk', props: upperTrunk },
    {
      name: 'head_neck',
      parent: 'upper_trunk',
      props: part('head', L.head, [0, 0, g.supraToVertex - t.head.com * L.head]),
      joint: { origin: [0, 0, zSupr], dofs: [] },
    },
  ];

  // arms: shoulder (flexion, abduction, medial rotation), elbow flexion, rigid wrist
  for (const side of ['l', 'r'] as const) {
    const y = ((side === 'l' ? 1 : -1) * g.biacromialBreadth) / 2;
    const dof = (n: string) => `${side}_${n}` as DofName;
    // forearm and hand slant outward by the carrying angle (frames stay parallel to the body's)
    const slant = ((side === 'l' ? 1 : -1) * carryingAngleDeg * Math.PI) / 180;
    const down = (d: number): Vec3 => [0, Math.sin(slant) * d, -Math.cos(slant) * d];
    const slanted = (p: MassProperties): MassProperties => ({ ...p, inertia: rotateTensor(quatToMatrix(quatFromAxisAngle([1, 0, 0], slant)), p.inertia) });
    segments.push(
      {
        name: `${side}_upper_arm`,
        parent: 'upper_trunk',
        props: part('upper_arm', L.upperArm, [0, 0, -t.upper_arm.com * L.upperArm]),
        joint: { origin: [0, y, zSupr - g.shoulderDrop], dofs: unsuitedDofs([dof('sh_flex'), dof('sh_abd'), dof('sh_rot')]) },
      },
      {
        name: `${side}_forearm`,
        parent: `${side}_upper_arm`,
        props: slanted(part('forearm', L.forearm, down(t.forearm.com * L.forearm))),
        joint: { origin: [0, 0, -L.upperArm], dofs: unsuitedDofs([dof('elbow_flex')]) },
      },
      {
        name: `${side}_hand`,
        parent: `${side}_forearm`,
        props: slanted(part('hand', L.hand, down(t.hand.com * L.hand))),
        joint: { origin: down(L.forearm), dofs: [] },
      },
    );
  }

  // pelvis below the waist: waist rotation and flexion
  segments.push({
    name: 'lower_trunk',
    parent: 'upper_trunk',
    props: part('lower_trunk', L.lowerTrunk, [0, 0, -t.lower_trunk.com * L.lowerTrunk]),
    joint: { origin: [0, 0, 0], dofs: unsuitedDofs(['waist_rot', 'waist_flex']) },
  });

  // legs: hip (flexion, abduction, medial rotation), knee flexion, rigid ankle
  const heelX = -HEEL_BEHIND_ANKLE_PER_FOOT_LENGTH * L.foot;
  for (const side of ['l', 'r'] as const) {
    const y = ((side === 'l' ? 1 : -1) * g.hipBreadth) / 2;
    const dof = (n: string) => `${side}_${n}` as DofName;
    segments.push(
      {
        name: `${side}_thigh`,
        parent: 'lower_trunk',
        props: part('thigh', L.thigh, [0, 0, -t.thigh.com * L.thigh]),
        joint: { origin: [0, y, -L.lowerTrunk], dofs: unsuitedDofs([dof('hip_flex'), dof('hip_abd'), dof('hip_rot')]) },
      },
      {
        name: `${side}_shank`,
        parent: `${side}_thigh`,
        props: part('shank', L.shank, [0, 0, -t.shank.com * L.shank]),
        joint: { origin: [0, 0, -L.thigh], dofs: unsuitedDofs([dof('knee_flex')]) },
      },
      {
        name: `${side}_foot`,
        parent: `${side}_shank`,
        props: part('foot', L.foot, [heelX + t.foot.com * L.foot, 0, -g.ankleHeight / 2], 'x'),
        joint: { origin: [0, 0, -L.shank], dofs: [] },
      },
    );
  }
  return segments;
}
