/**
 * A compiled sequence cut into the pieces the robustness model composes: every step simulated on
 * its own from the joint angles it starts at, so the attitude after any step is the ordered product
 * of the pieces' rotations (the shape path alone decides each rotation, as momentum is zero). A
 * harmonic step of whole cycles ("phase") is one simulated cycle C (every cycle starts and ends in
 * the same posture, so n cycles rotate by Cⁿ exactly) plus the rotation D a reaction delay before a
 * cycle's end, which is what a crew member deciding at that moment has seen.
 */
import type { Body } from '../../shared/contracts/body.ts';
import { harmonicAngleDeg, type Sequence, type Step } from '../../shared/contracts/sequence.ts';
import { DEFAULT_RTOL } from '../../shared/contracts/simulate-request.ts';
import { type BodyModel, compileBody } from '../../shared/kinematics/body-model.ts';
import type { Quat } from '../../shared/math/quaternion.ts';
import { integrateAttitude, PlanRate } from '../engine/integrate-attitude.ts';
import { compileMotion } from '../engine/joint-motion.ts';
import { SEARCH_ENGINE_OPTIONS } from './evaluate-steps.ts';

/** One piece: a fixed rotation, or a phase of whole cycles the crew member may stop early or extend. */
export type ExecutionPiece =
  | { kind: 'fixed'; rotation: Quat }
  | {
      kind: 'phase';
      /** Rotation of one cycle from the sweep's starting posture [w,x,y,z]. */
      cycle: Quat;
      /** Whole cycles planned. */
      cycles: number;
      /** Whole cycles the perceived attitude lags behind at a cycle's end (floor(delay / period)). */
      lagCycles: number;
      /** Rotation from a cycle's start to (reaction delay mod period) before its end. */
      lagged: Quat;
      periodS: number;
    };

const RTOL = SEARCH_ENGINE_OPTIONS.rtol ?? DEFAULT_RTOL;
const TOLERANCES = { rtol: RTOL, atol: SEARCH_ENGINE_OPTIONS.atol ?? RTOL };

/**
 * Rotations of step lists on one body, as the search mode's simulation gives them (same integrator,
 * same tolerances, the final attitude with w ≥ 0), without what only a report needs (range and rate
 * checks, the result contract): a sample simulates three or four step lists on its own body, so the
 * body is compiled and its rate work set up once for all of them.
 */
class BodyRotations {
  private readonly model: BodyModel;
  private readonly rate: PlanRate;

  constructor(body: Body) {
    this.model = compileBody(body);
    this.rate = new PlanRate(this.model);
  }

  /** Attitude [w,x,y,z] after simulating `steps` from joint angles `start`. */
  of(start: Record<string, number>, steps: Step[]): Quat {
    // A hold moves no joint, so ω = 0 and the integrator would leave the attitude at identity exactly.
    if (steps.every((s) => s.kind === 'hold')) return [1, 0, 0, 0];
    const q = integrateAttitude(this.model, compileMotion(this.model, { start, steps }), TOLERANCES, [], this.rate).final;
    // The sign-canonical representative (w ≥ 0), as the engine's result reports it.
    const s = q[0] < 0 ? -1 : 1;
    return [s * q[0], s * q[1], s * q[2], s * q[3]];
  }
}

/** Joint angles after a step, degrees (dofs the step does not name keep their angle). */
export function anglesAfter(angles: Record<string, number>, step: Step): Record<string, number> {
  if (step.kind === 'move') return { ...angles, ...step.to };
  if (step.kind === 'harmonic') {
    const out = { ...angles };
    for (const [dof, j] of Object.entries(step.joints)) out[dof] = harmonicAngleDeg(j, step.period, step.cycles * step.period);
    return out;
  }
  return angles;
}

/** Cuts `sequence` into pieces on `body`; `reactionDelayS` sets each phase's lagged rotation. */
export function executionPieces(body: Body, sequence: Sequence, reactionDelayS: number): ExecutionPiece[] {
  const pieces: ExecutionPiece[] = [];
  const rotation = new BodyRotations(body);
  let angles: Record<string, number> = { ...sequence.start };
  for (const step of sequence.steps) {
    const whole = step.kind === 'harmonic' ? Math.floor(step.cycles + 1e-9) : 0;
    if (step.kind === 'harmonic' && whole >= 1 && Math.abs(step.cycles - whole) < 1e-9) {
      const T = step.period;
      const lagCycles = Math.floor(reactionDelayS / T);
      const rest = reactionDelayS - lagCycles * T;
      const cycle = rotation.of(angles, [{ ...step, cycles: 1 }]);
      const lagged = rest < 1e-9 ? cycle : rotation.of(angles, [{ ...step, cycles: (T - rest) / T }]);
      pieces.push({ kind: 'phase', cycle, cycles: whole, lagCycles, lagged, periodS: T });
    } else {
      pieces.push({ kind: 'fixed', rotation: rotation.of(angles, [step]) });
    }
    angles = anglesAfter(angles, step);
  }
  return pieces;
}
