import { useState } from 'react';
import { View } from 'react-native';

import { errorMessage } from '@/components/api/client';
import { useLogRehearsalMutation } from '@/components/api/use-rehearsals';
import { gaps } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { SegmentedControl } from '@/components/ui/SegmentedControl';
import { Text } from '@/components/ui/Text';
import { TextField } from '@/components/ui/TextField';
import { PLAYBACK_SPEEDS } from '@/shared/contracts/rehearsal';

import type { RunSummary } from './RehearsalPlayer';

/** Props of {@link RehearsalLogForm}. */
export interface RehearsalLogFormProps {
  versionId: string;
  totalSteps: number;
  /** Prefill from the last run in the player (null: nothing played yet). Give the form a new `key` per run to refill it. */
  run: RunSummary | null;
  /** Called after a successful save. */
  onSaved?: () => void;
}

const RATINGS = [1, 2, 3, 4, 5].map((r) => ({ value: String(r), label: String(r) }));
const SPEEDS = PLAYBACK_SPEEDS.map((s) => ({ value: String(s), label: `${s}×` }));

/** The rehearsal log: completed steps, playback speed, a 1–5 self-rating and notes. */
export function RehearsalLogForm({ versionId, totalSteps, run, onSaved }: RehearsalLogFormProps) {
  const log = useLogRehearsalMutation();
  const [completed, setCompleted] = useState(String(run?.completedSteps ?? totalSteps));
  const [speed, setSpeed] = useState(String(run?.playbackSpeed ?? 1));
  const [rating, setRating] = useState<string | undefined>(undefined);
  const [notes, setNotes] = useState('');
  const [saved, setSaved] = useState(false);

  const n = Number(completed);
  const completedError = completed.trim() === '' || !Number.isInteger(n) || n < 0 || n > totalSteps ? `Enter a whole number from 0 to ${totalSteps}.` : undefined;
  const serverField = (log.error as { field?: string } | null)?.field;
  const submit = () => {
    if (completedError || !rating) return;
    log.mutate(
      { sequenceVersionId: versionId, completedSteps: n, playbackSpeed: Number(speed), selfRating: Number(rating), notes: notes.trim() },
      { onSuccess: () => { setSaved(true); setNotes(''); setRating(undefined); onSaved?.(); } },
    );
  };

  return (
    <Card title="Log this rehearsal" subtitle="Record how the run went; your history is below.">
      <View style={gaps.lg}>
        <TextField
          label="Completed steps"
          unit={`of ${totalSteps}`}
          keyboardType="number-pad"
          inputMode="numeric"
          value={completed}
          onChangeText={(t) => { setCompleted(t); setSaved(false); }}
          error={completedError ?? (serverField === 'completedSteps' ? errorMessage(log.error) : undefined)}
        />
        <SegmentedControl label="Playback speed" options={SPEEDS} value={speed} onChange={(v) => { setSpeed(v); setSaved(false); }} />
        <SegmentedControl
          label="How did it go? (1 struggled … 5 confident)"
          options={RATINGS}
          value={rating}
          onChange={(v) => { setRating(v); setSaved(false); }}
        />
        <TextField label="Notes" placeholder="What felt off, what to try next time" multiline numberOfLines={3} value={notes} onChangeText={setNotes} maxLength={2000} />
        {log.isError && serverField !== 'completedSteps' ? <Text tone="danger">{errorMessage(log.error)}</Text> : null}
        {saved ? (
          <Text tone="success" role="status">
            Rehearsal logged.
          </Text>
        ) : null}
        <Button label="Save rehearsal" icon="check" onPress={submit} loading={log.isPending} disabled={!!completedError || !rating} />
        {!rating ? (
          <Text variant="caption" tone="muted">
            Choose a rating to save.
          </Text>
        ) : null}
      </View>
    </Card>
  );
}
