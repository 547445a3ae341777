/**
 * Turns one engine result into the stored verification report: the engine's own figures, the
 * error to the target, the checks against the sequence's rate limit and time budget, and plot
 * series (attitude and joint angles vs time).
 */
import type { ReportSummary, SequenceTarget, StepRotation, VerificationReport } from '../../shared/contracts/maneuver.ts';
import type { SimulationResult } from '../../shared/contracts/result.ts';
import { quatToYpr } from '../../shared/math/euler-zyx.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import type { DofInfo } from '../../shared/primitives/compile-primitives.ts';
import { targetQuat } from './target-attitude.ts';

const DEG = 180 / Math.PI;
/** A dof whose angle changes by less than this over the sequence is left out of the joint plot, degrees. */
const STILL_DEG = 1e-6;

/** Adds or removes whole turns so consecutive angles never jump by more than 180° (degrees). */
export function unwrapDeg(values: number[]): number[] {
  const out: number[] = [];
  let shift = 0;
  values.forEach((v, i) => {
    if (i > 0) {
      const prev = values[i - 1];
      if (v - prev > 180) shift -= 360;
      else if (v - prev < -180) shift += 360;
    }
    out.push(v + shift);
  });
  return out;
}

const round = (x: number, digits = 6) => Number(x.toFixed(digits));

/** What the report needs beside the engine result. */
export interface ReportInputs {
  result: SimulationResult;
  target: SequenceTarget;
  profileVersionId: string;
  /** Dof ranges of the body that was simulated. */
  dofs: readonly DofInfo[];
  inputsHash: string;
  /** Rotation of each composer step (server/maneuvers/step-rotations.ts); omitted when unknown. */
  stepRotations?: StepRotation[];
  computedAt?: Date;
}

/** The verification report of one engine result. */
export function buildReport({ result, target, profileVersionId, dofs, inputsHash, stepRotations, computedAt = new Date() }: ReportInputs): VerificationReport {
  const fa = result.final.attitude;
  const finalQ = [fa.w, fa.x, fa.y, fa.z];
  const tq = targetQuat(target);
  const errorDeg = quatAngleBetween(finalQ, tq) * DEG;

  // Attitude angles and moving joints over time.
  const frames = result.samples.frames;
  const ypr = frames.map((f) => quatToYpr([f.attitude.w, f.attitude.x, f.attitude.y, f.attitude.z]));
  const jointsDeg: Record<string, number[]> = {};
  const ranges: Record<string, { min: number; max: number }> = {};
  const byName = new Map(dofs.map((d) => [d.name, d]));
  result.samples.dofs.forEach((dof, k) => {
    const series = frames.map((f) => round(f.jointsDeg[k]));
    if (Math.max(...series) - Math.min(...series) < STILL_DEG) return;
    jointsDeg[dof] = series;
    const d = byName.get(dof);
    if (d) ranges[dof] = { min: d.min, max: d.max };
  });

  const peak = result.peakJointRateDegS;
  return {
    engineVersion: result.engineVersion,
    inputsHash,
    profileVersionId,
    durationS: result.duration,
    pathDeg: result.pathDeg,
    final: { attitude: fa, rotation: result.final.rotation, yprDeg: result.final.yprDeg, jointsDeg: result.final.jointsDeg },
    target: {
      attitude: { w: tq[0], x: tq[1], y: tq[2], z: tq[3] },
      errorDeg,
      toleranceDeg: target.toleranceDeg,
      withinTolerance: errorDeg <= target.toleranceDeg,
    },
    momentum: {
      maxAbs: result.momentumResidual.maxAbs,
      relative: result.momentumResidual.relative,
      peakShapeMomentum: result.momentumResidual.peakShapeMomentum,
      atTime: result.momentumResidual.atTime,
    },
    ...(stepRotations ? { stepRotations } : {}),
    rangeViolations: result.rangeViolations,
    peakJointRate: {
      maxDegS: peak.max,
      dof: peak.dof,
      time: peak.time,
      limitDegS: target.rateLimitDegS,
      withinLimit: peak.max <= target.rateLimitDegS,
      byDof: peak.byDof,
    },
    timeBudget: { limitS: target.timeBudgetS, within: target.timeBudgetS === null || result.duration <= target.timeBudgetS },
    solver: { rhsEvaluations: result.solver.rhsEvaluations, steps: result.solver.steps, relativeTolerance: result.solver.tolerances.relative },
    series: {
      rateHz: result.samples.rateHz,
      t: frames.map((f) => round(f.t)),
      yawDeg: unwrapDeg(ypr.map((a) => a.yaw * DEG)).map((v) => round(v)),
      pitchDeg: ypr.map((a) => round(a.pitch * DEG)),
      rollDeg: unwrapDeg(ypr.map((a) => a.roll * DEG)).map((v) => round(v)),
      jointsDeg,
      ranges,
    },
    computedAt: computedAt.toISOString(),
  };
}

/** The headline figures of a report. */
export function summarizeReport(r: VerificationReport): ReportSummary {
  return {
    durationS: r.durationS,
    targetErrorDeg: r.target.errorDeg,
    withinTolerance: r.target.withinTolerance,
    yprDeg: r.final.yprDeg,
    rangeViolationCount: r.rangeViolations.length,
    peakJointRateDegS: r.peakJointRate.maxDegS,
    withinRateLimit: r.peakJointRate.withinLimit,
    withinTimeBudget: r.timeBudget.within,
  };
}
