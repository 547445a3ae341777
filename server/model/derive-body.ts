import { type ProfileInputs, type ProfileInputsInput,profileInputsSchema } from '../../shared/contracts/profile-inputs.ts';
import { type InertiaList,inertiaList } from '../../shared/math/inertia.ts';
import type { Vec3 } from '../../shared/math/vec3.ts';
import type { DofName } from '../../shared/model/dof-names.ts';
import type { SegmentName } from '../../shared/model/segment-names.ts';
import { applyGear } from './apply-gear.ts';
import { applySuit } from './apply-suit.ts';
import { type SegmentGeometry,segmentGeometry } from './segment-geometry.ts';
import { type ModelSegment,standardHumanSegments } from './standard-human.ts';

/** A segment of the derived body, in the body contract's shape (DESIGN.md, "Body contract"). */
export interface DerivedSegment {
  name: SegmentName;
  /** Absent for the root (upper_trunk). */
  parent?: SegmentName;
  /** kg */
  mass: number;
  /** CoM in the segment frame, m. */
  com: Vec3;
  /** About the CoM, segment frame, kg·m²: [Ixx, Iyy, Izz] or [Ixx, Iyy, Izz, Ixy, Ixz, Iyz]. */
  inertia: InertiaList;
  /** Absent for the root. Origin in the parent frame (m); dof ranges in degrees. */
  joint?: { origin: Vec3; dofs: { name: DofName; axis: Vec3; min: number; max: number }[] };
}

/** The derived body as contract JSON. */
export interface DerivedBody {
  name: string;
  segments: DerivedSegment[];
}

/** What derivation returns: the body and the geometry behind it (for display and audit). */
export interface Derivation {
  body: DerivedBody;
  /** Validated inputs with defaults applied. */
  inputs: ProfileInputs;
  /** Lengths and breadths used, and which were defaulted rather than measured. */
  geometry: SegmentGeometry;
}

/** Bad profile inputs: `field` is the dotted path of the first bad field. */
export class ProfileInputError extends Error {
  constructor(readonly field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = 'ProfileInputError';
  }
}

/** The version of the derivation rules; stored beside each derived body. */
export const MODEL_VERSION = 'standard-human-1';

/**
 * Derive a crew member's body (contract JSON) from profile inputs: the standard human model
 * (de Leva 1996 Table 4, scaled by stature and mass, measured lengths overriding), then the suit,
 * then the gear (`carryingAngleDeg` overrides the model's carrying angle, for comparisons). Throws ProfileInputError (naming the field) on bad inputs; never returns a partial body.
 */
export function deriveBody(raw: ProfileInputsInput, options: { name?: string; carryingAngleDeg?: number } = {}): Derivation {
  const parsed = profileInputsSchema.safeParse(raw);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new ProfileInputError(issue.path.join('.') || '(inputs)', issue.message);
  }
  const inputs = parsed.data;
  let geometry: SegmentGeometry;
  try {
    geometry = segmentGeometry(inputs);
  } catch (err) {
    const e = err as Error & { field?: string };
    throw new ProfileInputError(e.field ?? 'lengths', e.message.replace(/^[\w.]+: /, ''));
  }
  let segments = standardHumanSegments(inputs, geometry, options.carryingAngleDeg);
  if (inputs.suit) segments = applySuit(segments, inputs.suit);
  segments = applyGear(segments, inputs.gear);
  const name = options.name ?? defaultBodyName(inputs);
  return { body: { name, segments: segments.map(toContractSegment) }, inputs, geometry };
}

/** e.g. "standard human, male, 1.75 m, 75 kg, Pressurised suit (illustrative), 1 gear item". */
function defaultBodyName(i: ProfileInputs): string {
  const parts = [`standard human, ${i.sex}, ${i.stature} m, ${i.mass} kg`];
  if (i.suit) parts.push(`${i.suit.name}${i.suit.illustrative ? ' (illustrative)' : ''}`);
  if (i.gear.length) parts.push(`${i.gear.length} gear item${i.gear.length > 1 ? 's' : ''}`);
  return parts.join(', ');
}

function toContractSegment(s: ModelSegment): DerivedSegment {
  const out: DerivedSegment = { name: s.name, mass: s.props.mass, com: [...s.props.com], inertia: inertiaList(s.props.inertia) };
  if (s.parent) out.parent = s.parent;
  if (s.joint) out.joint = { origin: [...s.joint.origin], dofs: s.joint.dofs.map((d) => ({ ...d, axis: [...d.axis] })) };
  // key order as the contract example shows it
  return s.parent ? { name: out.name, parent: out.parent, mass: out.mass, com: out.com, inertia: out.inertia, joint: out.joint } : out;
}
