import { Pressable, StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { Text } from '@/components/ui/Text';
import type { SequenceListItem } from '@/shared/contracts/maneuver';

import { RobustnessBadge } from './robustness/RobustnessCaution';
import { targetText } from './target-text';
import { summaryLine } from './versions/VersionList';
import { VersionStatusBadge } from './VersionStatusBadge';

/** Props of {@link SequenceRow}. */
export interface SequenceRowProps {
  sequence: SequenceListItem;
  onOpen: () => void;
}

/** One sequence in the list: name, crew member, target, latest version's status and result. */
export function SequenceRow({ sequence: s, onOpen }: SequenceRowProps) {
  return (
    <Pressable
      role="button"
      aria-label={`Open ${s.name} for ${s.crewMemberName}`}
      onPress={onOpen}
      style={({ pressed, focused }: { pressed: boolean; focused?: boolean }) => [styles.row, pressed && styles.pressed, focused && styles.focused]}
      testID="sequence-row"
    >
      <View style={styles.head}>
        <Text variant="bodyStrong" style={styles.name}>
          {s.name}
        </Text>
        {s.latest ? <VersionStatusBadge status={s.latest.status} /> : <Badge label="No versions" />}
      </View>
      <Text variant="caption" tone="muted">
        {s.crewMemberName} · target {targetText(s.target)}
      </Text>
      {s.latest ? (
        <View style={styles.line}>
          <Text variant="caption">
            v{s.latest.version} · {summaryLine(s.latest)}
          </Text>
          <RobustnessBadge robustness={s.latest.robustness} />
        </View>
      ) : null}
      {s.cleared && s.cleared.id !== s.latest?.id ? (
        <Text variant="caption" tone={s.cleared.status === 'recheck' ? 'danger' : 'success'}>
          {s.cleared.status === 'recheck' ? `v${s.cleared.version} needs a re-check (profile changed)` : `v${s.cleared.version} is cleared for rehearsal`}
        </Text>
      ) : null}
    </Pressable>
  );
}

const styles = StyleSheet.create({
  line: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  row: { padding: spacing.md, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border, backgroundColor: colors.surface, gap: spacing.xs },
  pressed: { backgroundColor: colors.raised },
  focused: { outlineColor: colors.accent, outlineWidth: 2, outlineStyle: 'solid' },
  head: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  name: { flex: 1, minWidth: 140 },
});
