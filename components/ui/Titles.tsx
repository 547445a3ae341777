import { type StyleProp, StyleSheet, View, type ViewStyle } from 'react-native';

import { Text } from './Text';

/** Props of {@link Titles}. */
export interface TitlesProps {
  title?: string;
  /** One line under the title. */
  subtitle?: string;
  /** 1: a screen's title; 2: a panel's heading (smaller, with a caption-sized subtitle). */
  level: 1 | 2;
  style?: StyleProp<ViewStyle>;
}

/** A heading and the line under it, as a screen (level 1) or a card (level 2) shows them. */
export function Titles({ title, subtitle, level, style }: TitlesProps) {
  return (
    <View style={[styles.titles, style]}>
      {title ? (
        <Text variant={level === 1 ? 'title' : 'heading'} role="heading" aria-level={level}>
          {title}
        </Text>
      ) : null}
      {subtitle ? (
        <Text variant={level === 1 ? 'body' : 'caption'} tone="muted">
          {subtitle}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  titles: { flex: 1, gap: 2 },
});
