import type { Body } from '../../shared/contracts/body.ts';
import type { ProfileSummary, Triple } from '../../shared/contracts/profile-version.ts';
import { inertiaTensor } from '../../shared/math/inertia.ts';
import { symmetricEigen3 } from '../../shared/math/symmetric-eigen.ts';
import { wholeBodyInertia } from '../../shared/model/whole-body.ts';

/**
 * The stored summary of a profile version: whole-body mass, CoM and principal moments in the
 * reference posture (every dof 0°), and each segment's mass, CoM and principal moments, so the
 * screens list them without redoing the mechanics.
 */
export function summarizeBody(body: Body, modelVersion: string): ProfileSummary {
  const whole = wholeBodyInertia(body);
  return {
    mass: whole.mass,
    com: [...whole.com] as Triple,
    principalMoments: [...whole.principalMoments] as Triple,
    principalAxes: whole.principalAxes.map((a) => [...a]) as [Triple, Triple, Triple],
    segments: body.segments.map((s) => ({
      name: s.name,
      mass: s.mass,
      com: [...s.com] as Triple,
      principalMoments: [...symmetricEigen3(inertiaTensor(s.inertia)).values] as Triple,
    })),
    modelVersion,
  };
}
