import { useState } from 'react';
import { View } from 'react-native';

import { apiFetch, errorMessage } from '@/components/api/client';
import { useRecordingsQuery } from '@/components/api/use-recordings';
import { gaps } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Select } from '@/components/ui/Select';
import { Text } from '@/components/ui/Text';
import type { CompileResponse } from '@/shared/contracts/maneuver';
import type { RecordingView } from '@/shared/contracts/recording';
import type { RecordedSweep } from '@/shared/primitives/primitive-schemas';
import { fitChannelsToBody } from '@/shared/primitives/recorded-channels';

/** Props of {@link RecordedSweepPicker}. */
export interface RecordedSweepPickerProps {
  /** The maneuver's crew member: the step keeps only the channels their current body has. */
  crewMemberId: string;
  /**
   * Called with a new recorded-sweep step (whole recording, played once) to edit and add, and the
   * recording's channels that were left out because the body has no such dof (e.g. locked by the suit).
   */
  onPick: (step: RecordedSweep, dropped: string[]) => void;
}

/**
 * Chooses an imported recording and turns it into a "recorded sweep" step (trim and repeat are
 * edited next). Only the channels the crew member's body has are kept; the others are reported.
 */
export function RecordedSweepPicker({ crewMemberId, onPick }: RecordedSweepPickerProps) {
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
      const step: RecordedSweep = {
        kind: 'recorded_sweep', recordingId: r.id, recordingName: r.name, rateHz: r.rateHz, dofs: r.dofs, frames: r.frames,
        trimStartS: 0, trimEndS: Math.floor(r.duration * 1000) / 1000, repeat: 1,
      };
      // The body's dofs (its current profile, suit included) decide which channels it can follow.
      const { ranges } = await apiFetch<CompileResponse>('/sequences/compile', { method: 'POST', body: { primitives: [step], crewMemberId } });
      const fitted = fitChannelsToBody(r, (d) => d in ranges);
      if (!fitted.dofs.length) {
        setError(`None of the recording's channels (${r.dofs.join(', ')}) is a joint of this crew member's body: check the recording's mapping.`);
        return;
      }
      onPick({ ...step, dofs: fitted.dofs, frames: fitted.frames }, fitted.dropped);
      setOpen(false);
    } catch (err) {
      setError(errorMessage(err));
    } finally {
      setBusy(false);
    }
  };
  return (
    <View style={gaps.xs} testID="recorded-sweep-picker">
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
