/**
 * The checks a version must pass before it goes to review without a note (DECISIONS.md "Guarded
 * submit"): target within tolerance, no range violation, peak joint rate within the limit, duration
 * within the time budget, and a finished robustness run. One list, worded once, so the server's
 * refusal, the banner over a draft and the reviewer's view say the same thing.
 */
import type { JobState } from '../contracts/job-state.ts';
import type { VerificationReport } from '../contracts/maneuver.ts';

/** The checks, in the order they are reported. */
export const CHECK_NAMES = ['report', 'target', 'ranges', 'rate', 'time_budget', 'robustness'] as const;
/** Which check failed. */
export type CheckName = (typeof CHECK_NAMES)[number];

/** Each check in a word or two (lists and badges). */
export const CHECK_WORDS: Record<CheckName, string> = {
  report: 'no report', target: 'target', ranges: 'joint ranges', rate: 'rate limit', time_budget: 'time budget', robustness: 'robustness',
};

/** One failed check, in words for planners and reviewers. */
export interface CheckFailure {
  check: CheckName;
  message: string;
}

/** The robustness run as far as the checks need it (null: no run). */
export interface RobustnessForChecks {
  state: JobState;
  /** 0–1. */
  progress: number;
  /** Why a run failed or was cancelled. */
  error?: string | null;
}

const deg = (x: number) => `${x < 0.1 ? x.toFixed(2) : x.toFixed(1)}°`;

/** The report's fields the checks read (a stored report has them all). */
export type ReportForChecks = Pick<VerificationReport, 'durationS' | 'target' | 'rangeViolations' | 'peakJointRate' | 'timeBudget'>;

/** Every check the version fails, in a fixed order; empty when it may be submitted without a note. */
export function versionCheckFailures(report: ReportForChecks | null, robustness: RobustnessForChecks | null): CheckFailure[] {
  const out: CheckFailure[] = [];
  if (!report) return [{ check: 'report', message: 'it has no verification report' }];
  if (!report.target.withinTolerance) {
    out.push({ check: 'target', message: `it misses its target by ${deg(report.target.errorDeg)} (tolerance ${deg(report.target.toleranceDeg)})` });
  }
  const v = report.rangeViolations;
  if (v.length) {
    const worst = v.reduce((a, b) => (b.marginDeg > a.marginDeg ? b : a));
    const joints = [...new Set(v.map((x) => x.dof))];
    out.push({
      check: 'ranges',
      message: `it leaves the joint range ${v.length} time${v.length === 1 ? '' : 's'} (${joints.join(', ')}; worst ${worst.dof} ${deg(worst.marginDeg)} beyond its ${worst.bound === 'max' ? 'maximum' : 'minimum'} at ${worst.worstTime.toFixed(1)} s)`,
    });
  }
  const rate = report.peakJointRate;
  if (!rate.withinLimit) {
    out.push({ check: 'rate', message: `its peak joint rate ${Math.round(rate.maxDegS)} °/s${rate.dof ? ` (${rate.dof})` : ''} exceeds the ${Math.round(rate.limitDegS)} °/s limit` });
  }
  if (!report.timeBudget.within && report.timeBudget.limitS !== null) {
    out.push({ check: 'time_budget', message: `it takes ${report.durationS.toFixed(1)} s, over its ${report.timeBudget.limitS} s time budget` });
  }
  if (!robustness) out.push({ check: 'robustness', message: 'its robustness has not been computed (no run)' });
  else if (robustness.state === 'queued' || robustness.state === 'running') {
    out.push({ check: 'robustness', message: `its robustness is not computed yet (run ${robustness.state}, ${Math.round(robustness.progress * 100)} %)` });
  } else if (robustness.state !== 'done') {
    out.push({ check: 'robustness', message: `its robustness run ${robustness.state}${robustness.error ? ` (${robustness.error})` : ''}: start it again` });
  }
  return out;
}

/** The failures as one sentence: "Fails 2 checks: it misses …; its robustness …". */
export function failuresSentence(failures: readonly CheckFailure[]): string {
  if (!failures.length) return 'Passes every check.';
  return `Fails ${failures.length} check${failures.length === 1 ? '' : 's'}: ${failures.map((f) => f.message).join('; ')}.`;
}
