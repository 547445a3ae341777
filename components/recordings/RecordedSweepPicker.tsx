import { useState } from 'react';
import { View } from 'react-native';

import { apiFetch, errorMessage } from '@/components/api/client';
import { useRecordingsQuery } from '@/components/api/use-recordings';
import { spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Select } from '@/components/ui/Select';
import { Text } from '@/components/ui/Text';
import type { RecordingView } from '@/shared/contracts/recording';
import type { RecordedSweep } from '@/shared/primitives/primitive-schemas';

/** Props of {@link RecordedSweepPicker}. */
export interface RecordedSweepPickerProps {
  /** Called with a new recorded-sweep step (whole recording, played once) to edit and add. */
  onPick: (step: RecordedSweep) => void;
}

/** Chooses an imported recording and turns it into a "recorded sweep" step (trim and repeat are edited next). */
export function RecordedSweepPicker({ onPick }: RecordedSweepPickerProps) {
  const [open, setOpen] = useState(false);
  const [id, setId] = useState('');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const list = useRecordingsQuery(open);
  if (!open) return <Button label="Add recorded sweep" icon="activity" variant="secondary" size="sm" onPress={() => setOpen(true)} testID="add-recorded-sweep" />;
  const choose = async () => {
    setBusy(true);
    setError(null);
    try {
      const r = (await apiFetch<{ recording: RecordingView }>(`/recordings/${id}`)).recording;
      onPick({
        kind: 'recorded_sweep', recordingId: r.id, recordingName: r.name, rateHz: r.rateHz, dofs: r.dofs, frames: r.frames,
        trimStartS: 0, trimEndS: Math.floor(r.duration * 1000) / 1000, repeat: 1,
      });
      setOpen(false);
    } catch (err) {
      setError(errorMessage(err));
    } finally {
      setBusy(false);
    }
  };
  return (
    <View style={{ gap: spacing.xs }} testID="recorded-sweep-picker">
      <Select<string>
        label="Recording"
        placeholder={list.isPending ? 'Loading…' : list.data?.length ? 'Choose a recording' : 'No recordings yet (Crew → Upload)'}
        options={(list.data ?? []).map((r) => ({ value: r.id, label: `${r.name} · ${r.duration.toFixed(1)} s · ${r.dofs.length} dofs` }))}
        value={id}
        onChange={setId}
      />
      <Button label="Use as step" icon="plus" size="sm" disabled={!id} loading={busy} onPress={() => void choose()} testID="use-recording" />
      {error || list.isError ? <Text tone="danger" role="alert">{error ?? errorMessage(list.error)}</Text> : null}
    </View>
  );
}
