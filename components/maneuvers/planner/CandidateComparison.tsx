import { useMemo, useState } from 'react';
import { Pressable, StyleSheet, useWindowDimensions, View } from 'react-native';

import { useCandidateMotionQuery } from '@/components/api/use-plans';
import { LinePlot, type PlotSeries } from '@/components/charts/LinePlot';
import { candidateColors } from '@/components/charts/plot-colors';
import { useIsWide } from '@/components/layout/use-is-wide';
import { MotionPlayer } from '@/components/rehearse/LazyPlayer';
import { colors, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { type DataColumn, DataTable } from '@/components/ui/DataTable';
import { Icon } from '@/components/ui/Icon';
import { Sheet } from '@/components/ui/Sheet';
import { Text } from '@/components/ui/Text';
import type { SequenceTarget } from '@/shared/contracts/maneuver';
import type { Plan, PlanCandidate } from '@/shared/contracts/plan';
import { quatToYpr } from '@/shared/math/euler-zyx';
import { quatFromAxisAngle } from '@/shared/math/quaternion';
import { meetsLimits, missedLimitWords } from '@/shared/product/candidate-limits';
import { LEVEL_LABEL } from '@/shared/product/robustness-wording';

import { nearestTurn, overlayGrid, valuesOnGrid } from './candidate-overlay';

/** Props of {@link CandidateComparison}. */
export interface CandidateComparisonProps {
  visible: boolean;
  onClose: () => void;
  sequenceId: string;
  /** A finished plan. */
  plan: Plan;
  /** The sequence's target (for the dashed target lines and the error colours). */
  target: SequenceTarget;
  /** Suggestion previewed in 3D when the view opens (rank), or none. */
  initialPreview?: number | null;
  /** Puts a suggestion's steps in the composer (undoable there). */
  onUse: (candidate: PlanCandidate) => void;
}

const AXES = [
  { key: 'yawDeg', name: 'Yaw', target: 'yaw' },
  { key: 'pitchDeg', name: 'Pitch', target: 'pitch' },
  { key: 'rollDeg', name: 'Roll', target: 'roll' },
] as const;

const RAD = Math.PI / 180;
const f1 = (x: number) => (Number.isFinite(x) ? x.toFixed(1) : '—');
const f2 = (x: number) => (Number.isFinite(x) ? (x < 1 ? x.toFixed(2) : x.toFixed(1)) : '—');

/** The target as yaw/pitch/roll, degrees (z-y′-x″). */
function targetYpr(target: SequenceTarget): { yaw: number; pitch: number; roll: number } {
  if (target.mode === 'ypr') return target.yprDeg;
  const a = quatToYpr(quatFromAxisAngle(target.axisAngle.axis, target.axisAngle.angleDeg * RAD));
  return { yaw: a.yaw / RAD, pitch: a.pitch / RAD, roll: a.roll / RAD };
}

/** Colour of a suggestion's lines and swatch. */
const colorOf = (rank: number) => candidateColors[(rank - 1) % candidateColors.length];

/**
 * Suggestions side by side: a table of every figure the ranking uses (scrolls sideways on a phone),
 * the chosen suggestions' attitude overlaid against time per axis with the target dashed, and a 3D
 * preview of any one of them before its steps go into the composer.
 */
export function CandidateComparison({ visible, onClose, sequenceId, plan, target, initialPreview = null, onUse }: CandidateComparisonProps) {
  const { candidates } = plan;
  // The first two are compared at first: the ranking's best and its runner-up.
  const [chosen, setChosen] = useState<number[]>(() => candidates.slice(0, 2).map((c) => c.rank));
  const [preview, setPreview] = useState<number | null>(initialPreview);
  const toleranceDeg = target.toleranceDeg;
  const toggle = (rank: number) => setChosen((s) => (s.includes(rank) ? s.filter((r) => r !== rank) : [...s, rank].sort((a, b) => a - b)));
  const previewed = candidates.find((c) => c.rank === preview) ?? null;

  const columns: DataColumn<PlanCandidate>[] = [
    {
      header: 'Suggestion',
      minWidth: 132,
      cell: (c) => <ChooseCell candidate={c} checked={chosen.includes(c.rank)} onToggle={() => toggle(c.rank)} />,
    },
    { header: 'Preview', minWidth: 92, cell: (c) => <Button label="3D" icon="box" size="sm" variant={preview === c.rank ? 'primary' : 'secondary'} accessibilityLabel={`Preview suggestion ${c.rank} in 3D`} onPress={() => setPreview(c.rank)} testID={`compare-preview-${c.rank}`} /> },
    { header: 'Duration (s)', numeric: true, minWidth: 96, cell: (c) => <Figure value={f1(c.durationS)} bad={!c.withinTimeBudget} /> },
    { header: 'Error (°)', numeric: true, minWidth: 80, cell: (c) => <Figure value={f2(c.errorDeg)} bad={!c.withinTolerance} /> },
    { header: 'Path (°)', numeric: true, minWidth: 80, cell: (c) => <Figure value={f1(c.pathDeg)} bad={c.detour} /> },
    { header: 'Peak rate (°/s)', numeric: true, minWidth: 112, cell: (c) => <Figure value={String(Math.round(c.peakJointRateDegS))} bad={!c.withinRateLimit} /> },
    { header: 'Open-loop p95 (°)', numeric: true, minWidth: 124, cell: (c) => <Figure value={f2(c.robustness.openLoopP95Deg)} bad={c.robustness.openLoopP95Deg > toleranceDeg} /> },
    { header: 'Feedback p95 (°)', numeric: true, minWidth: 124, cell: (c) => <Figure value={f2(c.robustness.feedbackP95Deg)} bad={c.robustness.feedbackP95Deg > toleranceDeg} /> },
    { header: 'Level', minWidth: 96, cell: (c) => <Figure value={LEVEL_LABEL[c.robustness.level]} bad={c.robustness.level !== 'robust'} /> },
    { header: 'Limits', minWidth: 104, cell: (c) => <Figure value={meetsLimits(c) ? 'All met' : `Misses ${missedLimitWords(c).join(', ')}`} bad={!meetsLimits(c)} /> },
  ];

  return (
    <Sheet visible={visible} onClose={onClose} title="Compare suggestions" size="wide">
      <View style={styles.body} testID="candidate-comparison">
        <Text variant="caption" tone="muted">
          {candidates.length} suggestion{candidates.length === 1 ? '' : 's'}, best first. Red: misses its limit (tolerance {f1(toleranceDeg)}°, rate limit {target.rateLimitDegS} °/s
          {target.timeBudgetS != null ? `, time budget ${target.timeBudgetS} s` : ''}; path: turns the long way round). p95: 95th-percentile final error of the dispersion run, open-loop and
          when the crew member stops or adds cycles from what they see.
        </Text>
        <DataTable label="Suggestions compared" columns={columns} rows={candidates} rowKey={(c) => String(c.rank)} rowTone={(c) => (chosen.includes(c.rank) ? 'changed' : undefined)} testID="compare-table" />
        <OverlaidPlots candidates={candidates.filter((c) => chosen.includes(c.rank))} target={targetYpr(target)} anyTrack={candidates.some((c) => !!c.track)} />
        {previewed ? (
          <CandidatePreview key={previewed.rank} sequenceId={sequenceId} planId={plan.id} candidate={previewed} onUse={() => onUse(previewed)} onClose={() => setPreview(null)} />
        ) : (
          <Text tone="muted" variant="caption">
            Press 3D in a row to watch that suggestion on the crew member’s body before using it.
          </Text>
        )}
        <View style={styles.note} role="note">
          <Icon name="alert-circle" size={16} color={colors.accent} />
          <Text variant="caption" style={styles.flex}>
            A planning and training aid: the figures come from a model with illustrative spreads. Verify the chosen steps on the crew member’s profile and follow flight rules and certified
            procedures.
          </Text>
        </View>
      </View>
    </Sheet>
  );
}

/** The first column: a checkbox that puts the suggestion in the plots, with its line colour. */
function ChooseCell({ candidate: c, checked, onToggle }: { candidate: PlanCandidate; checked: boolean; onToggle: () => void }) {
  return (
    <Pressable role="checkbox" aria-checked={checked} aria-label={`Compare suggestion ${c.rank}`} onPress={onToggle} style={styles.choose} hitSlop={6} testID={`compare-choose-${c.rank}`}>
      <View style={[styles.box, checked && { backgroundColor: colorOf(c.rank), borderColor: colorOf(c.rank) }]}>{checked ? <Icon name="check" size={14} color={colors.onAccent} /> : null}</View>
      <View style={[styles.swatch, { backgroundColor: colorOf(c.rank) }]} />
      <Text variant="bodyStrong">{c.rank}</Text>
      <Text variant="caption" tone="muted">
        {c.primitives.length} steps
      </Text>
    </Pressable>
  );
}

function Figure({ value, bad }: { value: string; bad: boolean }) {
  return (
    <Text variant="numeric" tone={bad ? 'danger' : 'default'} style={styles.right}>
      {value}
    </Text>
  );
}

/** Yaw, pitch and roll against time, one plot per axis, one line per chosen suggestion. */
function OverlaidPlots({ candidates, target, anyTrack }: { candidates: PlanCandidate[]; target: { yaw: number; pitch: number; roll: number }; anyTrack: boolean }) {
  const wide = useIsWide();
  const tracked = candidates.filter((c) => c.track && c.track.t.length > 1);
  const overlay = useMemo(() => {
    const grid = overlayGrid(tracked.map((c) => c.track!.t[c.track!.t.length - 1]));
    return AXES.map((axis) => {
      const series: PlotSeries[] = tracked.map((c) => ({ name: `Suggestion ${c.rank}`, color: colorOf(c.rank), values: valuesOnGrid({ t: c.track!.t, values: c.track![axis.key] }, grid) }));
      // The target at the whole turn nearest where the best chosen suggestion ends (tracks are unwrapped).
      const first = tracked[0]?.track?.[axis.key];
      const aim = first ? nearestTurn(target[axis.target], first[first.length - 1]) : target[axis.target];
      series.push({ name: 'Target', color: colors.muted, values: grid.map(() => aim), dashed: true });
      const ends = tracked.map((c) => `suggestion ${c.rank} ends at ${f1(c.track![axis.key][c.track![axis.key].length - 1])}° after ${f1(c.durationS)} s`).join('; ');
      return { axis, grid, series, summary: `${ends}; target ${f1(aim)}°.` };
    });
  }, [tracked, target]);
  if (!anyTrack) {
    return (
      <Text tone="muted" testID="compare-no-tracks">
        These suggestions were made before their attitude was kept for plotting: press Suggest again to plot them side by side.
      </Text>
    );
  }
  if (!tracked.length) return <Text tone="muted">Tick at least one suggestion to plot its attitude.</Text>;
  return (
    <View style={[styles.plots, wide && styles.plotsWide]} testID="compare-plots">
      {overlay.map(({ axis, grid, series, summary }) => (
        <View key={axis.key} style={wide ? styles.plotWide : undefined}>
          <LinePlot title={`${axis.name} vs time`} summary={summary} x={grid} series={series} yUnit="°" height={wide ? 200 : 150} testID={`compare-plot-${axis.name.toLowerCase()}`} />
        </View>
      ))}
    </View>
  );
}

/** A suggestion in 3D (simulated on the plan's body when asked for), with its steps and "Use these steps". */
function CandidatePreview({ sequenceId, planId, candidate: c, onUse, onClose }: { sequenceId: string; planId: string; candidate: PlanCandidate; onUse: () => void; onClose: () => void }) {
  const motion = useCandidateMotionQuery(sequenceId, planId, c.rank);
  const { height: screenHeight } = useWindowDimensions();
  const height = Math.round(Math.min(720, Math.max(520, screenHeight - 120)));
  return (
    <View style={styles.preview} testID="candidate-preview" role="region" aria-label={`Suggestion ${c.rank} in 3D`}>
      <View style={styles.previewHead}>
        <View style={[styles.swatch, { backgroundColor: colorOf(c.rank) }]} />
        <Text variant="heading" role="heading" aria-level={3} style={styles.flex}>
          Suggestion {c.rank} in 3D
        </Text>
        <Button label="Close preview" icon="x" variant="ghost" size="sm" onPress={onClose} />
      </View>
      <View style={styles.cues}>
        {c.cues.map((cue, i) => (
          <Text key={i} variant="caption">
            {i + 1}. {cue}
          </Text>
        ))}
      </View>
      <View style={styles.player}>
        <MotionPlayer motion={motion} height={height} compact />
      </View>
      <Button label="Use these steps" icon="check" onPress={onUse} accessibilityLabel={`Use the steps of suggestion ${c.rank}`} testID="compare-use" />
    </View>
  );
}

const styles = StyleSheet.create({
  body: { gap: spacing.lg },
  flex: { flex: 1 },
  right: { textAlign: 'right' },
  choose: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs, minHeight: 32 },
  box: { width: 20, height: 20, borderRadius: radii.sm, borderWidth: 2, borderColor: colors.borderStrong, alignItems: 'center', justifyContent: 'center' },
  swatch: { width: 14, height: 4, borderRadius: 2 },
  plots: { gap: spacing.md },
  plotsWide: { flexDirection: 'row', flexWrap: 'wrap' },
  plotWide: { flexBasis: 300, flexGrow: 1 },
  preview: { gap: spacing.sm, padding: spacing.sm, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border },
  previewHead: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  cues: { gap: 2 },
  player: { borderRadius: radii.md, overflow: 'hidden' },
  note: { flexDirection: 'row', gap: spacing.sm, padding: spacing.md, borderRadius: radii.md, backgroundColor: colors.accentTint },
});
