import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { errorMessage } from '@/components/api/client';
import { useBackgroundWorkAction, useBackgroundWorkQuery } from '@/components/api/use-background-work';
import { formatDateTime } from '@/components/format/date-time';
import { gaps, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { JobStateBadge } from '@/components/ui/JobStateBadge';
import { LoadingState } from '@/components/ui/LoadingState';
import { ProgressBar } from '@/components/ui/ProgressBar';
import { SegmentedControl } from '@/components/ui/SegmentedControl';
import { Text } from '@/components/ui/Text';
import type { QueueCounts, WorkFilter, WorkItem } from '@/shared/contracts/background-work';

const FILTERS = [
  { value: 'open', label: 'Queued & running' },
  { value: 'failed', label: 'Failed' },
  { value: 'done', label: 'Done' },
] as const;

const QUEUE_LABELS: Record<string, string> = {
  'maneuver-planning': 'Planning',
  'robustness-chunk': 'Robustness chunks',
  'sequence-reverification': 'Re-verification',
  'invitation-mail': 'Invitation e-mail',
};

/**
 * The admin's view of background work: plans, robustness runs and re-verifications that are queued,
 * running, failed or done, with progress and the reason of a failure; retry or cancel.
 */
export function BackgroundWorkList() {
  const [filter, setFilter] = useState<WorkFilter>('open');
  const work = useBackgroundWorkQuery(filter);
  return (
    <View style={gaps.md}>
      <View style={styles.switcher}>
        <SegmentedControl label="Which work" hideLabel options={FILTERS} value={filter} onChange={setFilter} />
      </View>
      {work.isPending ? <LoadingState label="Loading background work…" /> : null}
      {work.isError ? <ErrorBanner title="Could not load background work" error={work.error} onRetry={() => void work.refetch()} /> : null}
      {work.data ? <QueueSummary queues={work.data.queues} /> : null}
      {work.data && work.data.items.length === 0 ? (
        <EmptyState
          icon="check-circle"
          title={filter === 'open' ? 'Nothing queued or running' : filter === 'failed' ? 'Nothing failed' : 'Nothing finished yet'}
          body="Plans, robustness runs and re-verifications show here while worker processes run them."
        />
      ) : null}
      <View style={gaps.sm} role="list" aria-label="Background work">
        {work.data?.items.map((item) => <WorkCard key={`${item.kind}-${item.id}`} item={item} />)}
      </View>
    </View>
  );
}

function QueueSummary({ queues }: { queues: QueueCounts[] }) {
  return (
    <Text variant="caption" tone="muted">
      {'Queue jobs — '}
      {queues.map((q) => `${QUEUE_LABELS[q.queue] ?? q.queue}: ${q.queued} waiting, ${q.active} running, ${q.failed} failed`).join(' · ')}
    </Text>
  );
}

function WorkCard({ item }: { item: WorkItem }) {
  const action = useBackgroundWorkAction();
  const run = (what: 'retry' | 'cancel') => action.mutate({ kind: item.kind, id: item.id, action: what });
  return (
    <Card title={item.label} subtitle={`Started ${formatDateTime(item.createdAt)} · ${item.attempts} attempt${item.attempts === 1 ? '' : 's'} by workers`} trailing={<JobStateBadge state={item.state} />}>
      <View style={gaps.sm}>
        {item.progress !== null && item.state !== 'done' ? (
          <View style={styles.progress}>
            <View style={styles.grow}><ProgressBar value={item.progress} label={`${item.label} progress`} /></View>
            <Text variant="caption" tone="muted">{`${Math.round(item.progress * 100)} %`}</Text>
          </View>
        ) : null}
        {item.error ? <Text tone={item.state === 'cancelled' ? 'muted' : 'danger'}>{item.error}</Text> : null}
        {item.finishedAt ? <Text variant="caption" tone="muted">{`Ended ${formatDateTime(item.finishedAt)}`}</Text> : null}
        {action.isError ? <Text tone="danger">{errorMessage(action.error)}</Text> : null}
        {item.canRetry || item.canCancel ? (
          <View style={styles.actions}>
            {item.canRetry ? <Button label="Retry" icon="rotate-cw" size="sm" variant="secondary" loading={action.isPending} onPress={() => run('retry')} accessibilityLabel={`Retry ${item.label}`} /> : null}
            {item.canCancel ? <Button label="Cancel" icon="x-circle" size="sm" variant="danger" loading={action.isPending} onPress={() => run('cancel')} accessibilityLabel={`Cancel ${item.label}`} /> : null}
          </View>
        ) : null}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  switcher: { maxWidth: 460 },
  progress: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  grow: { flex: 1 },
  actions: { flexDirection: 'row', gap: spacing.sm, flexWrap: 'wrap' },
});
