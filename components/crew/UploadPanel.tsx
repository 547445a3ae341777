import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useCrewListQuery } from '@/components/api/use-crew';
import { useMeasurementsUploadMutation, useSegmentTableUploadMutation } from '@/components/api/use-uploads';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { Select } from '@/components/ui/Select';
import { Text } from '@/components/ui/Text';
import { MEASUREMENT_COLUMNS, MEASUREMENT_REQUIRED, SEGMENT_TABLE_COLUMNS, UPLOAD_MAX_BYTES } from '@/shared/contracts/uploads';

import { FilePicker } from './FilePicker';
import { UploadResultView } from './UploadResultView';

const LIMIT = `${UPLOAD_MAX_BYTES / 1024 / 1024} MiB`;

/** Monospace line with a documented header. */
function HeaderLine({ columns }: { columns: readonly string[] }) {
  return (
    <View style={styles.code}>
      <Text variant="numeric" selectable>
        {columns.join(',')}
      </Text>
    </View>
  );
}

/** Planner uploads: a measurements CSV for several crew members, or a measured segment table for one. */
export function UploadPanel() {
  const [csv, setCsv] = useState<File | null>(null);
  const measurements = useMeasurementsUploadMutation();
  const [table, setTable] = useState<File | null>(null);
  const [memberId, setMemberId] = useState('');
  const segmentTable = useSegmentTableUploadMutation();
  const crew = useCrewListQuery('');
  const member = crew.data?.find((m) => m.id === memberId);

  return (
    <View style={gaps.md}>
      <Card title="Measurements CSV" subtitle="One row per crew member; a row whose name matches an existing member adds a version to that member, others create new members.">
        <View style={gaps.md}>
          <Text variant="label" tone="muted">Header (first line), columns in any order:</Text>
          <HeaderLine columns={MEASUREMENT_COLUMNS} />
          <Text variant="caption" tone="muted">
            Required: {MEASUREMENT_REQUIRED.join(', ')}. sex is female or male; lengths in metres (decimal point), mass in kg; suit is a suit id
            (cabin-clothing, pressurised-suit) or empty. If any row is wrong, nothing is imported and every problem is listed by row and column.
          </Text>
          <FilePicker label="Measurements file" accept=".csv,text/csv" onPick={setCsv} hint={`A .csv file up to ${LIMIT}.`} />
          <Button label="Upload and import" icon="upload" disabled={!csv} loading={measurements.isPending} onPress={() => csv && measurements.mutate(csv)} />
          <ErrorBanner error={measurements.error} />
          {measurements.data ? <UploadResultView outcome={measurements.data} /> : null}
        </View>
      </Card>

      <Card title="Measured segment table" subtitle="Replaces the regression for one crew member: a CSV of segment mass properties (joints kept), or a complete body as contract JSON.">
        <View style={gaps.md}>
          <HeaderLine columns={SEGMENT_TABLE_COLUMNS} />
          <Text variant="caption" tone="muted">
            One row per segment to replace (segment names as in the derived body, e.g. l_thigh); CoM in the segment frame (m); inertia about the segment CoM (kg·m²);
            the three products of inertia may be empty.
          </Text>
          <Select
            label="Crew member"
            placeholder="Choose…"
            options={(crew.data ?? []).map((m) => ({ value: m.id, label: `${m.name}${m.currentVersion ? ` (v${m.currentVersion})` : ''}` }))}
            value={memberId}
            onChange={setMemberId}
          />
          <FilePicker label="Segment table file" accept=".csv,.json" onPick={setTable} hint={`A .csv or .json file up to ${LIMIT}.`} />
          <Button
            label="Upload segment table"
            icon="upload"
            variant="secondary"
            disabled={!table || !member}
            loading={segmentTable.isPending}
            onPress={() => table && member && segmentTable.mutate({ file: table, crewMemberId: member.id, baseVersion: member.currentVersion ?? 0 })}
          />
          <ErrorBanner error={segmentTable.error} />
          {segmentTable.data ? <UploadResultView outcome={segmentTable.data} /> : null}
        </View>
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  code: { padding: spacing.sm, borderRadius: radii.sm, backgroundColor: colors.background, borderWidth: 1, borderColor: colors.border },
});
