import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useProfileVersionQuery, useProfileVersionsQuery } from '@/components/api/use-crew';
import { formatDateTime } from '@/components/format/date-time';
import { gaps, spacing } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { Card } from '@/components/ui/Card';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { ListRow } from '@/components/ui/ListRow';
import { LoadingState } from '@/components/ui/LoadingState';
import { Select } from '@/components/ui/Select';

import { fixed } from './format-values';
import { ProfileOverview } from './ProfileOverview';
import { VersionComparison } from './VersionComparison';

/** The version history (newest first), a comparison of any two versions, and any old version in full. */
export function VersionHistory({ crewMemberId }: { crewMemberId: string }) {
  const versions = useProfileVersionsQuery(crewMemberId);
  const [pair, setPair] = useState<{ a: number; b: number } | null>(null);
  const [viewing, setViewing] = useState<number | null>(null);
  const viewed = useProfileVersionQuery(crewMemberId, viewing);
  if (versions.isPending) return <LoadingState label="Loading the history…" />;
  if (versions.isError) return <ErrorBanner title="Could not load the history" error={versions.error} onRetry={() => void versions.refetch()} />;
  const list = versions.data;
  if (list.length === 0) return <EmptyState icon="clock" title="No versions yet" body="Saving the first profile makes version 1." />;
  const latest = list[0].version;
  // Default: the current version against the one before it.
  const { a, b } = pair ?? { a: Math.max(1, latest - 1), b: latest };
  const options = list.map((v) => ({ value: String(v.version), label: `Version ${v.version}${v.current ? ' (current)' : ''}` }));

  return (
    <View style={gaps.md}>
      <Card title="Versions" subtitle="Saved versions never change; editing makes a new one." padding="none">
        <View role="list" aria-label="Profile versions" style={styles.list}>
          {list.map((v) => (
            <ListRow
              key={v.id}
              title={`Version ${v.version}${v.note ? ` — ${v.note}` : ''}`}
              subtitle={`${v.authorName ?? 'Seed'} · ${formatDateTime(v.createdAt)} · ${fixed(v.mass, 1)} kg total`}
              trailing={
                <>
                  {v.source === 'measured' ? <Badge label="Measured" tone="accent" /> : null}
                  {v.current ? <Badge label="Current" tone="success" /> : null}
                </>
              }
              selected={viewing === v.version}
              onPress={() => setViewing(viewing === v.version ? null : v.version)}
              accessibilityLabel={`Version ${v.version}${v.current ? ', current' : ''}`}
            />
          ))}
        </View>
      </Card>

      {viewing !== null ? (
        viewed.data ? <ProfileOverview version={viewed.data} /> : viewed.isError ? <ErrorBanner error={viewed.error} /> : <LoadingState />
      ) : null}

      {list.length > 1 ? (
        <Card title="Compare versions">
          <View style={styles.pickers}>
            <View style={styles.picker}>
              <Select label="From version" options={options} value={String(a)} onChange={(v) => v && setPair({ a: Number(v), b })} />
            </View>
            <View style={styles.picker}>
              <Select label="To version" options={options} value={String(b)} onChange={(v) => v && setPair({ a, b: Number(v) })} />
            </View>
          </View>
          <VersionComparison crewMemberId={crewMemberId} a={a} b={b} />
        </Card>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.xxs, padding: spacing.sm },
  pickers: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md, marginBottom: spacing.md },
  picker: { flexGrow: 1, minWidth: 160 },
});
