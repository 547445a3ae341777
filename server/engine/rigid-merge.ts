/**
 * Rigid joints folded into their parents for the body-rate computation: a segment whose joint has
 * no dofs moves exactly with its parent (translated by the joint origin, never rotated), so the
 * two form one rigid body with the summed mass, the mass-weighted CoM and the inertia moved to that
 * CoM (parallel-axis theorem). I_lock and h are the same sums grouped differently (round-off only),
 * and the right-hand side poses fewer segments (hands, feet and head on the standard model).
 * The momentum audit keeps the full model: it checks every segment independently.
 */
import type { BodyModel } from '../../shared/kinematics/body-model.ts';

/** The model with every dof-less non-root segment merged into the nearest ancestor that has dofs (or the root). Same dofs, same order. */
export function mergeRigidSegments(model: BodyModel): BodyModel {
  const { parent, origin, com, mass, inertia, dofStart } = model;
  const n = model.segmentCount;
  // host[i]: the kept segment that carries i; off: i's frame origin in the host's frame (m).
  const host = new Int32Array(n), off = new Float64Array(3 * n), newIndex = new Int32Array(n).fill(-1);
  const keep: number[] = [];
  for (let i = 0; i < n; i++) {
    const p = parent[i];
    if (p >= 0 && dofStart[i] === dofStart[i + 1]) {
      host[i] = host[p];
      for (let a = 0; a < 3; a++) off[3 * i + a] = off[3 * p + a] + origin[3 * i + a];
    } else {
      host[i] = i;
      newIndex[i] = keep.length;
      keep.push(i);
    }
  }
  if (keep.length === n) return model;
  const m = keep.length;
  const rParent = new Int32Array(m), rOrigin = new Float64Array(3 * m), rCom = new Float64Array(3 * m);
  const rMass = new Float64Array(m), rInertia = new Float64Array(9 * m), rDofStart = new Int32Array(m + 1);
  keep.forEach((i, k) => {
    const p = parent[i];
    rParent[k] = p < 0 ? -1 : newIndex[host[p]];
    // The joint origin, given in the parent's frame, moved into the host's frame (no rotation between them).
    if (p >= 0) for (let a = 0; a < 3; a++) rOrigin[3 * k + a] = off[3 * p + a] + origin[3 * i + a];
    rDofStart[k] = dofStart[i];
  });
  rDofStart[m] = dofStart[n];
  // Mass and CoM of each host's group, in the host's frame.
  for (let i = 0; i < n; i++) {
    const k = newIndex[host[i]];
    rMass[k] += mass[i];
    for (let a = 0; a < 3; a++) rCom[3 * k + a] += mass[i] * (off[3 * i + a] + com[3 * i + a]);
  }
  for (let k = 0; k < m; k++) for (let a = 0; a < 3; a++) rCom[3 * k + a] /= rMass[k];
  // Inertia about the group CoM: Σ J_i + m_i(|d|²E − d dᵀ), d = segment CoM − group CoM.
  for (let i = 0; i < n; i++) {
    const k = newIndex[host[i]];
    const d0 = off[3 * i] + com[3 * i] - rCom[3 * k], d1 = off[3 * i + 1] + com[3 * i + 1] - rCom[3 * k + 1], d2 = off[3 * i + 2] + com[3 * i + 2] - rCom[3 * k + 2];
    const dd = d0 * d0 + d1 * d1 + d2 * d2;
    for (let r = 0; r < 3; r++) {
      const dr = r === 0 ? d0 : r === 1 ? d1 : d2;
      for (let c = 0; c < 3; c++) rInertia[9 * k + 3 * r + c] += inertia[9 * i + 3 * r + c] + mass[i] * ((r === c ? dd : 0) - dr * (c === 0 ? d0 : c === 1 ? d1 : d2));
    }
  }
  return {
    segmentCount: m, dofCount: model.dofCount, segmentNames: keep.map((i) => model.segmentNames[i]), dofNames: model.dofNames,
    parent: rParent, origin: rOrigin, com: rCom, mass: rMass, totalMass: model.totalMass, inertia: rInertia,
    dofStart: rDofStart, dofAxis: model.dofAxis, dofMin: model.dofMin, dofMax: model.dofMax, dofIndex: model.dofIndex,
  };
}
