/**
 * The body contract (DESIGN.md "Body contract"): a tree of rigid segments in SI units with joint
 * limits in degrees. Frame convention: x anterior, y to the person's left, z toward the head.
 */
import { z } from 'zod';

import { checkInertia } from '../math/inertia.ts';
import { type ContractIssue, type ContractResult, zodIssuesToContract } from './contract-issue.ts';

const finite = (what: string) =>
  z.number({ error: (iss) => (iss.input === undefined ? `${what} is required` : `${what} must be a finite number (NaN/Infinity not allowed)`) });

const vec3 = (what: string) => z.tuple([finite(what), finite(what), finite(what)], { error: `${what} must be an array of 3 numbers` });

/** One rotational degree of freedom; angles in degrees, axis any non-zero vector (normalised by the engine). */
export const dofSchema = z.object({
  /** Unique dof name across the body, e.g. `r_sh_flex`. */
  name: z.string().min(1, 'dof name must not be empty'),
  /** Rotation axis in the frame left by the previous dofs of the same joint; non-zero, unitless. */
  axis: vec3('axis'),
  /** Lower joint limit, degrees. */
  min: finite('min'),
  /** Upper joint limit, degrees. */
  max: finite('max'),
});
/** A dof as written in the contract. */
export type Dof = z.infer<typeof dofSchema>;

/** The joint that attaches a segment to its parent. `dofs: []` is a rigid joint. */
export const jointSchema = z.object({
  /** Joint centre in the parent's frame, metres. */
  origin: vec3('origin'),
  /** Rotations applied in listed order, each about its axis in the frame left by the previous ones. */
  dofs: z.array(dofSchema),
});
/** A joint as written in the contract. */
export type Joint = z.infer<typeof jointSchema>;

/** One rigid segment. */
export const segmentSchema = z.object({
  /** Unique segment name. */
  name: z.string().min(1, 'segment name must not be empty'),
  /** Parent segment name; absent only for the root. */
  parent: z.string().min(1).optional(),
  /** Mass, kg (> 0). */
  mass: finite('mass'),
  /** Centre of mass in the segment's own frame, metres. */
  com: vec3('com'),
  /**
   * Inertia about the CoM in the segment frame, kg·m²: [Ixx, Iyy, Izz] or [Ixx, Iyy, Izz, Ixy, Ixz, Iyz]
   * where the last three are the tensor's own off-diagonal entries.
   */
  inertia: z.union([
    z.tuple([finite('inertia'), finite('inertia'), finite('inertia')]),
    z.tuple([finite('inertia'), finite('inertia'), finite('inertia'), finite('inertia'), finite('inertia'), finite('inertia')]),
  ], { error: 'inertia must be [Ixx, Iyy, Izz] or [Ixx, Iyy, Izz, Ixy, Ixz, Iyz] (finite numbers, kg·m²)' }),
  /** Attachment to the parent (required for every non-root segment, absent on the root). */
  joint: jointSchema.optional(),
});
/** A segment as written in the contract. */
export type Segment = z.infer<typeof segmentSchema>;

/** The whole body: a name and its segments, parents listed before children, exactly one root. */
export const bodySchema = z.object({
  /** Display name of the body. */
  name: z.string(),
  /** Segments; the first without `parent` is the root. */
  segments: z.array(segmentSchema).min(1, 'a body needs at least one segment'),
});
/** A body as written in the contract (angles in degrees, SI units). */
export type Body = z.infer<typeof bodySchema>;

function describeBodyPath(raw: unknown, path: readonly PropertyKey[]): string {
  if (path[0] !== 'segments' || typeof path[1] !== 'number') return '';
  const seg = (raw as { segments?: { name?: unknown }[] }).segments?.[path[1]];
  const name = seg && typeof seg.name === 'string' ? seg.name : `#${path[1]}`;
  return `segment '${name}'`;
}

/** Checks the tree, names, physics of each segment; returns issues naming segment, field and reason. */
function checkBodySemantics(body: Body): ContractIssue[] {
  const issues: ContractIssue[] = [];
  const add = (i: number, field: string, reason: string) =>
    issues.push({ path: `segments[${i}]${field ? '.' + field : ''}`, message: `segment '${body.segments[i].name}': ${field || 'segment'}: ${reason}` });
  const index = new Map<string, number>();
  const dofOwner = new Map<string, string>();

  body.segments.forEach((s, i) => {
    if (index.has(s.name)) add(i, 'name', `duplicate segment name '${s.name}' (also segments[${index.get(s.name)}])`);
    else index.set(s.name, i);
  });

  let rootIndex = -1;
  body.segments.forEach((s, i) => {
    // Tree structure: one root, known parents, no cycles, parents first.
    if (s.parent === undefined) {
      if (rootIndex >= 0) add(i, 'parent', `two roots: '${body.segments[rootIndex].name}' and '${s.name}' both have no parent`);
      else rootIndex = i;
      if (s.joint) add(i, 'joint', 'the root segment has no parent and must not have a joint');
    } else {
      const p = index.get(s.parent);
      if (p === undefined) add(i, 'parent', `unknown parent '${s.parent}'`);
      else if (inCycle(body, i, index)) add(i, 'parent', `cycle: following parents from '${s.name}' comes back to it`);
      else if (p >= i) add(i, 'parent', `parent '${s.parent}' is listed after its child (parents must come first)`);
      if (!s.joint) add(i, 'joint', 'a segment with a parent needs a joint ({ origin, dofs })');
    }
    // Mass and inertia.
    if (!(s.mass > 0)) add(i, 'mass', `mass must be positive (got ${s.mass} kg)`);
    const { moments, problem } = checkInertia(s.inertia, 'definite');
    const listed = moments.map((e) => e.toPrecision(4)).join(', ');
    if (problem === 'not_positive') {
      add(i, 'inertia', `inertia tensor is not positive definite (principal moments ${listed} kg·m²)`);
    } else if (problem === 'triangle') {
      add(i, 'inertia', `principal moments ${listed} kg·m² break the triangle inequality (the two smaller must sum to at least the largest)`);
    }
    // Dofs: non-zero axes, unique names, ordered limits.
    s.joint?.dofs.forEach((d, k) => {
      const f = `joint.dofs[${k}]`;
      if (Math.hypot(d.axis[0], d.axis[1], d.axis[2]) < 1e-12) add(i, `${f}.axis`, `dof '${d.name}' has a zero axis`);
      if (dofOwner.has(d.name)) add(i, `${f}.name`, `duplicate dof name '${d.name}' (also on segment '${dofOwner.get(d.name)}')`);
      else dofOwner.set(d.name, s.name);
      if (d.min > d.max) add(i, `${f}.min`, `dof '${d.name}' has min ${d.min}° above max ${d.max}°`);
    });
  });
  if (rootIndex < 0 && body.segments.length > 0) {
    issues.push({ path: 'segments', message: 'segments: no root (every segment has a parent, so the parents form a cycle)' });
  }
  return issues;
}

function inCycle(body: Body, start: number, index: Map<string, number>): boolean {
  let cur: number | undefined = start;
  for (let n = 0; n <= body.segments.length; n++) {
    const parent: string | undefined = body.segments[cur].parent;
    if (parent === undefined) return false;
    cur = index.get(parent);
    if (cur === undefined) return false;
    if (cur === start) return true;
  }
  return true;
}

/**
 * Validates untrusted JSON against the body contract: shape, finiteness, tree structure, names,
 * mass, inertia (positive definite, triangle inequality on principal moments) and axes.
 */
export function validateBody(json: unknown): ContractResult<Body> {
  const parsed = bodySchema.safeParse(json);
  if (!parsed.success) return { ok: false, issues: zodIssuesToContract(parsed.error, (p) => describeBodyPath(json, p)) };
  const issues = checkBodySemantics(parsed.data);
  return issues.length ? { ok: false, issues } : { ok: true, value: parsed.data };
}

/** Names of all dofs of a body in listing order (segment order, then joint order). */
export function bodyDofNames(body: Body): string[] {
  return body.segments.flatMap((s) => s.joint?.dofs.map((d) => d.name) ?? []);
}
