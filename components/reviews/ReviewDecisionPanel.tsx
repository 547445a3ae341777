import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useReviewCommentMutation, useReviewDecisionMutation } from '@/components/api/use-reviews';
import { FailureList } from '@/components/maneuvers/submit/SubmitForReview';
import { useVersionChecks } from '@/components/maneuvers/submit/use-version-checks';
import { VersionKeyFigures } from '@/components/maneuvers/submit/VersionKeyFigures';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { Sheet } from '@/components/ui/Sheet';
import { Text } from '@/components/ui/Text';
import { TextField } from '@/components/ui/TextField';
import type { VersionDetail } from '@/shared/contracts/maneuver';

/** Props of {@link ReviewDecisionPanel}. */
export interface ReviewDecisionPanelProps {
  version: VersionDetail;
  /** Called after a decision (clear or send back) went through. */
  onDecided?: (version: VersionDetail) => void;
}

/**
 * The reviewer's controls: a comment, and clear or send back. Sending back needs a comment (the
 * shared contract says so too); what the server refuses (own version, not under review) shows in a banner.
 */
export function ReviewDecisionPanel({ version, onDecided }: ReviewDecisionPanelProps) {
  const [comment, setComment] = useState('');
  const [commentError, setCommentError] = useState<string | undefined>();
  const decide = useReviewDecisionMutation();
  const addComment = useReviewCommentMutation();
  const busy = decide.isPending || addComment.isPending;
  const { allowed } = version;
  const checks = useVersionChecks(version);
  const [confirmClear, setConfirmClear] = useState(false);

  if (!allowed.decide && !allowed.comment) {
    return (
      <Text tone="muted" testID="review-not-allowed">
        {version.status === 'under_review'
          ? 'You wrote this version, so another reviewer decides on it.'
          : 'This version is not waiting for a decision.'}
      </Text>
    );
  }

  const send = (decision: 'clear' | 'send_back') => {
    if (decision === 'send_back' && !comment.trim()) {
      setCommentError('Say why the version is sent back.');
      return;
    }
    setCommentError(undefined);
    decide.mutate(
      { versionId: version.id, request: { decision, comment: comment.trim() } },
      {
        onSuccess: (v) => {
          setComment('');
          setConfirmClear(false);
          onDecided?.(v);
        },
      },
    );
  };

  return (
    <View style={styles.panel} testID="review-decision">
      <Text variant="heading" role="heading" aria-level={2}>
        Decision
      </Text>
      <Text variant="caption" tone="muted">
        Clearing binds to version {version.version}, profile v{version.profileVersion} and engine {version.engineVersion ?? '—'}. Check the range margins and joint rates, not only the target error.
      </Text>
      <ErrorBanner title="Not recorded" error={decide.error ?? addComment.error} />
      <TextField label="Comment" value={comment} onChangeText={setComment} multiline numberOfLines={3} error={commentError} placeholder="What you checked, or what must change" />
      <View style={styles.buttons}>
        {allowed.decide ? <Button label={version.recheckOfId ? 'Re-clear version' : 'Clear version'} icon="check-circle" loading={decide.isPending && decide.variables?.request.decision === 'clear'} disabled={busy} onPress={() => setConfirmClear(true)} testID="review-clear" /> : null}
        {allowed.decide ? <Button label="Send back" icon="corner-up-left" variant="danger" disabled={busy} onPress={() => send('send_back')} testID="review-send-back" /> : null}
        {allowed.comment ? (
          <Button
            label="Comment only"
            icon="message-square"
            variant="secondary"
            disabled={busy || !comment.trim()}
            loading={addComment.isPending}
            onPress={() => addComment.mutate({ versionId: version.id, request: { comment: comment.trim() } }, { onSuccess: () => setComment('') })}
          />
        ) : null}
      </View>
      <Sheet
        visible={confirmClear}
        onClose={() => setConfirmClear(false)}
        title={`${version.recheckOfId ? 'Re-clear' : 'Clear'} version ${version.version}?`}
        footer={
          <View style={styles.footer}>
            <Button label="Cancel" variant="ghost" onPress={() => setConfirmClear(false)} />
            <Button label={`${version.recheckOfId ? 'Re-clear' : 'Clear'} version ${version.version}`} icon="check-circle" loading={decide.isPending} onPress={() => send('clear')} testID="review-clear-confirm" />
          </View>
        }
      >
        <View style={gaps.md} testID="clear-sheet">
          <Text>
            {version.sequence.name}, version {version.version}, for {version.sequence.crewMemberName}: clearing binds to this version, profile v{version.profileVersion} and engine{' '}
            {version.engineVersion ?? '—'}, and {version.sequence.crewMemberName} may rehearse it.
          </Text>
          <VersionKeyFigures report={version.report} robustness={checks.robustness} />
          {checks.failures.length ? <FailureList failures={checks.failures} title="It fails these checks now" /> : null}
          {version.submitNote ? <Text variant="caption">Submitter’s note: “{version.submitNote}”</Text> : null}
          <ErrorBanner title="Not recorded" error={decide.error} />
        </View>
      </Sheet>
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: spacing.md, padding: spacing.lg, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.accent, backgroundColor: colors.surface },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  footer: { flexDirection: 'row', justifyContent: 'flex-end', gap: spacing.sm, flexWrap: 'wrap' },
});
