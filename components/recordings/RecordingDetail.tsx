import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { errorMessage } from '@/components/api/client';
import { useRecordingMappingMutation } from '@/components/api/use-recordings';
import { LinePlot } from '@/components/charts/LinePlot';
import { plotColors } from '@/components/charts/plot-colors';
import { colors, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Select } from '@/components/ui/Select';
import { Text } from '@/components/ui/Text';
import { type BvhMapping, MAPPED_SEGMENTS, type MappedSegment, type RecordingView } from '@/shared/contracts/recording';

/** Props of {@link RecordingDetail}. */
export interface RecordingDetailProps {
  recording: RecordingView;
}

const SERIES_COLORS = [plotColors.yaw, plotColors.pitch, plotColors.roll, '#F2B880', '#9AD0EC', '#E58FA8'];

/** An imported recording: its track plotted, what the import assumed and, for BVH, the editable joint mapping. */
export function RecordingDetail({ recording: r }: RecordingDetailProps) {
  const t = r.frames.map((_, k) => k / r.rateHz);
  return (
    <View style={styles.wrap} testID="recording-detail">
      <Text variant="label">{r.name}</Text>
      <Text variant="caption" tone="muted">
        {r.frames.length} frames at {Math.round(r.rateHz * 1000) / 1000} Hz, {r.duration.toFixed(2)} s · {r.dofs.length} dofs · from {r.fileName}
      </Text>
      <LinePlot
        title="Recorded joint angles"
        summary={`${r.dofs.length} joint angles over ${r.duration.toFixed(1)} s.`}
        x={t}
        yUnit="°"
        height={180}
        series={r.dofs.slice(0, 6).map((d, j) => ({ name: d, color: SERIES_COLORS[j % SERIES_COLORS.length], values: r.frames.map((f) => f[j]) }))}
      />
      <Text variant="label">Assumptions</Text>
      {r.assumptions.map((a) => <Text key={a} variant="caption" tone="muted">{a}</Text>)}
      {r.source === 'bvh' && r.mapping && r.bvhJoints ? <MappingTable recording={r} mapping={r.mapping} /> : null}
    </View>
  );
}

/** The BVH joint driving each model segment, and the figure's facing; Apply rebuilds the track. */
function MappingTable({ recording, mapping }: { recording: RecordingView; mapping: BvhMapping }) {
  const [draft, setDraft] = useState<BvhMapping>(mapping);
  const save = useRecordingMappingMutation(recording.id);
  const options = (recording.bvhJoints ?? []).map((j) => ({ value: j.name, label: j.name }));
  return (
    <View style={styles.wrap} testID="mapping-table">
      <Text variant="label">Joint mapping</Text>
      {MAPPED_SEGMENTS.map((s: MappedSegment) => (
        <Select<string>
          key={s}
          label={s.replace(/_/g, ' ')}
          options={options}
          placeholder="not mapped"
          value={draft.joints[s] ?? ''}
          onChange={(v) => setDraft({ ...draft, joints: { ...draft.joints, [s]: v } })}
        />
      ))}
      <Select<'+z' | '-z'>
        label="Figure faces"
        options={[{ value: '+z', label: '+Z (its left is +X)' }, { value: '-z', label: '−Z (its left is −X)' }]}
        value={draft.facing}
        onChange={(v) => v && setDraft({ ...draft, facing: v })}
      />
      <Button label="Apply mapping" icon="refresh-cw" size="sm" loading={save.isPending} onPress={() => save.mutate({ ...draft, dofs: undefined })} testID="apply-mapping" />
      {save.isError ? <Text tone="danger" role="alert">{errorMessage(save.error)}</Text> : null}
      {save.isSuccess ? <Text tone="muted" role="status">Mapping applied: {save.data.recording.dofs.length} dofs.</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs, paddingTop: spacing.sm, borderTopWidth: 1, borderTopColor: colors.border },
});
