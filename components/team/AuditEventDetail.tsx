import { StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/format/date-time';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';
import type { AuditEvent } from '@/shared/contracts/team';

import { auditActionLabel } from './audit-action-labels';
import { auditDetailLines, auditSentence } from './audit-sentence';

/** Props of {@link AuditEventDetail}. */
export interface AuditEventDetailProps {
  event: AuditEvent;
}

/** One audit event: who, what, which object, when, and its recorded detail as JSON. */
export function AuditEventDetail({ event }: AuditEventDetailProps) {
  const rows: [string, string][] = [
    ['When', formatDateTime(event.at)],
    ['Done by', event.actorName ? `${event.actorName} (${event.actorEmail})` : (event.actorEmail ?? 'system')],
    ['What', auditActionLabel(event.action)],
    ['Object', event.objectLabel ?? event.objectType.replace(/_/g, ' ')],
    ['Event number', String(event.id)],
  ];
  const lines = auditDetailLines(event);
  return (
    <View style={gaps.lg}>
      <Text variant="title" role="heading" aria-level={2}>
        {auditActionLabel(event.action)}
      </Text>
      <Text>{auditSentence(event)}</Text>
      <View style={gaps.sm}>
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
        {lines.length ? (
          lines.map((l) => (
            <Text key={l} variant="caption" selectable>
              {l}
            </Text>
          ))
        ) : (
          <Text variant="caption" tone="muted">
            Nothing more was recorded.
          </Text>
        )}
      </View>
      <Text variant="caption" tone="muted" selectable>
        Code {event.action} · {event.objectType}
        {event.objectId ? ` ${event.objectId}` : ''}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: spacing.md },
  key: { width: 110 },
  value: { flex: 1 },
  code: { backgroundColor: colors.background, borderRadius: radii.md, padding: spacing.md, borderWidth: 1, borderColor: colors.border, gap: spacing.xxs },
});
