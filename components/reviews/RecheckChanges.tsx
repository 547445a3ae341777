import { StyleSheet, View } from 'react-native';

import { useVersionRobustnessQuery } from '@/components/api/use-robustness';
import { useCompareQuery, useVersionQuery } from '@/components/api/use-sequences';
import { fmtDeg, fmtNum } from '@/components/maneuvers/report/format';
import { colors, radii, spacing } from '@/components/theme';
import { DataTable } from '@/components/ui/DataTable';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Text } from '@/components/ui/Text';
import type { VersionDetail } from '@/shared/contracts/maneuver';

/** One line of the comparison: the cleared version's figure, the re-check's, and whether it got worse. */
interface Line {
  what: string;
  was: string;
  now: string;
  worse: boolean;
}

/**
 * What a profile change did to a cleared maneuver, for the reviewer's re-check decision: the profile
 * versions, how far the final attitude moved, the target error, joint-range and rate checks, and both
 * robustness figures — the cleared version against the automatic re-check version.
 */
export function RecheckChanges({ version: v }: { version: VersionDetail }) {
  const oldId = v.recheckOfId ?? undefined;
  const old = useVersionQuery(oldId);
  const cmp = useCompareQuery(oldId, v.id);
  const rOld = useVersionRobustnessQuery(oldId ?? '');
  const rNew = useVersionRobustnessQuery(v.id);
  if (!oldId) return null;
  if (cmp.isPending || old.isPending) return <LoadingState label="Comparing with the cleared version…" />;
  if (cmp.isError || old.isError) return <ErrorBanner title="Could not compare with the cleared version" error={cmp.error ?? old.error} onRetry={() => void cmp.refetch()} />;
  const c = cmp.data.result;
  const tol = v.target.toleranceDeg;
  const fb = (r: typeof rOld.data) => (r?.state === 'done' ? r.feedbackP95Deg : null);
  const ol = (r: typeof rOld.data) => (r?.state === 'done' ? r.openLoopP95Deg : null);
  const runText = (r: typeof rOld.data, x: number | null) => (x != null ? fmtDeg(x) : r ? `run ${r.state} (${Math.round(r.progress * 100)} %)` : 'not computed');
  const rateLimit = v.report?.peakJointRate.limitDegS ?? Infinity;
  const lines: Line[] = [
    { what: 'Profile version', was: `v${old.data.profileVersion}`, now: `v${v.profileVersion}`, worse: false },
    { what: 'Error to target (tolerance ' + fmtDeg(tol) + ')', was: fmtDeg(c.targetErrorDeg.a ?? NaN, 2), now: fmtDeg(c.targetErrorDeg.b ?? NaN, 2), worse: (c.targetErrorDeg.b ?? 0) > tol && (c.targetErrorDeg.b ?? 0) > (c.targetErrorDeg.a ?? 0) },
    { what: 'Range violations', was: fmtNum(c.rangeViolationCount.a, 0), now: fmtNum(c.rangeViolationCount.b, 0), worse: (c.rangeViolationCount.b ?? 0) > (c.rangeViolationCount.a ?? 0) },
    { what: `Peak joint rate (limit ${fmtNum(rateLimit, 0)} °/s)`, was: `${fmtNum(c.peakJointRateDegS.a, 0)} °/s`, now: `${fmtNum(c.peakJointRateDegS.b, 0)} °/s`, worse: (c.peakJointRateDegS.b ?? 0) > rateLimit },
    { what: '95th pct, with feedback', was: runText(rOld.data, fb(rOld.data)), now: runText(rNew.data, fb(rNew.data)), worse: fb(rNew.data) == null || (fb(rNew.data)! > tol && fb(rNew.data)! > (fb(rOld.data) ?? 0)) },
    { what: '95th pct, open-loop', was: runText(rOld.data, ol(rOld.data)), now: runText(rNew.data, ol(rNew.data)), worse: ol(rNew.data) == null },
  ];
  return (
    <View style={styles.box} testID="recheck-changes">
      <Text variant="heading" role="heading" aria-level={2}>
        What the profile change did
      </Text>
      <Text testID="recheck-shift">
        Same steps as cleared version {old.data.version}; on profile v{v.profileVersion} the final attitude moved{' '}
        <Text variant="bodyStrong">{c.finalAttitudeShiftDeg == null ? '—' : fmtDeg(c.finalAttitudeShiftDeg, 2)}</Text>.
      </Text>
      <DataTable
        label="Cleared version against the re-check"
        columns={[
          { header: 'Figure', cell: (l: Line) => l.what, minWidth: 150, flex: 2 },
          { header: `Cleared v${old.data.version}`, cell: (l: Line) => l.was, numeric: true },
          { header: `Re-check v${v.version}`, cell: (l: Line) => l.now, numeric: true },
        ]}
        rows={lines}
        rowKey={(l) => l.what}
        rowTone={(l) => (l.worse ? 'danger' : l.was !== l.now ? 'changed' : undefined)}
      />
      <Text variant="caption" tone="muted">
        Re-clear when the figures still hold for this body; send it back when a planner must change the steps. The robustness run of the re-check version starts when it is saved.
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: spacing.sm, padding: spacing.md, borderRadius: radii.md, borderWidth: 1, borderColor: colors.accent, backgroundColor: colors.surface },
});
