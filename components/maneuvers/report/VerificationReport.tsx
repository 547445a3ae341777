import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { AttitudePlot } from '@/components/charts/AttitudePlot';
import { JointAnglePlots } from '@/components/charts/JointAnglePlots';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { Icon } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';
import type { VerificationReport as Report } from '@/shared/contracts/maneuver';
import type { VersionRobustness } from '@/shared/contracts/robustness';
import { quatToYpr } from '@/shared/math/euler-zyx';

import { ManeuverCautions } from '../ManeuverCautions';
import { Preview3DSlot } from '../Preview3DSlot';
import { LiveRobustnessCaution } from '../robustness/RobustnessCaution';
import { fmtDeg, fmtNum, fmtRate, fmtSci, fmtSeconds, fmtWhen, shortHash } from './format';
import { PeakRatesTable } from './PeakRatesTable';
import { RangeViolationsTable } from './RangeViolationsTable';
import { RobustnessPanel } from './RobustnessPanel';
import { StatGrid } from './StatGrid';
import { StepRotationsTable } from './StepRotationsTable';

/** Props of {@link VerificationReport}. */
export interface VerificationReportProps {
  /** The stored report; with the version's robustness when read from GET /sequences/versions/:id. */
  report: Report & { robustness?: VersionRobustness | null };
  /** The composer's cue of each step, for the per-step rotation table; default none. */
  cues?: readonly string[];
  /** The version the report belongs to (for the 3D preview). */
  versionId: string;
  /** Number of the profile version the report was computed for. */
  profileVersion?: number;
  /** Hide the plots (e.g. a compact side panel); default false. */
  hidePlots?: boolean;
}

const DEG = 180 / Math.PI;

/**
 * The engine's verification of one version: verdict, key figures, plots, range violations, joint
 * rates and what it takes to reproduce the computation.
 */
export function VerificationReport({ report, cues = [], versionId, profileVersion, hidePlots = false }: VerificationReportProps) {
  const { target, final, momentum, peakJointRate, timeBudget, series } = report;
  const q = target.attitude;
  const targetYpr = quatToYpr([q.w, q.x, q.y, q.z]);
  const ok = target.withinTolerance && report.rangeViolations.length === 0 && peakJointRate.withinLimit && timeBudget.within;
  return (
    <View style={gaps.xl} testID="verification-report">
      <Verdict ok={ok} report={report} />
      <LiveRobustnessCaution versionId={versionId} initial={report.robustness ?? null} testID="report-robustness-caution" />
      <StatGrid
        stats={[
          {
            label: 'Error to target',
            value: fmtDeg(target.errorDeg, 2),
            note: `tolerance ${fmtDeg(target.toleranceDeg, 1)}`,
            tone: target.withinTolerance ? 'success' : 'danger',
            testID: 'stat-target-error',
          },
          { label: 'Yaw reached', value: fmtDeg(final.yprDeg.yaw), note: `target ${fmtDeg(targetYpr.yaw * DEG)}` },
          { label: 'Pitch reached', value: fmtDeg(final.yprDeg.pitch), note: `target ${fmtDeg(targetYpr.pitch * DEG)}` },
          { label: 'Roll reached', value: fmtDeg(final.yprDeg.roll), note: `target ${fmtDeg(targetYpr.roll * DEG)}` },
          {
            label: 'Final rotation',
            value: fmtDeg(final.rotation.angleDeg),
            note: `about [${final.rotation.axis.map((a) => fmtNum(a, 2)).join(', ')}]`,
          },
          {
            label: 'Path travelled',
            value: report.pathDeg === undefined ? '—' : fmtDeg(report.pathDeg, 0),
            note: '∫|ω| dt, to-and-fro included',
            testID: 'stat-path',
          },
          {
            label: 'Duration',
            value: fmtSeconds(report.durationS, 1),
            note: timeBudget.limitS == null ? 'no time budget' : `budget ${fmtSeconds(timeBudget.limitS, 0)}`,
            tone: timeBudget.within ? 'default' : 'danger',
          },
          {
            label: 'Peak joint rate',
            value: fmtRate(peakJointRate.maxDegS),
            note: `limit ${fmtRate(peakJointRate.limitDegS)}`,
            tone: peakJointRate.withinLimit ? 'default' : 'danger',
          },
          {
            label: 'Range violations',
            value: String(report.rangeViolations.length),
            tone: report.rangeViolations.length ? 'danger' : 'success',
            testID: 'stat-range-violations',
          },
          {
            label: 'Momentum audit',
            value: `${fmtSci(momentum.maxAbs)} kg·m²/s`,
            note: `${fmtSci(momentum.relative)} of peak shape momentum`,
          },
        ]}
      />
      <Section title="Robustness">
        <RobustnessPanel versionId={versionId} />
      </Section>
      <Section title="Where the rotation comes from">
        {report.stepRotations?.length ? (
          <>
            <Text variant="caption" tone="muted">Each step’s rotation about the body’s axes at the step’s start (lead-in included); the steps’ rotations in order make the final attitude. Per cycle: the rotation of one cycle of each sweep.</Text>
            <StepRotationsTable steps={report.stepRotations} cues={cues} />
          </>
        ) : (
          <Text tone="muted">This report was computed before per-step rotations were recorded; save the steps again to see them.</Text>
        )}
      </Section>
      {hidePlots ? null : (
        <Section title="Plots">
          <AttitudePlot t={series.t} yawDeg={series.yawDeg} pitchDeg={series.pitchDeg} rollDeg={series.rollDeg} target={{ yaw: round1(targetYpr.yaw * DEG), pitch: round1(targetYpr.pitch * DEG), roll: round1(targetYpr.roll * DEG) }} />
          <Text variant="label">Joint angles vs time (green band: allowed range; red bar: beyond it)</Text>
          <JointAnglePlots t={series.t} jointsDeg={series.jointsDeg} ranges={series.ranges} violations={report.rangeViolations} />
        </Section>
      )}
      <Section title="Range violations">
        <RangeViolationsTable violations={report.rangeViolations} />
      </Section>
      <Section title="Peak joint rates">
        <PeakRatesTable byDof={peakJointRate.byDof} limitDegS={peakJointRate.limitDegS} />
      </Section>
      <Section title="3D preview">
        <Preview3DSlot versionId={versionId} />
      </Section>
      <Section title="Reproduce">
        <View style={gaps.xs}>
          <Repro label="Engine" value={report.engineVersion} />
          <Repro label="Inputs hash" value={shortHash(report.inputsHash)} full={report.inputsHash} />
          <Repro label="Profile version" value={profileVersion != null ? `v${profileVersion}` : shortHash(report.profileVersionId)} />
          <Repro label="Computed" value={fmtWhen(report.computedAt)} />
          <Repro label="Solver" value={`${report.solver.steps} steps, ${report.solver.rhsEvaluations} evaluations, rel. tol. ${fmtSci(report.solver.relativeTolerance, 1)}`} />
        </View>
      </Section>
      <ManeuverCautions />
    </View>
  );
}

const round1 = (v: number) => Math.round(v * 10) / 10;

function Verdict({ ok, report }: { ok: boolean; report: Report }) {
  const problems: string[] = [];
  if (!report.target.withinTolerance) problems.push(`misses the target by ${fmtDeg(report.target.errorDeg, 1)}`);
  if (report.rangeViolations.length) problems.push(`${report.rangeViolations.length} range violation${report.rangeViolations.length > 1 ? 's' : ''}`);
  if (!report.peakJointRate.withinLimit) problems.push('joint rate above the limit');
  if (!report.timeBudget.within) problems.push('over the time budget');
  return (
    <View style={[styles.verdict, ok ? styles.verdictOk : styles.verdictBad]} role="status" testID="report-verdict">
      <Icon name={ok ? 'check-circle' : 'alert-triangle'} size={18} color={ok ? colors.success : colors.danger} />
      <Text variant="bodyStrong" style={styles.flex}>
        {ok ? `Reaches the target within ${fmtDeg(report.target.toleranceDeg, 1)}, inside every joint range and rate limit.` : `Needs work: ${problems.join('; ')}.`}
      </Text>
    </View>
  );
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <View style={gaps.md}>
      <Text variant="heading" role="heading" aria-level={3}>
        {title}
      </Text>
      {children}
    </View>
  );
}

function Repro({ label, value, full }: { label: string; value: string; full?: string }) {
  return (
    <View style={styles.reproRow}>
      <Text variant="caption" tone="muted" style={styles.reproLabel}>
        {label}
      </Text>
      <Text variant="numeric" style={styles.flex} selectable aria-label={`${label}: ${full ?? value}`}>
        {value}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  verdict: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, padding: spacing.md, borderRadius: radii.md, borderWidth: 1 },
  verdictOk: { backgroundColor: colors.successTint, borderColor: 'rgba(123, 216, 143, 0.4)' },
  verdictBad: { backgroundColor: colors.dangerTint, borderColor: 'rgba(255, 107, 107, 0.4)' },
  flex: { flex: 1 },
  reproRow: { flexDirection: 'row', gap: spacing.md, flexWrap: 'wrap' },
  reproLabel: { width: 120 },
});
