import { View } from 'react-native';

import { useVersionRobustnessQuery } from '@/components/api/use-robustness';
import { fmtDeg } from '@/components/maneuvers/report/format';
import { StatGrid } from '@/components/maneuvers/report/StatGrid';
import { gaps } from '@/components/theme';
import { Text } from '@/components/ui/Text';
import type { VersionRobustness } from '@/shared/contracts/robustness';

import { LiveRobustnessCaution } from './RobustnessCaution';

/**
 * The figures that decide whether a person can land the version, placed right before a decision:
 * the level's caution and the percentiles against the tolerance (the full run, with its histogram,
 * is in the report).
 */
export function RobustnessSummary({ versionId, initial }: { versionId: string; initial: VersionRobustness | null }) {
  const run = useVersionRobustnessQuery(versionId);
  const r = run.data === undefined ? initial : run.data;
  const done = r?.state === 'done';
  return (
    <View style={gaps.sm} testID="robustness-summary">
      <Text variant="heading" role="heading" aria-level={2}>
        Robustness
      </Text>
      <LiveRobustnessCaution versionId={versionId} initial={initial} testID="review-robustness-caution" />
      {done && r ? (
        <StatGrid
          stats={[
            { label: '95th pct. with feedback', value: fmtDeg(r.feedbackP95Deg ?? NaN, 1), note: `tolerance ${fmtDeg(r.toleranceDeg, 1)}`, testID: 'summary-feedback-p95' },
            { label: '95th pct. open-loop', value: fmtDeg(r.openLoopP95Deg ?? NaN, 1) },
            { label: 'Median with feedback', value: fmtDeg(r.p50Deg ?? NaN, 1) },
            { label: 'Within tolerance', value: `${Math.round((r.withinToleranceShare ?? 0) * 100)} %`, note: `of ${r.samples.toLocaleString('en-US')} samples, seed ${r.seed}` },
          ]}
        />
      ) : null}
    </View>
  );
}
