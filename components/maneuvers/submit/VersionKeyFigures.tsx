import { fmtDeg, fmtRate, fmtSeconds } from '@/components/maneuvers/report/format';
import { type Stat,StatGrid } from '@/components/maneuvers/report/StatGrid';
import type { VerificationReport } from '@/shared/contracts/maneuver';
import type { RobustnessRun } from '@/shared/contracts/robustness-run';

/** Props of {@link VersionKeyFigures}. */
export interface VersionKeyFiguresProps {
  report: VerificationReport | null;
  /** The version's newest robustness run (null: none). */
  robustness: RobustnessRun | null;
}

/**
 * The figures a submit or a clearance decides on: error to target against the tolerance, duration
 * against the budget, peak joint rate against the limit, range violations, and both robustness
 * figures (95th percentile with feedback and open-loop) — a failing one in red.
 */
export function VersionKeyFigures({ report: r, robustness: rb }: VersionKeyFiguresProps) {
  if (!r) return null;
  const done = rb?.state === 'done';
  const stats: Stat[] = [
    { label: 'Error to target', value: fmtDeg(r.target.errorDeg, 2), note: `tolerance ${fmtDeg(r.target.toleranceDeg)}`, tone: r.target.withinTolerance ? 'default' : 'danger', testID: 'key-error' },
    { label: 'Duration', value: fmtSeconds(r.durationS, 1), note: r.timeBudget.limitS != null ? `budget ${fmtSeconds(r.timeBudget.limitS, 0)}` : 'no time budget', tone: r.timeBudget.within ? 'default' : 'danger' },
    { label: 'Peak joint rate', value: fmtRate(r.peakJointRate.maxDegS), note: `limit ${fmtRate(r.peakJointRate.limitDegS)}`, tone: r.peakJointRate.withinLimit ? 'default' : 'danger' },
    { label: 'Range violations', value: String(r.rangeViolations.length), tone: r.rangeViolations.length ? 'danger' : 'default' },
    {
      label: '95th pct, with feedback',
      value: done && rb.feedbackP95Deg != null ? fmtDeg(rb.feedbackP95Deg) : '—',
      note: done ? `${rb.samples} samples, seed ${rb.seed}` : rb ? `run ${rb.state} (${Math.round(rb.progress * 100)} %)` : 'not computed',
      tone: !done || (rb.feedbackP95Deg ?? Infinity) > r.target.toleranceDeg ? 'danger' : 'default',
      testID: 'key-feedback-p95',
    },
    { label: '95th pct, open-loop', value: done && rb.openLoopP95Deg != null ? fmtDeg(rb.openLoopP95Deg) : '—', tone: !done ? 'danger' : 'default' },
  ];
  return <StatGrid stats={stats} />;
}
