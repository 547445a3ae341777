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
import type { Quat } from '../../shared/math/quaternion.ts';
import { evaluateSequence } from './evaluate-steps.ts';

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

const IDENTITY: Quat = [1, 0, 0, 0];

/** Attitude [w,x,y,z] after simulating `steps` from joint angles `start` (the search's engine settings). */
function rotationOf(body: Body, start: Record<string, number>, steps: Step[]): Quat {
  if (!steps.length) return [...IDENTITY];
  const a = evaluateSequence(body, { start, steps }, IDENTITY).result.final.attitude;
  return [a.w, a.x, a.y, a.z];
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
  let angles: Record<string, number> = { ...sequence.start };
  for (const step of sequence.steps) {
    const whole = step.kind === 'harmonic' ? Math.floor(step.cycles + 1e-9) : 0;
    if (step.kind === 'harmonic' && whole >= 1 && Math.abs(step.cycles - whole) < 1e-9) {
      const T = step.period;
      const lagCycles = Math.floor(reactionDelayS / T);
      const rest = reactionDelayS - lagCycles * T;
      const cycle = rotationOf(body, angles, [{ ...step, cycles: 1 }]);
      const lagged = rest < 1e-9 ? cycle : rotationOf(body, angles, [{ ...step, cycles: (T - rest) / T }]);
      pieces.push({ kind: 'phase', cycle, cycles: whole, lagCycles, lagged, periodS: T });
    } else {
      pieces.push({ kind: 'fixed', rotation: rotationOf(body, angles, [step]) });
    }
    angles = anglesAfter(angles, step);
  }
  return pieces;
}
