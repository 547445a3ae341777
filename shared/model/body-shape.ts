/**
 * The structural shape of a body as the body contract (DESIGN.md, "Body contract") describes it:
 * the subset that forward kinematics and whole-body inertia read. Bodies validated by the contract's
 * zod schema satisfy it.
 */

/** A 3-vector [x, y, z]. */
export type Vec3 = [number, number, number];

/** One degree of freedom: a rotation about `axis` (parent-side frame, normalised on use), range in degrees. */
export interface DofShape {
  name: string;
  axis: Vec3 | number[];
  min: number;
  max: number;
}

/** A segment of a body. Units: kg, m, kg·m². */
export interface SegmentShape {
  name: string;
  /** Parent segment's name; absent for the root. */
  parent?: string;
  /** kg */
  mass: number;
  /** CoM in the segment's own frame, m. */
  com: Vec3 | number[];
  /** About the CoM in the segment frame, kg·m²: [Ixx, Iyy, Izz] or [Ixx, Iyy, Izz, Ixy, Ixz, Iyz]. */
  inertia: number[];
  /** The joint to the parent; absent for the root. */
  joint?: { origin: Vec3 | number[]; dofs: DofShape[] };
}

/** A body: segments listed parents before children, exactly one root. */
export interface BodyShape {
  name: string;
  segments: SegmentShape[];
}
