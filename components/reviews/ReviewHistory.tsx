import { StyleSheet, View } from 'react-native';

import { fmtWhen, shortHash } from '@/components/maneuvers/report/format';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { StateBadge, type StateLooks } from '@/components/ui/StateBadge';
import { Text } from '@/components/ui/Text';
import type { ReviewEntry } from '@/shared/contracts/maneuver';

const DECISION: StateLooks<ReviewEntry['decision']> = {
  clear: { label: 'Cleared', tone: 'success' },
  send_back: { label: 'Sent back', tone: 'danger' },
  comment: { label: 'Comment', tone: 'neutral' },
};

/** Props of {@link ReviewHistory}. */
export interface ReviewHistoryProps {
  reviews: readonly ReviewEntry[];
}

/** Decisions and comments on a version, oldest first, with what each was bound to. */
export function ReviewHistory({ reviews }: ReviewHistoryProps) {
  if (reviews.length === 0) {
    return (
      <Text tone="muted" variant="caption">
        No review comments yet.
      </Text>
    );
  }
  return (
    <View role="list" aria-label="Review history" style={gaps.sm} testID="review-history">
      {reviews.map((r) => (
        <View key={r.id} role="listitem" style={styles.item}>
          <View style={styles.head}>
            <StateBadge looks={DECISION} state={r.decision} />
            <Text variant="label" style={styles.flex}>
              {r.reviewerName}
            </Text>
            <Text variant="caption" tone="muted">
              {fmtWhen(r.createdAt)}
            </Text>
          </View>
          {r.comment ? <Text>{r.comment}</Text> : null}
          {r.decision === 'clear' ? (
            <Text variant="caption" tone="muted">
              Bound to profile version {shortHash(r.profileVersionId)} and engine {r.engineVersion ?? '—'}.
            </Text>
          ) : null}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  item: { padding: spacing.md, borderRadius: radii.md, backgroundColor: colors.raised, gap: spacing.xs },
  head: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  flex: { flex: 1 },
});
