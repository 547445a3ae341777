import { useEffect, useState } from 'react';
import { Animated, StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';
import type { MotionStep } from '@/shared/contracts/motion';

/** Props of {@link CueCard}. */
export interface CueCardProps {
  step: MotionStep | undefined;
  stepCount: number;
  /** The cycle in progress of a cyclic step, or null. */
  cycle: { cycle: number; of: number } | null;
  /** Beat counter: each change flashes the beat lamp. */
  beats: number;
  /** The next step's cue, shown small. */
  nextCue?: string;
  /** True while the step's lead-in (the joining move into its start posture) plays. */
  inLeadIn?: boolean;
  /** The version's robustness caution (marginal or not robust), shown at the card's foot; default none. */
  caution?: string | null;
}

/** The overlay over the 3D view: step number, cue, "cycle 2 of 4" and a beat lamp that flashes each cycle. */
export function CueCard({ step, stepCount, cycle, beats, nextCue, inLeadIn = false, caution = null }: CueCardProps) {
  const [flash] = useState(() => new Animated.Value(0));
  useEffect(() => {
    if (beats === 0) return;
    flash.setValue(1);
    Animated.timing(flash, { toValue: 0, duration: 380, useNativeDriver: false }).start();
  }, [beats, flash]);
  if (!step) return null;
  return (
    <View style={styles.card} testID="cue-card" aria-live="polite">
      <View style={styles.head}>
        <Text variant="overline" tone="teal" testID="cue-step">
          Step {step.index + 1} of {stepCount}
        </Text>
        <View style={styles.beatRow}>
          {cycle ? (
            <Text variant="numeric" tone="accent" testID="cue-cycle">
              cycle {cycle.cycle} of {cycle.of}
            </Text>
          ) : null}
          <Animated.View
            testID="beat-lamp"
            aria-hidden
            style={[styles.lamp, { opacity: flash.interpolate({ inputRange: [0, 1], outputRange: [0.25, 1] }), transform: [{ scale: flash.interpolate({ inputRange: [0, 1], outputRange: [1, 1.5] }) }] }]}
          />
        </View>
      </View>
      {inLeadIn && step.leadIn ? (
        <>
          <Text variant="heading" tone="accent" testID="cue-lead-in" numberOfLines={2}>
            {step.leadIn.cue}
          </Text>
          <Text variant="caption" testID="cue-text" numberOfLines={3}>
            Then: {step.cue}
          </Text>
        </>
      ) : (
        <Text variant="heading" testID="cue-text" numberOfLines={3}>
          {step.cue}
        </Text>
      )}
      {nextCue && !inLeadIn ? (
        <Text variant="caption" tone="muted" numberOfLines={1}>
          Next: {nextCue}
        </Text>
      ) : null}
      {caution ? (
        <Text variant="caption" tone="accent" numberOfLines={2} testID="cue-robustness">
          {caution}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: 'rgba(14, 22, 33, 0.86)', borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border,
    paddingHorizontal: spacing.lg, paddingVertical: spacing.md, gap: spacing.xs,
  },
  head: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center' },
  beatRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  lamp: { width: 12, height: 12, borderRadius: 6, backgroundColor: colors.accent },
});
