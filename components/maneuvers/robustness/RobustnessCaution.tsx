import { StyleSheet, View } from 'react-native';

import { useVersionRobustnessQuery } from '@/components/api/use-robustness';
import { colors, radii, spacing } from '@/components/theme';
import { Badge, type BadgeTone } from '@/components/ui/Badge';
import { Icon, type IconName } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';
import { levelOf, type RobustnessBrief, type RobustnessLevel } from '@/shared/contracts/robustness';
import type { RobustnessRun } from '@/shared/contracts/robustness-run';
import { LEVEL_LABEL, robustnessSentence } from '@/shared/product/robustness-wording';

/** What the caution needs: a list brief or a full record (both carry these fields). */
export type RobustnessLike = Pick<RobustnessBrief, 'state' | 'progress' | 'feedbackP95Deg' | 'toleranceDeg' | 'level'>;

const LEVEL_LOOK: Record<RobustnessLevel, { tone: 'success' | 'accent' | 'danger'; icon: IconName; bg: string; edge: string }> = {
  robust: { tone: 'success', icon: 'check-circle', bg: colors.successTint, edge: 'rgba(123, 216, 143, 0.4)' },
  marginal: { tone: 'accent', icon: 'alert-triangle', bg: colors.accentTint, edge: 'rgba(255, 180, 84, 0.5)' },
  not_robust: { tone: 'danger', icon: 'alert-octagon', bg: colors.dangerTint, edge: 'rgba(255, 107, 107, 0.5)' },
};

/**
 * A version's robustness as one banner: the level's sentence (robust / marginal / not robust), or
 * that it is not known yet. Marginal and not robust read as a caution.
 */
export function RobustnessCaution({ robustness, testID = 'robustness-caution' }: { robustness: RobustnessLike | null; testID?: string }) {
  const level = robustness?.state === 'done' ? robustness.level : null;
  const look = level ? LEVEL_LOOK[level] : { tone: 'muted' as const, icon: 'help-circle' as IconName, bg: colors.mutedTint, edge: colors.border };
  const iconColor = level ? colors[LEVEL_LOOK[level].tone] : colors.muted;
  return (
    <View style={[styles.banner, { backgroundColor: look.bg, borderColor: look.edge }]} role={level && level !== 'robust' ? 'alert' : 'status'} testID={testID}>
      <Icon name={look.icon} size={18} color={iconColor} />
      <Text style={styles.flex} tone={level ? look.tone : 'default'}>{robustnessSentence(robustness)}</Text>
    </View>
  );
}

const BADGE: Record<RobustnessLevel, { tone: BadgeTone; icon: IconName }> = {
  robust: { tone: 'success', icon: 'check-circle' },
  marginal: { tone: 'accent', icon: 'alert-triangle' },
  not_robust: { tone: 'danger', icon: 'alert-octagon' },
};

/** The level as a small pill for lists ("Marginal", "Robustness 40 %", "Robustness unknown"). */
export function RobustnessBadge({ robustness }: { robustness: RobustnessLike | null }) {
  if (robustness?.state === 'done' && robustness.level) {
    const b = BADGE[robustness.level];
    return <Badge label={LEVEL_LABEL[robustness.level]} tone={b.tone} icon={b.icon} />;
  }
  if (robustness?.state === 'queued' || robustness?.state === 'running') {
    return <Badge label={`Robustness ${Math.round(robustness.progress * 100)} %`} tone="teal" icon="loader" />;
  }
  return <Badge label="Robustness unknown" tone="neutral" icon="help-circle" />;
}

const styles = StyleSheet.create({
  banner: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.sm, padding: spacing.md, borderRadius: radii.md, borderWidth: 1 },
  flex: { flex: 1 },
});

/** A run as the robustness endpoint returns it → what the caution needs. */
function briefOf(run: RobustnessRun): RobustnessLike {
  return { state: run.state, progress: run.progress, feedbackP95Deg: run.feedbackP95Deg, toleranceDeg: run.toleranceDeg, level: levelOf(run.feedbackP95Deg, run.toleranceDeg) };
}

/**
 * The caution of a version kept current: the newest run as the report panel polls it (one shared
 * query), `initial` (from the version read) until that answers.
 */
export function LiveRobustnessCaution({ versionId, initial, testID }: { versionId: string; initial: RobustnessLike | null; testID?: string }) {
  const run = useVersionRobustnessQuery(versionId);
  const current = run.data === undefined ? initial : run.data === null ? null : briefOf(run.data);
  return <RobustnessCaution robustness={current} testID={testID} />;
}
