/**
 * The compiled, read-only body model: flat typed arrays in tree order (parents before children),
 * radians inside. Built once from a validated body contract; shared by the engine and the 3D view.
 */
import type { Body } from '../contracts/body.ts';
import { inertiaTensor } from '../math/inertia.ts';

/** Read-only compiled body. Indices: segment i in contract order, dof k in listing order. */
export interface BodyModel {
  /** Number of segments. */
  readonly segmentCount: number;
  /** Number of dofs. */
  readonly dofCount: number;
  /** Segment names, contract order. */
  readonly segmentNames: readonly string[];
  /** Dof names, listing order. */
  readonly dofNames: readonly string[];
  /** Parent index per segment; −1 for the root (index 0 after validation order). */
  readonly parent: Int32Array;
  /** Joint origin in the parent frame, m; 3 per segment (zeros for the root). */
  readonly origin: Float64Array;
  /** CoM in the segment frame, m; 3 per segment. */
  readonly com: Float64Array;
  /** Mass per segment, kg. */
  readonly mass: Float64Array;
  /** Sum of segment masses, kg. */
  readonly totalMass: number;
  /** Inertia about the segment CoM in the segment frame, kg·m², row-major 3×3; 9 per segment. */
  readonly inertia: Float64Array;
  /** Segment i's dofs are dofStart[i] … dofStart[i+1]−1. Length segmentCount + 1. */
  readonly dofStart: Int32Array;
  /** Unit axis per dof, in the frame left by the joint's previous dofs; 3 per dof. */
  readonly dofAxis: Float64Array;
  /** Lower/upper limits per dof, rad. */
  readonly dofMin: Float64Array;
  readonly dofMax: Float64Array;
  /** Dof index by name. */
  readonly dofIndex: ReadonlyMap<string, number>;
}

/** Compiles a validated body contract (root first, parents before children) into a BodyModel. */
export function compileBody(body: Body): BodyModel {
  const n = body.segments.length;
  const segIndex = new Map(body.segments.map((s, i) => [s.name, i]));
  const dofNames = body.segments.flatMap((s) => s.joint?.dofs.map((d) => d.name) ?? []);
  const nd = dofNames.length;
  const parent = new Int32Array(n);
  const origin = new Float64Array(3 * n);
  const com = new Float64Array(3 * n);
  const mass = new Float64Array(n);
  const inertia = new Float64Array(9 * n);
  const dofStart = new Int32Array(n + 1);
  const dofAxis = new Float64Array(3 * nd);
  const dofMin = new Float64Array(nd);
  const dofMax = new Float64Array(nd);
  const deg = Math.PI / 180;
  let k = 0;
  body.segments.forEach((s, i) => {
    parent[i] = s.parent === undefined ? -1 : (segIndex.get(s.parent) ?? -1);
    mass[i] = s.mass;
    com.set(s.com, 3 * i);
    inertia.set(inertiaTensor(s.inertia), 9 * i);
    if (s.joint) origin.set(s.joint.origin, 3 * i);
    dofStart[i] = k;
    for (const d of s.joint?.dofs ?? []) {
      const len = Math.hypot(d.axis[0], d.axis[1], d.axis[2]);
      dofAxis[3 * k] = d.axis[0] / len; dofAxis[3 * k + 1] = d.axis[1] / len; dofAxis[3 * k + 2] = d.axis[2] / len;
      dofMin[k] = d.min * deg; dofMax[k] = d.max * deg;
      k++;
    }
  });
  dofStart[n] = k;
  let totalMass = 0;
  for (let i = 0; i < n; i++) totalMass += mass[i];
  return {
    segmentCount: n, dofCount: nd, segmentNames: body.segments.map((s) => s.name), dofNames,
    parent, origin, com, mass, totalMass, inertia, dofStart, dofAxis, dofMin, dofMax,
    dofIndex: new Map(dofNames.map((name, i) => [name, i])),
  };
}
