import { StyleSheet, View } from 'react-native';

import { colors } from '@/components/theme';

import { Text } from './Text';

/** Props of {@link Avatar}. */
export interface AvatarProps {
  /** A person's name; the avatar shows its initials. */
  name: string;
  /** Side in px; default 36. */
  size?: number;
  /** Greyed out (e.g. a disabled account). */
  dimmed?: boolean;
}

/** Initials of the first and last word of a name ("Orrin Vale" → "OV"). */
export function initialsOf(name: string): string {
  const words = name.trim().split(/\s+/).filter(Boolean);
  const first = words[0]?.[0] ?? '';
  const last = words.length > 1 ? (words[words.length - 1]?.[0] ?? '') : '';
  return (first + last).toUpperCase();
}

/** A round initials badge for a person (decorative: the name is always shown beside it). */
export function Avatar({ name, size = 36, dimmed = false }: AvatarProps) {
  return (
    <View
      aria-hidden
      style={[styles.circle, { width: size, height: size, borderRadius: size / 2 }, dimmed && styles.dimmed]}
    >
      <Text variant="caption" style={[styles.text, { fontSize: Math.round(size * 0.36) }, dimmed && styles.dimmedText]}>
        {initialsOf(name)}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  circle: {
    backgroundColor: colors.tealTint,
    borderWidth: 1,
    borderColor: 'rgba(79, 209, 197, 0.4)',
    alignItems: 'center',
    justifyContent: 'center',
  },
  text: { color: colors.teal, fontFamily: 'Inter_600SemiBold' },
  dimmed: { backgroundColor: colors.mutedTint, borderColor: colors.border },
  dimmedText: { color: colors.muted },
});
