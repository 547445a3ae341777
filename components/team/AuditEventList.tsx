import { View } from 'react-native';

import type { AuditFilters } from '@/components/api/use-audit';
import { useAuditQuery } from '@/components/api/use-audit';
import { formatDateTime } from '@/components/format/date-time';
import { gaps } from '@/components/theme';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { ListRow } from '@/components/ui/ListRow';
import { LoadingState } from '@/components/ui/LoadingState';
import { Text } from '@/components/ui/Text';
import type { AuditEvent } from '@/shared/contracts/team';

import { auditSentence } from './audit-sentence';

/** Props of {@link AuditEventList}. */
export interface AuditEventListProps {
  filters: AuditFilters;
  selectedId: number | null;
  onSelect: (event: AuditEvent) => void;
}

/** The audit log, newest first, for the given filters. */
export function AuditEventList({ filters, selectedId, onSelect }: AuditEventListProps) {
  const events = useAuditQuery(filters);
  if (events.isPending) return <LoadingState label="Loading the audit log…" />;
  if (events.isError) return <ErrorBanner title="Could not load the audit log" error={events.error} onRetry={() => void events.refetch()} />;
  if (events.data.length === 0) {
    return <EmptyState icon="list" title="No events match" body="Widen the date range or clear a filter." />;
  }
  return (
    <View style={gaps.xxs} role="list" aria-label="Audit events">
      <Text variant="caption" tone="muted">
        {events.data.length} event{events.data.length === 1 ? '' : 's'}, newest first{events.isFetching ? ' — refreshing…' : ''}
      </Text>
      {events.data.map((e) => (
        <ListRow
          key={e.id}
          title={auditSentence(e)}
          titleLines={3}
          subtitle={formatDateTime(e.at)}
          selected={e.id === selectedId}
          onPress={() => onSelect(e)}
          accessibilityLabel={`${e.action} by ${e.actorEmail ?? 'system'} at ${formatDateTime(e.at)}: ${auditSentence(e)}`}
        />
      ))}
    </View>
  );
}
