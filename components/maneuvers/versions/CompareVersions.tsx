import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useCompareQuery } from '@/components/api/use-sequences';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { DataTable } from '@/components/ui/DataTable';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Select } from '@/components/ui/Select';
import { Text } from '@/components/ui/Text';
import type { CompareResponse, VersionSummary } from '@/shared/contracts/maneuver';

import { fmtNum } from '../report/format';

/** Props of {@link CompareVersions}. */
export interface CompareVersionsProps {
  /** Versions to choose from, newest first. */
  versions: readonly VersionSummary[];
}

type Figure = keyof CompareResponse['result'];
const FIGURES: { key: Exclude<Figure, 'finalAttitudeShiftDeg'>; label: string; unit: string; decimals: number }[] = [
  { key: 'targetErrorDeg', label: 'Error to target', unit: '°', decimals: 2 },
  { key: 'yawDeg', label: 'Yaw reached', unit: '°', decimals: 1 },
  { key: 'pitchDeg', label: 'Pitch reached', unit: '°', decimals: 1 },
  { key: 'rollDeg', label: 'Roll reached', unit: '°', decimals: 1 },
  { key: 'durationS', label: 'Duration', unit: ' s', decimals: 1 },
  { key: 'peakJointRateDegS', label: 'Peak joint rate', unit: ' °/s', decimals: 0 },
  { key: 'rangeViolationCount', label: 'Range violations', unit: '', decimals: 0 },
];

const CHANGE_WORDS = { same: 'same', changed: 'changed', added: 'added', removed: 'removed' } as const;

/** Two versions side by side: which steps changed and how the result moved. */
export function CompareVersions({ versions }: CompareVersionsProps) {
  const [a, setA] = useState(versions[1]?.id ?? '');
  const [b, setB] = useState(versions[0]?.id ?? '');
  const q = useCompareQuery(a || undefined, b || undefined);
  if (versions.length < 2) return <Text tone="muted">Save a second version to compare two.</Text>;
  const options = versions.map((v) => ({ value: v.id, label: `Version ${v.version}` }));
  const va = versions.find((v) => v.id === a);
  const vb = versions.find((v) => v.id === b);
  return (
    <View style={styles.wrap} testID="compare-versions">
      <View style={styles.pickers}>
        <View style={styles.picker}>
          <Select label="Compare" options={options} value={a} onChange={setA} />
        </View>
        <View style={styles.picker}>
          <Select label="with" options={options} value={b} onChange={setB} />
        </View>
      </View>
      {a === b ? <Text tone="muted">Choose two different versions.</Text> : null}
      {q.isLoading ? <LoadingState label="Comparing…" /> : null}
      {q.isError ? <ErrorBanner title="Could not compare" error={q.error} onRetry={() => void q.refetch()} /> : null}
      {q.data && a !== b ? (
        <>
          {!q.data.sameProfile ? <Text tone="accent">The two versions were computed for different profile versions.</Text> : null}
          {!q.data.sameEngine ? <Text tone="accent">The two versions were computed by different engine versions.</Text> : null}
          <Text variant="heading">Steps</Text>
          <View role="list" aria-label="Steps compared" style={gaps.xs}>
            {q.data.primitives.map((r) => (
              <View key={r.index} role="listitem" style={[styles.change, r.change !== 'same' && styles.changed]}>
                <Text variant="label" tone={r.change === 'same' ? 'muted' : 'accent'}>
                  Step {r.index + 1} · {CHANGE_WORDS[r.change]}
                </Text>
                {r.change === 'same' ? (
                  <Text variant="caption" tone="muted">{r.a}</Text>
                ) : (
                  <>
                    <Text variant="caption">v{va?.version ?? '?'}: {r.a ?? '—'}</Text>
                    <Text variant="caption">v{vb?.version ?? '?'}: {r.b ?? '—'}</Text>
                  </>
                )}
              </View>
            ))}
          </View>
          <Text variant="heading">Result</Text>
          <DataTable
            label="Results compared"
            rows={FIGURES}
            rowKey={(f) => f.key}
            columns={[
              { header: 'Figure', cell: (f) => f.label, minWidth: 110, flex: 2 },
              { header: `v${va?.version ?? '?'}`, cell: (f) => withUnit(q.data.result[f.key].a, f.decimals, f.unit), numeric: true, minWidth: 64 },
              { header: `v${vb?.version ?? '?'}`, cell: (f) => withUnit(q.data.result[f.key].b, f.decimals, f.unit), numeric: true, minWidth: 64 },
              { header: 'Change', cell: (f) => signed(q.data.result[f.key].delta, f.decimals, f.unit), numeric: true, minWidth: 64 },
            ]}
          />
          <Text variant="caption" tone="muted">
            Final attitudes differ by {withUnit(q.data.result.finalAttitudeShiftDeg, 2, '°')}.
          </Text>
        </>
      ) : null}
    </View>
  );
}

function withUnit(v: number | null, decimals: number, unit: string): string {
  return v == null ? '—' : `${fmtNum(v, decimals)}${unit}`;
}

function signed(v: number | null, decimals: number, unit: string): string {
  if (v == null) return '—';
  const s = fmtNum(v, decimals);
  return `${v > 0 && Number(s) !== 0 ? '+' : ''}${s}${unit}`;
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.md, borderTopWidth: 1, borderTopColor: colors.border, paddingTop: spacing.md },
  pickers: { flexDirection: 'row', gap: spacing.md, flexWrap: 'wrap' },
  picker: { flexGrow: 1, flexBasis: 140 },
  change: { padding: spacing.sm, borderRadius: radii.sm, gap: 2 },
  changed: { backgroundColor: colors.accentTint },
});
