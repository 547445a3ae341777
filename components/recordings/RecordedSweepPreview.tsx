import { View } from 'react-native';

import { useCompileQuery } from '@/components/api/use-sequences';
import { dofLabel, JointAnglePlots } from '@/components/charts/JointAnglePlots';
import { gaps } from '@/components/theme';
import { DataTable } from '@/components/ui/DataTable';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Text } from '@/components/ui/Text';
import { type RecordedSweep,trimmedFrameRange } from '@/shared/primitives/primitive-schemas';
import { type ChannelMargin,channelMargins } from '@/shared/primitives/recorded-channels';

/** Props of {@link RecordedSweepPreview}. */
export interface RecordedSweepPreviewProps {
  /** The step as edited (trim applied here; repetitions repeat the same frames). */
  step: RecordedSweep;
  /** Whose current profile gives the joint ranges (suit included). */
  crewMemberId?: string;
  /** Channels of the recording left out because the body has no such dof. */
  dropped?: readonly string[];
}

const deg = (x: number) => `${x.toFixed(1)}°`;

/** The margin in words: inside by, or beyond a limit by. */
function marginText(m: ChannelMargin): string {
  if (m.marginDeg === null || !m.range) return 'no range known';
  const limit = m.nearest === 'min' ? `minimum ${m.range.min}°` : `maximum ${m.range.max}°`;
  return m.marginDeg >= 0 ? `${deg(m.marginDeg)} inside its ${limit}` : `${deg(-m.marginDeg)} beyond its ${limit}`;
}

/**
 * A recorded sweep in the composer: each channel of the trimmed frames plotted over its joint's
 * allowed range, and a table of how close each comes to a limit (the deciding figure for a suited
 * shoulder), with the channels the body could not take listed.
 */
export function RecordedSweepPreview({ step, crewMemberId, dropped }: RecordedSweepPreviewProps) {
  const q = useCompileQuery({ primitives: [step], crewMemberId });
  const { first, count } = trimmedFrameRange(step);
  const t = Array.from({ length: count }, (_, k) => k / step.rateHz);
  const jointsDeg = Object.fromEntries(step.dofs.map((d, j) => [d, step.frames.slice(first, first + count).map((f) => f[j])]));
  const ranges = q.data?.ranges;
  const margins = ranges ? channelMargins(step, ranges) : [];
  const tightest = margins.filter((m) => m.marginDeg !== null).sort((a, b) => (a.marginDeg ?? 0) - (b.marginDeg ?? 0))[0];
  return (
    <View style={gaps.sm} testID="recorded-sweep-preview">
      <Text variant="overline" tone="muted">
        Recorded sweep against the joint ranges
      </Text>
      {dropped?.length ? (
        <Text tone="accent" role="alert" testID="dropped-channels">
          Left out of this step: {dropped.map((d) => `${dofLabel(d)} (${d})`).join(', ')} — this crew member’s body has no such joint (a suit may lock it).
          The other channels are used as recorded.
        </Text>
      ) : null}
      {q.isPending ? <LoadingState label="Reading the joint ranges…" /> : null}
      <ErrorBanner title="Could not read the joint ranges" error={q.error} onRetry={() => void q.refetch()} />
      {tightest ? (
        <Text tone={(tightest.marginDeg ?? 0) < 0 ? 'danger' : 'default'} testID="tightest-margin">
          Closest to a limit: {dofLabel(tightest.dof)}, {marginText(tightest)}
          {step.repeat > 1 ? ` (the same in each of the ${step.repeat} repetitions)` : ''}. Shoulder motion near its range limits is an injury risk in a suit.
        </Text>
      ) : null}
      <JointAnglePlots t={t} jointsDeg={jointsDeg} ranges={ranges} />
      {margins.length ? (
        <DataTable
          label="Range margins of the recorded channels"
          testID="range-margins"
          rows={margins}
          rowKey={(m) => m.dof}
          rowTone={(m) => ((m.marginDeg ?? 0) < 0 ? 'danger' : undefined)}
          columns={[
            { header: 'Joint', cell: (m) => dofLabel(m.dof), minWidth: 140, flex: 2 },
            { header: 'Recorded', cell: (m) => `${deg(m.lowDeg)} to ${deg(m.highDeg)}`, numeric: true, minWidth: 120 },
            { header: 'Allowed', cell: (m) => (m.range ? `${m.range.min}° to ${m.range.max}°` : '—'), numeric: true, minWidth: 110 },
            { header: 'Margin', cell: (m) => marginText(m), minWidth: 170, flex: 2 },
          ]}
        />
      ) : null}
    </View>
  );
}
