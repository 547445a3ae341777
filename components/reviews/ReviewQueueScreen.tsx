import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { useReviewQueueQuery } from '@/components/api/use-reviews';
import { SplitView } from '@/components/layout/SplitView';
import { useIsWide } from '@/components/layout/use-is-wide';
import { fmtWhen } from '@/components/maneuvers/report/format';
import { RobustnessBadge } from '@/components/maneuvers/robustness/RobustnessCaution';
import { summaryLine } from '@/components/maneuvers/versions/VersionList';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Screen } from '@/components/ui/Screen';
import { Text } from '@/components/ui/Text';
import type { ReviewQueueItem } from '@/shared/contracts/maneuver';
import { CHECK_WORDS } from '@/shared/product/version-checks';

import { ReviewDetail } from './ReviewDetail';

/**
 * The Reviews tab: versions waiting for a decision. Wide screens show the chosen version beside the
 * queue; phones open `/reviews/<versionId>` (the same page the e-mail links to).
 */
export function ReviewQueueScreen() {
  const router = useRouter();
  const wide = useIsWide();
  const queue = useReviewQueueQuery();
  const [selected, setSelected] = useState<string | null>(null);
  const open = (id: string) => (wide ? setSelected(id) : router.push(`/reviews/${id}`));

  const list = (
    <View style={gaps.sm}>
      {queue.isPending ? <LoadingState label="Loading the queue…" /> : null}
      {queue.isError ? <ErrorBanner title="Could not load the queue" error={queue.error} onRetry={() => void queue.refetch()} /> : null}
      {queue.data?.length === 0 ? (
        <EmptyState icon="check-square" title="Nothing to review" body="Versions submitted for review queue here, and you get an e-mail for each." />
      ) : null}
      <View role="list" aria-label="Review queue" style={gaps.sm}>
        {queue.data?.map((item) => <QueueRow key={item.version.id} item={item} selected={item.version.id === selected} onOpen={() => open(item.version.id)} />)}
      </View>
    </View>
  );
  return (
    <Screen title="Reviews" subtitle="Sequence versions waiting for a decision" scroll={!wide}>
      {wide ? (
        <SplitView
          list={list}
          listLabel="Review queue"
          detail={selected ? <View style={styles.detail}><ReviewDetail versionId={selected} /></View> : null}
          detailLabel="Version under review"
          onCloseDetail={() => setSelected(null)}
          placeholder={<EmptyState icon="file-text" title="Choose a version" body="Its verification report and the decision controls open here." />}
        />
      ) : (
        list
      )}
    </Screen>
  );
}

function QueueRow({ item, selected, onOpen }: { item: ReviewQueueItem; selected: boolean; onOpen: () => void }) {
  const { version: v, sequence: s } = item;
  return (
    <Pressable
      role="button"
      aria-label={`Review ${s.name} version ${v.version}`}
      onPress={onOpen}
      testID="review-queue-row"
      style={({ pressed, focused }: { pressed: boolean; focused?: boolean }) => [styles.row, selected && styles.selected, pressed && styles.pressed, focused && styles.focused]}
    >
      <Text variant="bodyStrong">
        {s.name} · v{v.version}
      </Text>
      <Text variant="caption" tone="muted">
        {s.crewMemberName} · by {v.authorName ?? (v.recheckOfId ? 'the automatic re-check' : 'unknown')} · submitted {fmtWhen(v.submittedAt)}
      </Text>
      {v.recheckOfId ? (
        <Text variant="caption" tone="accent" testID="queue-recheck">
          Re-check after a profile change: decide again on a cleared maneuver (profile v{v.profileVersion})
        </Text>
      ) : null}
      <Text variant="caption" tone={v.summary?.withinTolerance === false ? 'danger' : 'default'}>
        {summaryLine(v)}
      </Text>
      {v.acknowledgedFailures?.length ? (
        <Text variant="caption" tone="danger" testID="queue-acknowledged">
          Submitted although it fails {v.acknowledgedFailures.length} check{v.acknowledgedFailures.length === 1 ? '' : 's'} ({v.acknowledgedFailures.map((f) => CHECK_WORDS[f.check]).join(', ')}), with a note
        </Text>
      ) : null}
      <View style={styles.badges}>
        <RobustnessBadge robustness={v.robustness} />
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  badges: { flexDirection: 'row' },
  detail: { padding: spacing.lg },
  row: { padding: spacing.md, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border, backgroundColor: colors.surface, gap: 2 },
  selected: { borderColor: colors.accent },
  pressed: { backgroundColor: colors.raised },
  focused: { outlineColor: colors.accent, outlineWidth: 2, outlineStyle: 'solid' },
});
