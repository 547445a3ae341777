import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useProfileComparisonQuery } from '@/components/api/use-crew';
import { gaps } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { Card } from '@/components/ui/Card';
import { type DataColumn, DataTable } from '@/components/ui/DataTable';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { SegmentedControl } from '@/components/ui/SegmentedControl';
import { Text } from '@/components/ui/Text';
import type { ComparisonRow } from '@/shared/contracts/profile-version';

import { comparisonValue } from './format-values';

/** Props of {@link VersionComparison}. */
export interface VersionComparisonProps {
  crewMemberId: string;
  a: number;
  b: number;
}

const FILTERS = [
  { value: 'changed', label: 'Changes only' },
  { value: 'all', label: 'Everything' },
] as const;

function columns(a: number, b: number): DataColumn<ComparisonRow>[] {
  return [
    { header: 'Value', cell: (r) => <Text variant="label">{r.label}{r.unit ? ` (${r.unit})` : ''}</Text>, minWidth: 200 },
    { header: `Version ${a}`, cell: (r) => comparisonValue(r.a), numeric: true, minWidth: 110 },
    { header: `Version ${b}`, cell: (r) => comparisonValue(r.b), numeric: true, minWidth: 110 },
    { header: '', cell: (r) => (r.changed ? <Badge label="Changed" tone="accent" /> : <Text variant="caption" tone="muted">same</Text>), minWidth: 90 },
  ];
}

/** Two versions side by side: inputs, whole-body values and segment values; changed lines highlighted. */
export function VersionComparison({ crewMemberId, a, b }: VersionComparisonProps) {
  const [filter, setFilter] = useState<'changed' | 'all'>('changed');
  const cmp = useProfileComparisonQuery(crewMemberId, a, b);
  if (a === b) return <Text tone="muted">Choose two different versions to compare.</Text>;
  if (cmp.isPending) return <LoadingState label="Comparing…" />;
  if (cmp.isError) return <ErrorBanner title="Could not compare the versions" error={cmp.error} onRetry={() => void cmp.refetch()} />;
  const c = cmp.data;
  const pick = (rows: ComparisonRow[]) => (filter === 'changed' ? rows.filter((r) => r.changed) : rows);
  const groups = [
    { title: 'Inputs', rows: pick(c.inputs) },
    { title: 'Whole body (reference posture)', rows: pick(c.wholeBody) },
    { title: 'Segments', rows: pick(c.segments) },
  ];
  const cols = columns(a, b);
  return (
    <View style={gaps.md} aria-label={`Comparison of versions ${a} and ${b}`}>
      <View style={gaps.sm}>
        <Text variant="bodyStrong" role="status">
          {c.changedCount === 0 ? 'No differences.' : `${c.changedCount} value${c.changedCount === 1 ? '' : 's'} changed between version ${a} and version ${b}.`}
        </Text>
        <View style={styles.filter}>
          <SegmentedControl label="Show" hideLabel options={FILTERS} value={filter} onChange={setFilter} />
        </View>
      </View>
      {groups.map((g) =>
        g.rows.length ? (
          <Card key={g.title} title={g.title} padding="none">
            <DataTable label={`${g.title}: version ${a} and version ${b}`} columns={cols} rows={g.rows} rowKey={(r) => r.key} rowTone={(r) => (r.changed ? 'changed' : undefined)} />
          </Card>
        ) : null,
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  filter: { maxWidth: 320 },
});
