import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useSequenceLifecycleMutation } from '@/components/api/use-sequences';
import { formatDateTime } from '@/components/format/date-time';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import type { IconName } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';
import type { SequenceDetail } from '@/shared/contracts/maneuver';

/** Props of {@link SequenceLifecycle}. */
export interface SequenceLifecycleProps {
  sequence: SequenceDetail;
  /** Whether the user may archive, restore and delete (planners and admins). */
  canCompose: boolean;
  /** Called after the maneuver was deleted (leave its screen). */
  onDeleted: () => void;
}

/** Whether no version of the sequence ever reached a reviewer (the server's rule for deleting). */
function neverSubmitted(sequence: SequenceDetail): boolean {
  return sequence.versions.every((v) => v.submittedAt === null && (v.status === 'drafting' || v.status === 'replaced'));
}

/**
 * The archived notice and the archive / restore / delete actions of one maneuver, each asking for
 * confirmation in place. Deleting is offered only while no version has been submitted; afterwards the
 * maneuver stays on record and can only be archived.
 */
export function SequenceLifecycle({ sequence, canCompose, onDeleted }: SequenceLifecycleProps) {
  const action = useSequenceLifecycleMutation(sequence.id);
  const [asking, setAsking] = useState<'archive' | 'delete' | null>(null);
  const archived = sequence.archivedAt !== null;
  const underReview = sequence.versions.some((v) => v.status === 'under_review');
  const deletable = neverSubmitted(sequence);
  const drafts = sequence.versions.length;
  const whatGoes = drafts === 0 ? 'It has no versions yet.' : `Its ${drafts === 1 ? 'draft' : `${drafts} drafts`}, plans and robustness runs go with it.`;

  const run = (what: 'archive' | 'restore' | 'delete') =>
    action.mutate(what, { onSuccess: () => (setAsking(null), what === 'delete' ? onDeleted() : undefined) });

  return (
    <View style={gaps.sm}>
      {archived ? (
        <View style={styles.notice} testID="archived-notice">
          <Text variant="label">Archived {formatDateTime(sequence.archivedAt!)}</Text>
          <Text variant="caption" tone="muted">
            Out of the maneuver list and out of trainees’ rehearsals. Its versions and reviews are kept; restore it to change it again.
          </Text>
          {canCompose ? (
            <View style={styles.row}>
              <Button label="Restore" icon="rotate-ccw" size="sm" variant="secondary" loading={action.isPending} onPress={() => run('restore')} />
            </View>
          ) : null}
        </View>
      ) : null}
      {!archived && canCompose && asking === null ? (
        <View style={styles.row}>
          <Button
            label="Archive"
            icon="archive"
            size="sm"
            variant="ghost"
            disabled={underReview}
            onPress={() => setAsking('archive')}
            accessibilityLabel={`Archive ${sequence.name}`}
          />
          {deletable ? (
            <Button label="Delete" icon="trash-2" size="sm" variant="ghost" onPress={() => setAsking('delete')} accessibilityLabel={`Delete ${sequence.name}`} />
          ) : null}
          {underReview ? (
            <Text variant="caption" tone="muted" style={styles.flex}>
              A version is under review: it can be archived after the reviewer’s decision.
            </Text>
          ) : null}
        </View>
      ) : null}
      {asking === 'archive' ? (
        <ConfirmInPlace
          question={`Archive “${sequence.name}”?`}
          consequence={`It leaves the maneuver list and ${sequence.crewMemberName}’s rehearsals; nothing is deleted, and Restore brings it back.`}
          confirm={{ label: 'Archive', icon: 'archive' }}
          pending={action.isPending}
          onConfirm={() => run('archive')}
          onKeep={() => setAsking(null)}
        />
      ) : null}
      {asking === 'delete' ? (
        <ConfirmInPlace
          question={`Delete “${sequence.name}” for good?`}
          consequence={`${whatGoes} It never went to review, so no record is lost. This cannot be undone.`}
          confirm={{ label: 'Delete', icon: 'trash-2' }}
          pending={action.isPending}
          onConfirm={() => run('delete')}
          onKeep={() => setAsking(null)}
        />
      ) : null}
      {action.isError ? <ErrorBanner title="That did not work" error={action.error} /> : null}
    </View>
  );
}

/** A question asked in place of the buttons: what will happen, the action in red, and Keep. */
function ConfirmInPlace({ question, consequence, confirm, pending, onConfirm, onKeep }: {
  question: string;
  consequence: string;
  confirm: { label: string; icon: IconName };
  pending: boolean;
  onConfirm: () => void;
  onKeep: () => void;
}) {
  return (
    <View style={styles.confirm} role="alert">
      <Text variant="label">{question}</Text>
      <Text variant="caption" tone="muted">
        {consequence}
      </Text>
      <View style={styles.row}>
        <Button label={confirm.label} icon={confirm.icon} size="sm" variant="danger" loading={pending} onPress={onConfirm} />
        <Button label="Keep" size="sm" variant="secondary" onPress={onKeep} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm },
  flex: { flex: 1, minWidth: 160 },
  notice: { gap: spacing.xs, padding: spacing.md, borderRadius: radii.md, backgroundColor: colors.mutedTint, borderWidth: 1, borderColor: colors.border },
  confirm: { gap: spacing.xs, padding: spacing.md, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border },
});
