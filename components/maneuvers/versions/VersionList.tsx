import { Pressable, StyleSheet, View } from 'react-native';

import { colors, gaps, radii, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';
import type { ReportBrief, VersionSummary } from '@/shared/contracts/maneuver';

import { fmtDeg, fmtSeconds, fmtWhen } from '../report/format';
import { RobustnessBadge } from '../robustness/RobustnessCaution';
import { VersionStatusBadge } from '../VersionStatusBadge';

/** Props of {@link VersionList}. */
export interface VersionListProps {
  versions: readonly VersionSummary[];
  /** The version on screen. */
  selectedId?: string;
  onOpen: (versionId: string) => void;
}

/** One line of a report summary: "error 0.8° · 9.5 s · no range violations". */
export function summaryLine(v: { summary: ReportBrief | null }): string {
  const s = v.summary;
  if (!s) return 'not verified';
  const viol = s.rangeViolationCount === 0 ? 'no range violations' : `${s.rangeViolationCount} range violation${s.rangeViolationCount > 1 ? 's' : ''}`;
  return `error ${fmtDeg(s.targetErrorDeg, 2)} · ${fmtSeconds(s.durationS, 1)} · ${viol}`;
}

/** Every version of a sequence, newest first: status, author, time, profile version and result. */
export function VersionList({ versions, selectedId, onOpen }: VersionListProps) {
  return (
    <View role="list" aria-label="Versions" style={gaps.sm}>
      {versions.map((v) => (
        <Pressable
          key={v.id}
          role="button"
          aria-label={`Open version ${v.version}`}
          aria-current={v.id === selectedId}
          onPress={() => onOpen(v.id)}
          testID={`version-row-${v.version}`}
          style={({ pressed, focused }: { pressed: boolean; focused?: boolean }) => [
            styles.row,
            v.id === selectedId && styles.selected,
            pressed && styles.pressed,
            focused && styles.focused,
          ]}
        >
          <View style={styles.head}>
            <Text variant="bodyStrong">Version {v.version}</Text>
            <VersionStatusBadge status={v.status} />
          </View>
          <Text variant="caption" tone="muted">
            {v.authorName ?? 'unknown author'} · {fmtWhen(v.createdAt)} · profile v{v.profileVersion}
            {v.profileIsCurrent ? '' : ' (no longer current)'}
          </Text>
          <View style={styles.line}>
            <Text variant="caption" tone={v.summary?.withinTolerance === false ? 'danger' : 'default'}>
              {summaryLine(v)}
            </Text>
            <RobustnessBadge robustness={v.robustness} />
          </View>
          {v.clearedByName ? (
            <Text variant="caption" tone="success">
              Cleared by {v.clearedByName} · {fmtWhen(v.clearedAt)}
            </Text>
          ) : null}
          {v.reverification?.outcome ? (
            // What a finished re-verification concluded in words (an engine change: unchanged, or sent to re-check).
            <Text variant="caption" tone={v.status === 'recheck' ? 'danger' : 'muted'} testID="reverification-outcome">
              {v.reverification.outcome}
            </Text>
          ) : v.status === 'recheck' && v.reverification ? (
            <Text variant="caption" tone="danger">
              Profile changed: {v.reverification.state === 'done' ? `final attitude moved ${fmtDeg(v.reverification.attitudeShiftDeg ?? 0, 2)}`
                : v.reverification.state === 'cancelled' ? 'recomputation stopped' : v.reverification.state === 'failed' ? 'recomputation failed' : `recomputing (${v.reverification.state})`}
            </Text>
          ) : null}
          {v.note ? (
            <Text variant="caption" tone="muted" numberOfLines={2}>
              “{v.note}”
            </Text>
          ) : null}
        </Pressable>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  line: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  row: { padding: spacing.md, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border, backgroundColor: colors.surface, gap: 2 },
  selected: { borderColor: colors.accent },
  pressed: { backgroundColor: colors.raised },
  focused: { outlineColor: colors.accent, outlineWidth: 2, outlineStyle: 'solid' },
  head: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: spacing.sm, flexWrap: 'wrap' },
});
