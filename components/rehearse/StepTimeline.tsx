import { useRef } from 'react';
import { type GestureResponderEvent, StyleSheet, View } from 'react-native';

import { colors, gaps, radii } from '@/components/theme';
import { Text } from '@/components/ui/Text';
import type { MotionStep } from '@/shared/contracts/motion';

/** Props of {@link StepTimeline}. */
export interface StepTimelineProps {
  steps: readonly MotionStep[];
  duration: number;
  /** Current time, s (updated a few times a second). */
  time: number;
  /** Current step index (highlighted). */
  current: number;
  /** Looped step index, or null. */
  loopStep: number | null;
  /** Scrub to a time, s (called while dragging). */
  onSeek: (t: number) => void;
}

/**
 * The scrub bar: one block per step (cyclic steps show cycle ticks), the played part filled, a thumb
 * at the current time. Press or drag anywhere to seek. Exposed as a slider for assistive technology.
 */
export function StepTimeline({ steps, duration, time, current, loopStep, onSeek }: StepTimelineProps) {
  const track = useRef<View>(null);
  const seekAt = (e: GestureResponderEvent) => {
    // react-native-web Views are DOM elements: read the track's box to turn pageX into a time.
    const el = track.current as unknown as { getBoundingClientRect?: () => { left: number; width: number } } | null;
    const box = el?.getBoundingClientRect?.();
    if (!box || box.width <= 0) return;
    const u = Math.min(1, Math.max(0, (e.nativeEvent.pageX - box.left) / box.width));
    onSeek(u * duration);
  };
  const pct = (t: number) => `${(100 * t) / Math.max(1e-9, duration)}%` as const;
  return (
    <View style={gaps.xxs}>
      <View
        ref={track}
        style={styles.track}
        role="slider"
        aria-label="Timeline"
        aria-valuemin={0}
        aria-valuemax={Math.round(duration * 10) / 10}
        aria-valuenow={Math.round(time * 10) / 10}
        aria-valuetext={`${time.toFixed(1)} of ${duration.toFixed(1)} seconds, step ${current + 1} of ${steps.length}`}
        testID="timeline"
        onStartShouldSetResponder={() => true}
        onMoveShouldSetResponder={() => true}
        onResponderGrant={seekAt}
        onResponderMove={seekAt}
      >
        {steps.map((s) => (
          <View
            key={s.index}
            pointerEvents="none"
            style={[
              styles.step,
              { left: pct(s.start), width: pct(s.end - s.start) },
              s.index === current && styles.stepCurrent,
              s.index === loopStep && styles.stepLooped,
            ]}
          >
            {s.leadIn ? <View style={[styles.leadIn, { width: `${(100 * (s.leadIn.end - s.start)) / (s.end - s.start)}%` }]} /> : null}
            {s.cycles && s.period
              ? Array.from({ length: Math.max(0, Math.ceil(s.cycles) - 1) }, (_, c) => (
                  <View key={c} style={[styles.tick, { left: `${(100 * (s.cycleStart - s.start + (c + 1) * s.period!)) / (s.end - s.start)}%` }]} />
                ))
              : null}
          </View>
        ))}
        <View pointerEvents="none" style={[styles.fill, { width: pct(time) }]} />
        <View pointerEvents="none" style={[styles.thumb, { left: pct(time) }]} />
      </View>
      <View style={styles.labels}>
        <Text variant="numeric" tone="muted" testID="time-readout">
          {time.toFixed(1)} s
        </Text>
        <Text variant="numeric" tone="muted">
          {duration.toFixed(1)} s
        </Text>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  track: { height: 28, justifyContent: 'center', cursor: 'pointer' as never },
  step: {
    position: 'absolute', top: 8, height: 12, backgroundColor: colors.raised, borderLeftWidth: 2, borderLeftColor: colors.background,
    borderRadius: radii.sm / 2,
  },
  stepCurrent: { backgroundColor: colors.borderStrong },
  stepLooped: { borderWidth: 1, borderColor: colors.accent },
  // the lead-in (joining move) of a step: a lighter band at its start
  leadIn: { position: 'absolute', left: 0, top: 0, bottom: 0, backgroundColor: colors.mutedTint },
  tick: { position: 'absolute', top: 2, bottom: 2, width: 1, backgroundColor: colors.muted, opacity: 0.6 },
  fill: { position: 'absolute', left: 0, top: 12, height: 4, backgroundColor: colors.accent, borderRadius: 2 },
  thumb: { position: 'absolute', top: 4, width: 4, height: 20, marginLeft: -2, backgroundColor: colors.accent, borderRadius: 2 },
  labels: { flexDirection: 'row', justifyContent: 'space-between' },
});
