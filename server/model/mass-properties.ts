import type { Vec3 } from '../../shared/model/vec3.ts';
import { add3, inertiaTensor, pointMassTensor, type Mat3 } from '../../shared/model/mat3.ts';

/** A rigid body's mass properties in some frame: mass kg, CoM m, inertia about the CoM kg·m². */
export interface MassProperties {
  mass: number;
  com: Vec3;
  inertia: Mat3;
}

/** Mass properties from a contract-style inertia list ([3] or [6]) about `com`. */
export function massProperties(mass: number, com: Vec3, inertia: readonly number[]): MassProperties {
  return { mass, com: [...com], inertia: inertiaTensor(inertia) };
}

/**
 * Two rigid bodies fixed together (same frame): masses add, the CoM is the mass-weighted mean and
 * each inertia moves to the new CoM by the parallel-axis theorem (Steiner):
 * I = I_a + m_a(|d_a|²E − d_a d_aᵀ) + I_b + m_b(|d_b|²E − d_b d_bᵀ).
 */
export function combineMassProperties(a: MassProperties, b: MassProperties): MassProperties {
  const mass = a.mass + b.mass;
  if (!(mass > 0)) throw new Error('combined mass must be positive');
  const com: Vec3 = [0, 1, 2].map((k) => (a.mass * a.com[k] + b.mass * b.com[k]) / mass) as Vec3;
  const da: Vec3 = [a.com[0] - com[0], a.com[1] - com[1], a.com[2] - com[2]];
  const db: Vec3 = [b.com[0] - com[0], b.com[1] - com[1], b.com[2] - com[2]];
  const inertia = add3(add3(a.inertia, pointMassTensor(a.mass, da)), add3(b.inertia, pointMassTensor(b.mass, db)));
  return { mass, com, inertia };
}

/** The contract's inertia list: [Ixx, Iyy, Izz] or [Ixx, Iyy, Izz, Ixy, Ixz, Iyz], kg·m². */
export type ContractInertia = [number, number, number] | [number, number, number, number, number, number];

/**
 * The contract's inertia list for a tensor: [Ixx, Iyy, Izz] when the off-diagonal entries vanish
 * (below 1e-12 of the trace), else [Ixx, Iyy, Izz, Ixy, Ixz, Iyz].
 */
export function contractInertia(i: Mat3): ContractInertia {
  const tiny = 1e-12 * (i[0][0] + i[1][1] + i[2][2]);
  const off = [i[0][1], i[0][2], i[1][2]];
  return off.every((v) => Math.abs(v) <= tiny)
    ? [i[0][0], i[1][1], i[2][2]]
    : [i[0][0], i[1][1], i[2][2], i[0][1], i[0][2], i[1][2]];
}
