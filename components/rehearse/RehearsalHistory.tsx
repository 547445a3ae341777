import { StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/format/date-time';
import { colors, spacing } from '@/components/theme';
import { Card } from '@/components/ui/Card';
import { Text } from '@/components/ui/Text';
import type { Rehearsal } from '@/shared/contracts/rehearsal';
import { shortEngineVersion } from '@/shared/product/engine-binding';

import { RehearsalCapturePanel } from './RehearsalCapturePanel';

/** Props of {@link RehearsalHistory}. */
export interface RehearsalHistoryProps {
  rehearsals: readonly Rehearsal[];
  /** Show the trainee's name on each row (staff views); default false. */
  showTrainee?: boolean;
  /** Offer the reviewer's sign-off on attached recordings; default false. */
  canSignOff?: boolean;
  /** Card title; default "History". */
  title?: string;
}

/** Logged rehearsals, newest first: when, steps, speed, rating, notes. */
export function RehearsalHistory({ rehearsals, showTrainee = false, canSignOff = false, title = 'History' }: RehearsalHistoryProps) {
  return (
    <Card title={title} subtitle={rehearsals.length ? `${rehearsals.length} logged` : undefined}>
      {rehearsals.length === 0 ? (
        <Text tone="muted">No rehearsals logged yet.</Text>
      ) : (
        <View role="list" aria-label="Rehearsal history">
          {rehearsals.map((r, i) => (
            <View key={r.id} role="listitem" style={[styles.row, i > 0 && styles.divider]}>
              <View style={styles.line}>
                <Text variant="label">{formatDateTime(r.performedAt)}</Text>
                <Text variant="numeric" tone="accent">
                  {'★'.repeat(r.selfRating)}
                  <Text variant="numeric" tone="muted">{'☆'.repeat(5 - r.selfRating)}</Text>
                </Text>
              </View>
              <Text variant="caption" tone="muted">
                {showTrainee ? `${r.traineeName} · ` : ''}
                {r.completedSteps}/{r.totalSteps} steps · {r.playbackSpeed}× · v{r.version}
                {r.engineVersion ? ` · verified by engine ${shortEngineVersion(r.engineVersion)}` : ''}
              </Text>
              {r.notes ? <Text variant="caption">{r.notes}</Text> : null}
              <RehearsalCapturePanel rehearsalId={r.id} canSignOff={canSignOff} />
            </View>
          ))}
        </View>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { paddingVertical: spacing.sm, gap: spacing.xxs },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  line: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center' },
});
