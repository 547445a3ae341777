import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useSubmitVersionMutation } from '@/components/api/use-sequences';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { Icon } from '@/components/ui/Icon';
import { Sheet } from '@/components/ui/Sheet';
import { Text } from '@/components/ui/Text';
import { TextField } from '@/components/ui/TextField';
import type { VersionDetail } from '@/shared/contracts/maneuver';
import type { CheckFailure } from '@/shared/product/version-checks';

import type { VersionChecks } from './use-version-checks';
import { VersionKeyFigures } from './VersionKeyFigures';

/** Props of {@link SubmitForReview}. */
export interface SubmitForReviewProps {
  version: VersionDetail;
  checks: VersionChecks;
}

/**
 * "Submit for review" with a confirmation naming the version and its key figures. A version that
 * fails a check goes only with a note for the reviewer (the server's guarded submit): the sheet lists
 * the failures and the submit button says that they are acknowledged.
 */
export function SubmitForReview({ version, checks }: SubmitForReviewProps) {
  const [open, setOpen] = useState(false);
  const [note, setNote] = useState('');
  const [noteError, setNoteError] = useState<string | undefined>();
  const submit = useSubmitVersionMutation();
  const failing = checks.failures.length > 0;
  const close = () => {
    setOpen(false);
    submit.reset();
  };
  const send = () => {
    if (failing && !note.trim()) {
      setNoteError('Tell the reviewer why this version should be reviewed although it fails these checks.');
      return;
    }
    setNoteError(undefined);
    submit.mutate(
      { versionId: version.id, request: failing ? { note: note.trim(), acknowledgeFailures: true } : { note: note.trim() || undefined } },
      { onSuccess: () => setOpen(false) },
    );
  };
  return (
    <>
      <Button label="Submit for review" icon="send" variant="secondary" loading={submit.isPending} disabled={checks.pending} onPress={() => setOpen(true)} testID="submit-review" />
      <Sheet
        visible={open}
        onClose={close}
        title={`Submit version ${version.version} for review?`}
        footer={
          <View style={styles.footer}>
            <Button label="Cancel" variant="ghost" onPress={close} />
            <Button
              label={failing ? 'Submit with failures noted' : `Submit version ${version.version}`}
              icon="send"
              variant={failing ? 'danger' : 'primary'}
              loading={submit.isPending}
              onPress={send}
              testID="submit-confirm"
            />
          </View>
        }
      >
        <View style={gaps.md} testID="submit-sheet">
          <Text>
            {version.sequence.name}, version {version.version}, for {version.sequence.crewMemberName} (profile v{version.profileVersion}). Reviewers are told by e-mail;
            saving changes afterwards makes a new version and withdraws this one.
          </Text>
          <VersionKeyFigures report={version.report} robustness={checks.robustness} />
          {failing ? <FailureList failures={checks.failures} title="This version fails these checks" /> : <Text tone="success">It passes every check: target, joint ranges, rate limit, time budget and robustness computed.</Text>}
          <TextField
            label={failing ? 'Note for the reviewer (required)' : 'Note for the reviewer (optional)'}
            value={note}
            onChangeText={setNote}
            multiline
            numberOfLines={3}
            error={noteError}
            placeholder={failing ? 'Why should it be reviewed as it is?' : 'Anything the reviewer should look at'}
            testID="submit-note"
          />
          <ErrorBanner title="Not submitted" error={submit.error} />
        </View>
      </Sheet>
    </>
  );
}

/** The failed checks as a list with a warning mark; reused over drafts and on the review page. */
export function FailureList({ failures, title }: { failures: readonly CheckFailure[]; title: string }) {
  return (
    <View style={styles.failures} role="alert" testID="check-failures">
      <View style={styles.failHead}>
        <Icon name="alert-triangle" size={16} color={colors.danger} />
        <Text variant="bodyStrong" tone="danger">
          {title}
        </Text>
      </View>
      {failures.map((f) => (
        <Text key={f.check} variant="caption">
          • {f.message.charAt(0).toUpperCase() + f.message.slice(1)}.
        </Text>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  footer: { flexDirection: 'row', justifyContent: 'flex-end', gap: spacing.sm, flexWrap: 'wrap' },
  failures: { gap: spacing.xs, padding: spacing.md, borderRadius: radii.md, borderWidth: 1, borderColor: colors.danger, backgroundColor: colors.dangerTint },
  failHead: { flexDirection: 'row', gap: spacing.sm, alignItems: 'center' },
});
