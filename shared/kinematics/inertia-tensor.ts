/**
 * The body contract's inertia array as a tensor, without zod (shared/contracts/body.ts re-exports it
 * beside the schemas), so the 3D view's code does not carry the zod runtime. In shared/kinematics so
 * that ENGINE_VERSION hashes it with the engine's other inputs.
 */

/** Full symmetric inertia tensor (row-major 3×3, kg·m²) of a contract inertia array. */
export function inertiaTensor(inertia: readonly number[]): number[] {
  const [ixx, iyy, izz] = inertia;
  const ixy = inertia[3] ?? 0, ixz = inertia[4] ?? 0, iyz = inertia[5] ?? 0;
  return [ixx, ixy, ixz, ixy, iyy, iyz, ixz, iyz, izz];
}
