import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Icon, type IconName } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';
import type { VersionDetail } from '@/shared/contracts/maneuver';
import { recheckMessage } from '@/shared/product/recheck-status';
import type { CheckFailure } from '@/shared/product/version-checks';

import { CueCardButton } from './CueCardButton';
import { fmtWhen } from './report/format';
import { FailureList } from './submit/SubmitForReview';
import { useVersionChecks } from './submit/use-version-checks';

/** Props of {@link VersionStatusNotice}. */
export interface VersionStatusNoticeProps {
  version: VersionDetail;
  /** Leave out the author's next steps (for reviewers); default false. */
  forReviewer?: boolean;
}

/** What the version's status means for the person looking at it, in one or two sentences. */
export function VersionStatusNotice({ version: v, forReviewer = false }: VersionStatusNoticeProps) {
  const checks = useVersionChecks(v);
  let icon: IconName = 'info';
  let color: string = colors.muted;
  let text: string;
  let failures: CheckFailure[] = [];
  const lastSendBack = [...v.reviews].reverse().find((r) => r.decision === 'send_back');
  switch (v.status) {
    case 'drafting':
      // Never "ready" above a failure: the same checks the server applies at submit.
      if (!v.report) text = 'Draft without a verification report.';
      else if (checks.pending) text = 'Verified draft; reading its robustness run…';
      else if (checks.failures.length) {
        icon = 'alert-triangle';
        color = colors.danger;
        failures = checks.failures;
        text = `Draft, not ready for review: it fails ${failures.length} check${failures.length === 1 ? '' : 's'}. ${forReviewer ? '' : 'Change the steps, or submit it with a note telling the reviewer why.'}`;
      } else {
        icon = 'check';
        color = colors.success;
        text = 'Verified draft: on target, within joint ranges, rate limit and time budget, robustness computed. Submit it for review when the report looks right.';
      }
      break;
    case 'under_review':
      icon = 'clock';
      color = colors.accent;
      if (v.recheckOfId) {
        text = `Automatic re-check after a profile change: the steps of a cleared version, re-verified on profile v${v.profileVersion}. The crew member cannot rehearse the maneuver until a reviewer re-clears it or sends it back.`;
        break;
      }
      text = `Submitted ${fmtWhen(v.submittedAt)}; waiting for a reviewer.${forReviewer ? '' : ' Saving changes makes a new version.'}`;
      if (v.acknowledgedFailures?.length) {
        color = colors.danger;
        failures = v.acknowledgedFailures;
        text += ` Submitted although it failed ${failures.length} check${failures.length === 1 ? '' : 's'}, with the note “${v.submitNote ?? ''}”.`;
      }
      break;
    case 'cleared':
      icon = 'check-circle';
      color = colors.success;
      text = `Cleared by ${v.clearedByName ?? 'a reviewer'} on ${fmtWhen(v.clearedAt)} for profile v${v.profileVersion}, engine ${v.engineVersion ?? '—'}. A cleared version is frozen${forReviewer ? '' : '; saving changes makes a new version'}.`;
      break;
    case 'sent_back':
      icon = 'corner-up-left';
      color = colors.danger;
      text = `Sent back${lastSendBack ? ` by ${lastSendBack.reviewerName}: “${lastSendBack.comment}”` : ''}. Change the steps and save a new version.`;
      break;
    case 'replaced':
      icon = 'layers';
      text = 'A newer version replaced this one. It stays here for the record.';
      break;
    case 'recheck': {
      icon = 'alert-triangle';
      color = colors.danger;
      text = `The crew member's profile changed since this version was verified (it used v${v.profileVersion}). ${v.recheck ? recheckMessage(v.recheck, 'staff') : ''}`;
      break;
    }
  }
  return (
    <View style={[styles.box, { borderColor: color }]} role="status" testID="version-status-notice">
      <View style={styles.row}>
        <Icon name={icon} size={16} color={color} />
        <Text variant="caption" style={styles.text}>
          {text}
        </Text>
        {v.status === 'cleared' ? <CueCardButton versionId={v.id} /> : null}
      </View>
      {failures.length ? <FailureList failures={failures} title={v.status === 'drafting' ? 'What fails' : 'Failed checks the submitter acknowledged'} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: spacing.sm, padding: spacing.md, borderRadius: radii.md, borderWidth: 1, backgroundColor: colors.surface },
  row: { flexDirection: 'row', gap: spacing.sm, alignItems: 'flex-start' },
  text: { flex: 1 },
});
