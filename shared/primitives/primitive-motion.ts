/**
 * What each primitive does to the joints, before blends are inserted: either a sinusoidal sweep
 * (one harmonic step, with dofs held at fixed angles during it) or a blend to target angles, or a
 * pause. Angles in degrees on the standard human model's dofs, times in seconds.
 */
import { NAMED_POSTURES } from './named-postures.ts';
import { type ArmLoop, type ArmOrbit, type HipSwirl, type LegPedal, type Primitive, trimmedFrameRange } from './primitive-schemas.ts';

/** One dof's sinusoid: θ(t) = offset + amplitude·sin(2πt/period + phase), degrees. */
export interface DofWave {
  offset: number;
  amplitude: number;
  phase: number;
}

/** The joint motion of one primitive. */
export type PrimitiveMotion =
  /** A harmonic sweep; `fixed` dofs are brought to these angles by the blend before it and stay. */
  | { type: 'sweep'; period: number; cycles: number; waves: Record<string, DofWave>; fixed: Record<string, number> }
  /** A minimum-jerk blend to `to` over `duration`; `allDofs` means dofs not in `to` go to 0°. */
  | { type: 'shift'; duration: number; to: Record<string, number>; allDofs: boolean }
  /** Nothing moves. */
  | { type: 'pause'; duration: number }
  /** Recorded frames (degrees, trimmed) played `repeat` times as track steps. */
  | { type: 'recorded'; rateHz: number; dofs: string[]; frames: number[][]; repeat: number };

const sidesOf = (which: 'left' | 'right' | 'both'): ('l' | 'r')[] => (which === 'both' ? ['l', 'r'] : [which === 'left' ? 'l' : 'r']);

/** Shoulder angles (flexion, abduction) at an arm orbit's cone centre, degrees. */
export function armOrbitCentre(p: ArmOrbit): { flex: number; abd: number } {
  const h = p.halfAngleDeg;
  switch (p.centre) {
    case 'low_forward': return { flex: 45, abd: h };
    case 'forward': return { flex: 90, abd: h };
    case 'high_forward': return { flex: 135, abd: h };
    case 'forward_out': return { flex: 90, abd: Math.max(45, h) };
    case 'custom': return { flex: p.centreFlexDeg ?? 90, abd: p.centreAbdDeg ?? h };
  }
}

function armOrbitMotion(p: ArmOrbit): PrimitiveMotion {
  const c = armOrbitCentre(p);
  // Abduction a quarter cycle behind flexion moves the hand outward at the top (flexion peak).
  const abdPhase = p.travel === 'outward' ? -90 : 90;
  const waves: Record<string, DofWave> = {};
  const fixed: Record<string, number> = {};
  // Same way round: the right arm travels the other way (anatomical angles mirror the left's).
  const reverseRight = p.arms === 'both' && p.pairing === 'same_way';
  for (const s of sidesOf(p.arms)) {
    waves[`${s}_sh_flex`] = { offset: c.flex, amplitude: p.halfAngleDeg, phase: 0 };
    waves[`${s}_sh_abd`] = { offset: c.abd, amplitude: p.halfAngleDeg, phase: s === 'r' && reverseRight ? -abdPhase : abdPhase };
    fixed[`${s}_sh_rot`] = 0;
    fixed[`${s}_elbow_flex`] = 0;
  }
  return { type: 'sweep', period: p.periodS, cycles: p.cycles, waves, fixed };
}

/** Elbow flexion at the straightest point of an arm loop, degrees (kept off the 0° stop). */
export const ARM_LOOP_ELBOW_MIN_DEG = 10;

function armLoopMotion(p: ArmLoop): PrimitiveMotion {
  const waves: Record<string, DofWave> = {};
  const fixed: Record<string, number> = {};
  const elbowPhase = p.bendOn === 'forward_swing' ? 90 : -90;
  for (const s of sidesOf(p.arms)) {
    // Swing dof and its centre per plane; the other shoulder dofs are held.
    if (p.plane === 'sagittal') {
      waves[`${s}_sh_flex`] = { offset: 90, amplitude: p.swingDeg, phase: 0 };
      fixed[`${s}_sh_abd`] = 0;
    } else if (p.plane === 'frontal') {
      waves[`${s}_sh_abd`] = { offset: 70, amplitude: p.swingDeg, phase: 0 };
      fixed[`${s}_sh_flex`] = 0;
    } else {
      // At 90° flexion abduction turns the arm about the body's long axis: a horizontal sweep.
      waves[`${s}_sh_abd`] = { offset: p.swingDeg + 10, amplitude: p.swingDeg, phase: 0 };
      fixed[`${s}_sh_flex`] = 90;
    }
    fixed[`${s}_sh_rot`] = 0;
    waves[`${s}_elbow_flex`] = { offset: ARM_LOOP_ELBOW_MIN_DEG + p.elbowDeg, amplitude: p.elbowDeg, phase: elbowPhase };
  }
  return { type: 'sweep', period: p.periodS, cycles: p.cycles, waves, fixed };
}

function legPedalMotion(p: LegPedal): PrimitiveMotion {
  const waves: Record<string, DofWave> = {};
  const fixed: Record<string, number> = {};
  const kneeLead = p.direction === 'forward' ? 90 : -90;
  for (const s of sidesOf(p.legs)) {
    // The right leg runs half a cycle behind the left when alternating.
    const legPhase = p.legs === 'both' && p.pattern === 'alternating' && s === 'r' ? 180 : 0;
    waves[`${s}_hip_flex`] = { offset: p.hipCentreDeg, amplitude: p.hipSwingDeg, phase: legPhase };
    waves[`${s}_knee_flex`] = { offset: p.kneeCentreDeg, amplitude: p.kneeSwingDeg, phase: legPhase + kneeLead };
    fixed[`${s}_hip_abd`] = 0;
    fixed[`${s}_hip_rot`] = 0;
  }
  return { type: 'sweep', period: p.periodS, cycles: p.cycles, waves, fixed };
}

function hipSwirlMotion(p: HipSwirl): PrimitiveMotion {
  const h = p.halfAngleDeg;
  // Sideways swing a quarter cycle behind flexion moves the feet to the left at the front.
  const sidePhase = p.turn === 'to_left' ? -90 : 90;
  return {
    type: 'sweep',
    period: p.periodS,
    cycles: p.cycles,
    waves: {
      l_hip_flex: { offset: p.centreFlexDeg, amplitude: h, phase: 0 },
      r_hip_flex: { offset: p.centreFlexDeg, amplitude: h, phase: 0 },
      // Legs together: the left leg abducts while the right adducts (anatomical signs mirror).
      l_hip_abd: { offset: 0, amplitude: h, phase: sidePhase },
      r_hip_abd: { offset: 0, amplitude: -h, phase: sidePhase },
    },
    fixed: { l_hip_rot: 0, r_hip_rot: 0, l_knee_flex: 0, r_knee_flex: 0 },
  };
}

/** The joint motion a primitive stands for. */
export function primitiveMotion(p: Primitive): PrimitiveMotion {
  switch (p.kind) {
    case 'arm_orbit': return armOrbitMotion(p);
    case 'arm_loop': return armLoopMotion(p);
    case 'leg_pedal': return legPedalMotion(p);
    case 'hip_swirl': return hipSwirlMotion(p);
    case 'pose_shift':
      return p.posture === 'custom'
        ? { type: 'shift', duration: p.durationS, to: { ...(p.custom ?? {}) }, allDofs: false }
        : { type: 'shift', duration: p.durationS, to: { ...NAMED_POSTURES[p.posture] }, allDofs: true };
    case 'pause': return { type: 'pause', duration: p.durationS };
    case 'recorded_sweep': {
      const { first, count } = trimmedFrameRange(p);
      return { type: 'recorded', rateHz: p.rateHz, dofs: [...p.dofs], frames: p.frames.slice(first, first + count), repeat: p.repeat };
    }
  }
}
