import { inertiaTensor, pointMassTensor } from '../../shared/math/inertia.ts';
import { mat3Add } from '../../shared/math/mat3.ts';
import type { Vec3 } from '../../shared/math/vec3.ts';

/** A rigid body's mass properties in some frame: mass kg, CoM m, inertia about the CoM kg·m². */
export interface MassProperties {
  mass: number;
  com: Vec3;
  /** Flat row-major 3×3. */
  inertia: number[];
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
  const inertia = mat3Add(mat3Add(a.inertia, pointMassTensor(a.mass, da)), mat3Add(b.inertia, pointMassTensor(b.mass, db)));
  return { mass, com, inertia };
}
