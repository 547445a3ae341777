import { StyleSheet, View } from 'react-native';

import { errorMessage } from '@/components/api/client';
import { useRobustnessActions, useVersionRobustnessQuery } from '@/components/api/use-robustness';
import { useSessionQuery } from '@/components/api/use-session';
import { ErrorHistogram } from '@/components/charts/ErrorHistogram';
import { gaps, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { JobStateBadge } from '@/components/ui/JobStateBadge';
import { LoadingState } from '@/components/ui/LoadingState';
import { ProgressBar } from '@/components/ui/ProgressBar';
import { Text } from '@/components/ui/Text';
import { type RobustnessLevel, robustnessLevel } from '@/shared/contracts/robustness';

import { RobustnessCaution } from '../robustness/RobustnessCaution';
import { fmtDeg } from './format';
import { StatGrid } from './StatGrid';

const LEVEL_TONE: Record<RobustnessLevel, 'success' | 'accent' | 'danger'> = { robust: 'success', marginal: 'accent', not_robust: 'danger' };

/**
 * The version's robustness run (a background job split across worker processes): progress while it
 * runs, then the figures that decide whether a person can land the maneuver; start again or cancel.
 */
export function RobustnessPanel({ versionId }: { versionId: string }) {
  const run = useVersionRobustnessQuery(versionId);
  const actions = useRobustnessActions(versionId);
  const session = useSessionQuery();
  const author = session.data?.role === 'planner' || session.data?.role === 'admin';
  if (run.isPending) return <LoadingState label="Loading robustness…" />;
  if (run.isError) return <ErrorBanner title="Could not load the robustness run" error={run.error} onRetry={() => void run.refetch()} />;
  const r = run.data;
  const actionError = actions.start.error ?? actions.cancel.error;
  const startButton = author ? (
    <Button label={r ? 'Run again' : 'Compute robustness'} icon="play" size="sm" variant="secondary" loading={actions.start.isPending} onPress={() => actions.start.mutate({})} />
  ) : null;
  if (!r) {
    return (
      <View style={gaps.sm} testID="robustness-panel">
        <Text tone="muted">No robustness run for this version yet.</Text>
        {startButton}
        {actionError ? <Text tone="danger">{errorMessage(actionError)}</Text> : null}
      </View>
    );
  }
  const open = r.state === 'queued' || r.state === 'running';
  const level = r.feedbackP95Deg !== null ? robustnessLevel(r.feedbackP95Deg, r.toleranceDeg) : null;
  const sp = r.model.spreads;
  return (
    <View style={gaps.sm} testID="robustness-panel">
      <View style={styles.row}>
        <JobStateBadge state={r.state} doneLabel="Computed" />
        <Text variant="caption" tone="muted" testID="robustness-model">{`${r.samples.toLocaleString('en-US')} samples · seed ${r.seed}`}</Text>
      </View>
      <Text variant="caption" tone="muted">
        {`Model: segment mass ±${sp.massPct} %, length ±${sp.lengthPct} %; amplitude ±${sp.amplitudePct} %, period ±${sp.periodPct} %, phase ±${sp.phaseDeg}° (uniform); with feedback: perception error ${r.model.perceptionErrorDeg}° (1σ per axis), reaction delay ${r.model.reactionDelayS} s (assumptions).`}
      </Text>
      {open ? (
        <View style={styles.row}>
          <View style={styles.grow}><ProgressBar value={r.progress} label="Robustness run progress" /></View>
          <Text variant="caption" tone="muted">{`${Math.round(r.progress * 100)} % · ${r.chunksDone} of ${r.chunks} chunks`}</Text>
        </View>
      ) : null}
      {r.error ? <Text tone={r.state === 'failed' ? 'danger' : 'muted'}>{r.error}</Text> : null}
      {r.state === 'done' && r.feedbackP95Deg !== null ? (
        <>
          <StatGrid
            stats={[
              { label: '95th pct. with feedback', value: fmtDeg(r.feedbackP95Deg, 1), note: `tolerance ${fmtDeg(r.toleranceDeg, 1)}`, tone: level ? LEVEL_TONE[level] : 'default', testID: 'stat-feedback-p95' },
              { label: '95th pct. open-loop', value: fmtDeg(r.openLoopP95Deg ?? NaN, 1) },
              { label: 'Median with feedback', value: fmtDeg(r.p50Deg ?? NaN, 1) },
              { label: 'Within tolerance', value: `${Math.round((r.withinToleranceShare ?? 0) * 100)} %`, note: 'of executions, with feedback' },
            ]}
          />
          {r.feedbackErrorsDeg ? <ErrorHistogram errorsDeg={r.feedbackErrorsDeg} toleranceDeg={r.toleranceDeg} p50Deg={r.p50Deg} p95Deg={r.feedbackP95Deg} /> : null}
          {level ? <RobustnessCaution robustness={{ state: r.state, progress: r.progress, feedbackP95Deg: r.feedbackP95Deg, toleranceDeg: r.toleranceDeg, level }} testID="robustness-level" /> : null}
        </>
      ) : null}
      <View style={styles.row}>
        {open && author ? <Button label="Cancel run" icon="x-circle" size="sm" variant="ghost" loading={actions.cancel.isPending} onPress={() => actions.cancel.mutate()} /> : null}
        {!open ? startButton : null}
      </View>
      {actionError ? <Text tone="danger">{errorMessage(actionError)}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  grow: { flex: 1, minWidth: 120 },
});
