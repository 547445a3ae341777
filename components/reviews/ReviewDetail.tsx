import { StyleSheet, View } from 'react-native';

import { isApiStatus } from '@/components/api/client';
import { useVersionQuery } from '@/components/api/use-sequences';
import { useIsWide } from '@/components/layout/use-is-wide';
import { StepList } from '@/components/maneuvers/composer/StepList';
import { fmtWhen } from '@/components/maneuvers/report/format';
import { VerificationReport } from '@/components/maneuvers/report/VerificationReport';
import { RobustnessSummary } from '@/components/maneuvers/robustness/RobustnessSummary';
import { targetText } from '@/components/maneuvers/target-text';
import { VersionStatusBadge } from '@/components/maneuvers/VersionStatusBadge';
import { VersionStatusNotice } from '@/components/maneuvers/VersionStatusNotice';
import { gaps, spacing } from '@/components/theme';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Text } from '@/components/ui/Text';

import { RecheckChanges } from './RecheckChanges';
import { ReviewDecisionPanel } from './ReviewDecisionPanel';
import { ReviewHistory } from './ReviewHistory';

/** Props of {@link ReviewDetail}. */
export interface ReviewDetailProps {
  versionId: string;
}

/** One version as a reviewer sees it: what it is, the decision controls, its steps, report and history. */
export function ReviewDetail({ versionId }: ReviewDetailProps) {
  const q = useVersionQuery(versionId);
  const wide = useIsWide();
  if (q.isPending) return <LoadingState label="Loading the version…" />;
  if (q.isError) {
    return isApiStatus(q.error, 404, 403) ? (
      <EmptyState icon="slash" title="This version is not available" body="It does not exist, or your role cannot see it." />
    ) : (
      <ErrorBanner title="Could not load the version" error={q.error} onRetry={() => void q.refetch()} />
    );
  }
  const v = q.data;
  // on a phone the decision follows what it decides on; on a wide screen it stays in view at the top
  // the robustness comes right before the decision buttons in both layouts
  const panel = (
    <>
      <RobustnessSummary versionId={v.id} initial={v.report?.robustness ?? null} />
      <ReviewDecisionPanel version={v} />
    </>
  );
  return (
    <View style={gaps.lg} testID="review-detail">
      <View style={gaps.xs}>
        <View style={styles.titleRow}>
          <Text variant="title" role="heading" aria-level={1} style={styles.flex}>
            {v.sequence.name} · v{v.version}
          </Text>
          <VersionStatusBadge status={v.status} />
        </View>
        <Text tone="muted">
          {v.sequence.crewMemberName} · target {targetText(v.target)}
        </Text>
        <Text variant="caption" tone="muted">
          By {v.authorName ?? (v.recheckOfId ? 'the automatic re-check' : 'unknown')} · saved {fmtWhen(v.createdAt)}
          {v.submittedAt ? ` · submitted ${fmtWhen(v.submittedAt)}` : ''} · profile v{v.profileVersion}
          {v.profileIsCurrent ? '' : ' (no longer current)'}
        </Text>
        {v.note ? <Text variant="caption">“{v.note}”</Text> : null}
      </View>
      <VersionStatusNotice version={v} forReviewer />
      {v.recheckOfId ? <RecheckChanges version={v} /> : null}
      {wide ? panel : null}
      <Text variant="heading" role="heading" aria-level={2}>
        Steps
      </Text>
      <StepList steps={v.primitives} readOnly />
      <Text variant="heading" role="heading" aria-level={2}>
        Verification report
      </Text>
      {v.report ? <VerificationReport report={v.report} cues={v.cues} versionId={v.id} profileVersion={v.profileVersion} /> : <Text tone="danger">This version has no verification report.</Text>}
      {wide ? null : panel}
      <Text variant="heading" role="heading" aria-level={2}>
        Review history
      </Text>
      <ReviewHistory reviews={v.reviews} />
    </View>
  );
}

const styles = StyleSheet.create({
  titleRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, flexWrap: 'wrap' },
  flex: { flex: 1 },
});
