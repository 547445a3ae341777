import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Modal, StyleSheet, View } from 'react-native';

import { useRehearsableVersionsQuery, useRehearsalHistoryQuery } from '@/components/api/use-rehearsals';
import { useVersionRobustnessQuery } from '@/components/api/use-robustness';
import { CueCardButton } from '@/components/maneuvers/CueCardButton';
import { RobustnessCaution } from '@/components/maneuvers/robustness/RobustnessCaution';
import { gaps } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Screen } from '@/components/ui/Screen';
import { Text } from '@/components/ui/Text';
import { levelOf } from '@/shared/contracts/robustness';
import { LEVEL_LABEL } from '@/shared/product/robustness-wording';

import { CaptureTrend } from './CaptureTrend';
import { LazyPlayer } from './LazyPlayer';
import { RehearsalHistory } from './RehearsalHistory';
import { RehearsalLogForm } from './RehearsalLogForm';
import type { RunSummary } from './RehearsalPlayer';

/** Props of {@link RehearsalSession}. */
export interface RehearsalSessionProps {
  versionId: string;
}

/**
 * A trainee's session with one cleared version: opens straight into the full-screen player; closing
 * it (or "Log") shows the log form prefilled from the run, and the history of this version.
 */
export function RehearsalSession({ versionId }: RehearsalSessionProps) {
  const router = useRouter();
  const versions = useRehearsableVersionsQuery();
  const history = useRehearsalHistoryQuery(versionId);
  const [playing, setPlaying] = useState(true);
  const [run, setRun] = useState<{ summary: RunSummary; n: number } | null>(null);
  const robustness = useVersionRobustnessQuery(versionId);
  const version = versions.data?.find((v) => v.versionId === versionId);
  const rb = robustness.data;
  const level = rb ? levelOf(rb.feedbackP95Deg, rb.toleranceDeg) : null;
  // Short form for the cue card over the 3D view (the full sentence is on the session screen).
  const cueCaution = rb && level && level !== 'robust' && rb.feedbackP95Deg !== null
    ? `${LEVEL_LABEL[level]}: 1 in 20 executions ends over ${rb.feedbackP95Deg.toFixed(1)}° off (tolerance ${rb.toleranceDeg.toFixed(1)}°); trim with care.`
    : null;
  const stale = version?.status === 'recheck';
  const finish = (r: RunSummary) => {
    setRun((prev) => ({ summary: r, n: (prev?.n ?? 0) + 1 }));
    setPlaying(false);
  };

  if (versions.isPending) return <LoadingState fill label="Loading the maneuver…" />;
  if (versions.isError) return <ErrorBanner error={versions.error} onRetry={() => void versions.refetch()} />;
  if (!version) {
    return (
      <Screen title="Rehearse">
        <EmptyState icon="slash" title="This maneuver is not available to you" body="It may have been replaced, or it is not cleared for your body." action={<Button label="Back to your maneuvers" variant="secondary" onPress={() => router.replace('/rehearse')} />} />
      </Screen>
    );
  }

  return (
    <Screen
      title={version.sequenceName}
      subtitle={`Version ${version.version} · target ${version.targetLabel} · ${version.duration.toFixed(1)} s · ${version.stepCount} steps`}
      actions={!stale ? (
        <>
          <CueCardButton versionId={versionId} />
          <Button label="Play in 3D" icon="play" onPress={() => setPlaying(true)} />
        </>
      ) : undefined}
    >
      <View style={gaps.lg}>
        {robustness.isPending ? null : (
          <RobustnessCaution robustness={rb ? { state: rb.state, progress: rb.progress, feedbackP95Deg: rb.feedbackP95Deg, toleranceDeg: rb.toleranceDeg, level } : null} testID="session-robustness-caution" />
        )}
        {stale ? (
          <Card title="Re-check needed">
            <Text tone="danger">
              The inertia profile behind this maneuver changed since you rehearsed it. It is being re-verified; it returns to your list once it is cleared again.
            </Text>
          </Card>
        ) : (
          <RehearsalLogForm key={run?.n ?? 0} versionId={versionId} totalSteps={version.stepCount} run={run?.summary ?? null} />
        )}
        {history.isPending ? <LoadingState /> : history.isError ? <ErrorBanner error={history.error} /> : <RehearsalHistory rehearsals={history.data} />}
        <CaptureTrend />
        <Button label="All maneuvers" icon="arrow-left" variant="ghost" onPress={() => router.replace('/rehearse')} />
      </View>
      <Modal visible={playing && !stale} animationType="fade" onRequestClose={() => setPlaying(false)}>
        <View style={styles.player}>
          <LazyPlayer versionId={versionId} onClose={finish} onLog={finish} caution={cueCaution} />
        </View>
      </Modal>
    </Screen>
  );
}

const styles = StyleSheet.create({
  player: { flex: 1, backgroundColor: '#0B121B' },
});
