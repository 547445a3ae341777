import { StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/format/date-time';
import { colors, radii, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';
import type { AuditEvent } from '@/shared/contracts/team';
import { auditActionLabel } from './audit-action-labels';

/** Props of {@link AuditEventDetail}. */
export interface AuditEventDetailProps {
  event: AuditEvent;
}

/** One audit event: who, what, which object, when, and its recorded detail as JSON. */
export function AuditEventDetail({ event }: AuditEventDetailProps) {
  const rows: [string, string][] = [
    ['When', formatDateTime(event.at)],
    ['Done by', event.actorEmail ?? 'system'],
    ['Action', event.action],
    ['Object', `${event.objectType}${event.objectId ? ` · ${event.objectId}` : ''}`],
    ['Event number', String(event.id)],
  ];
  return (
    <View style={styles.wrap}>
      <Text variant="title" role="heading" aria-level={2}>
        {auditActionLabel(event.action)}
      </Text>
      <View style={styles.table}>
        {rows.map(([k, v]) => (
          <View key={k} style={styles.row}>
            <Text variant="caption" tone="muted" style={styles.key}>
              {k}
            </Text>
            <Text variant="label" style={styles.value} selectable>
              {v}
            </Text>
          </View>
        ))}
      </View>
      <Text variant="overline" tone="muted">
        Recorded detail
      </Text>
      <View style={styles.code}>
        <Text variant="caption" style={styles.mono} selectable>
          {event.detail == null ? '—' : JSON.stringify(event.detail, null, 2)}
        </Text>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.lg },
  table: { gap: spacing.sm },
  row: { flexDirection: 'row', gap: spacing.md },
  key: { width: 110 },
  value: { flex: 1 },
  code: { backgroundColor: colors.background, borderRadius: radii.md, padding: spacing.md, borderWidth: 1, borderColor: colors.border },
  mono: { fontFamily: 'ui-monospace, SFMono-Regular, Menlo, monospace', color: colors.text },
});
