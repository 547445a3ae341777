import { StyleSheet, View } from 'react-native';

import { colors, radii } from '@/components/theme';

/** Props of {@link ProgressBar}. */
export interface ProgressBarProps {
  /** 0–1. */
  value: number;
  /** Accessible name, e.g. "Robustness run progress". */
  label: string;
  tone?: 'accent' | 'teal' | 'danger';
}

/** A thin horizontal bar for the progress of long background work. */
export function ProgressBar({ value, label, tone = 'teal' }: ProgressBarProps) {
  const pct = Math.round(Math.min(1, Math.max(0, value)) * 100);
  return (
    <View style={styles.track} role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct}>
      <View style={[styles.fill, { width: `${pct}%`, backgroundColor: colors[tone] }]} />
    </View>
  );
}

const styles = StyleSheet.create({
  track: { height: 6, borderRadius: radii.sm, backgroundColor: colors.raised, overflow: 'hidden' },
  fill: { height: '100%', borderRadius: radii.sm },
});
