import { View } from 'react-native';

import { useCancelReverificationsMutation, useReverificationProgressQuery } from '@/components/api/use-reverifications';
import { gaps } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { ProgressBar } from '@/components/ui/ProgressBar';
import { Text } from '@/components/ui/Text';
import type { ReverificationProgress } from '@/shared/contracts/maneuver';

/** Props of {@link ReverificationProgressCard}. */
export interface ReverificationProgressCardProps {
  crewMemberId: string;
  /** Planners and admins may stop it. */
  canStop: boolean;
}

type Item = ReverificationProgress['items'][number];

/** One version's state in words. */
function itemText(i: Item): string {
  if (i.state === 'done') return `recomputed, final attitude moved ${(i.attitudeShiftDeg ?? 0).toFixed(2)}°`;
  if (i.state === 'failed') return `failed${i.error ? `: ${i.error}` : ''}`;
  if (i.state === 'cancelled') return 'stopped';
  return i.state === 'running' ? 'recomputing…' : 'waiting';
}

/**
 * After a profile change, every approved or in-review maneuver of the crew member is recomputed on
 * the new body in the background: this card shows that work as one — overall progress, counts, each
 * version — and lets a planner stop what has not run yet.
 */
export function ReverificationProgressCard({ crewMemberId, canStop }: ReverificationProgressCardProps) {
  const q = useReverificationProgressQuery(crewMemberId);
  const stop = useCancelReverificationsMutation(crewMemberId);
  if (q.isError) return <ErrorBanner title="Could not read the re-verification" error={q.error} onRetry={() => void q.refetch()} />;
  const p = q.data;
  if (!p || p.total === 0) return null;
  const open = p.queued + p.running;
  const ended = p.done + p.failed + p.cancelled;
  return (
    <Card
      title={open ? 'Re-verifying maneuvers' : 'Maneuvers re-verified'}
      subtitle={`on profile v${p.toProfileVersion ?? '?'} · ${ended} of ${p.total} ended`}
    >
      <View style={gaps.xs} testID="reverification-progress">
        <ProgressBar value={p.progress} label="Re-verification progress" tone={p.failed ? 'accent' : 'teal'} />
        <Text variant="caption" tone="muted" testID="reverification-counts">
          {`${Math.round(p.progress * 100)} % · ${p.done} recomputed · ${p.running} running · ${p.queued} waiting`}
          {p.failed ? ` · ${p.failed} failed` : ''}
          {p.cancelled ? ` · ${p.cancelled} stopped` : ''}
        </Text>
        {p.items.map((i) => (
          <Text key={i.id} variant="caption" tone={i.state === 'failed' ? 'danger' : 'default'}>
            {`${i.sequenceName} v${i.version}: ${itemText(i)}`}
          </Text>
        ))}
        {p.cancelled && !open ? (
          <Text variant="caption" tone="muted">
            Stopped versions keep their re-check flag and are not rehearsable until they are verified again (Team → Jobs → Retry, or save a new version).
          </Text>
        ) : null}
        <ErrorBanner title="Could not stop the re-verification" error={stop.error} />
        {canStop && open ? (
          <Button label={`Stop re-verifying (${open})`} icon="x" variant="secondary" size="sm" loading={stop.isPending} onPress={() => stop.mutate()} testID="stop-reverification" />
        ) : null}
      </View>
    </Card>
  );
}
