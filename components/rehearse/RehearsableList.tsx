import { Pressable, StyleSheet, View } from 'react-native';

import { formatDate, formatDateTime } from '@/components/format/date-time';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { Figure } from '@/components/ui/Figure';
import { Icon } from '@/components/ui/Icon';
import { pressStyle } from '@/components/ui/press-state';
import { Text } from '@/components/ui/Text';
import type { RehearsableVersion } from '@/shared/contracts/rehearsal';
import { shortEngineVersion } from '@/shared/product/engine-binding';
import { recheckMessage } from '@/shared/product/recheck-status';

/** Props of {@link RehearsableList}. */
export interface RehearsableListProps {
  versions: readonly RehearsableVersion[];
  /** Open a cleared version in the player. */
  onOpen: (versionId: string) => void;
}

/**
 * The trainee's cleared maneuvers: name, target, duration, steps, last rehearsal. A version that was
 * rehearsed but now needs a re-check (its profile changed) is listed with a notice and cannot be opened.
 */
export function RehearsableList({ versions, onOpen }: RehearsableListProps) {
  return (
    <View style={gaps.md} role="list">
      {versions.map((v) => {
        const stale = v.status === 'recheck';
        return (
          <Pressable
            key={v.versionId}
            role="listitem"
            aria-label={`${v.sequenceName}, version ${v.version}${stale ? ', needs a re-check' : ''}`}
            disabled={stale}
            onPress={() => onOpen(v.versionId)}
            style={pressStyle(({ hovered }) => [styles.row, hovered && !stale && styles.rowHover, stale && styles.rowStale])}
          >
            <View style={styles.head}>
              <View style={styles.titles}>
                <Text variant="heading" numberOfLines={2}>
                  {v.sequenceName}
                </Text>
                <Text variant="caption" tone="muted">
                  Version {v.version}
                  {v.clearedAt ? ` · cleared ${formatDate(v.clearedAt)}` : ''}
                </Text>
              </View>
              {stale ? <Badge label={v.recheck?.successor?.status === 'under_review' ? 'With the reviewer' : 'Re-check needed'} tone="danger" icon="alert-triangle" /> : <Icon name="play-circle" size={26} color={colors.accent} />}
            </View>
            <View style={styles.facts}>
              <Figure style={gaps.xxs} label="Target" value={v.targetLabel} />
              <Figure style={gaps.xxs} label="Duration" value={`${v.duration.toFixed(1)} s`} />
              <Figure style={gaps.xxs} label="Steps" value={String(v.stepCount)} />
              {v.engineVersion ? <Figure style={gaps.xxs} label="Verified by engine" value={shortEngineVersion(v.engineVersion)} /> : null}
            </View>
            {v.verifiedByOtherEngine && v.engineVersion ? (
              <Text variant="caption" tone="accent">
                This server now runs another engine version; the player shows the result verified by engine {shortEngineVersion(v.engineVersion)}, which the approval binds to.
              </Text>
            ) : null}
            <Text variant="caption" tone={v.lastRehearsal ? 'default' : 'muted'}>
              {v.lastRehearsal
                ? `Last rehearsed ${formatDateTime(v.lastRehearsal.performedAt)} · ${v.lastRehearsal.completedSteps}/${v.lastRehearsal.totalSteps} steps · rated ${v.lastRehearsal.selfRating}/5 · ${v.rehearsalCount} run${v.rehearsalCount === 1 ? '' : 's'}`
                : 'Not rehearsed yet'}
            </Text>
            {stale ? (
              <Text variant="caption" tone="danger" testID="recheck-message">
                {v.recheck ? recheckMessage(v.recheck) : 'Your profile changed since this maneuver was cleared; it cannot be rehearsed until a reviewer clears it again.'}
              </Text>
            ) : null}
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, padding: spacing.lg, gap: spacing.sm },
  rowHover: { borderColor: colors.borderStrong, backgroundColor: colors.raised },
  rowStale: { borderColor: colors.danger },
  head: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.md },
  titles: { flex: 1, minWidth: 0 },
  facts: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xl },
});
