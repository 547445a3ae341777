import { type StyleProp, View, type ViewStyle } from 'react-native';

import { Text, type TextTone } from './Text';

/** Props of {@link Figure}. */
export interface FigureProps {
  /** Short label above the value, e.g. "Body mass". */
  label: string;
  /** The formatted value. */
  value: string;
  /** Unit after the value, small and muted (given, even empty, it follows the value after a space). */
  unit?: string;
  /** `numeric` (default): a measured figure in tabular digits; `bodyStrong`: a judged figure that should stand out. */
  variant?: 'numeric' | 'bodyStrong';
  /** Colour of the value; default `default`. */
  tone?: TextTone;
  /** The box around label and value (width, gap, rules between figures). */
  style?: StyleProp<ViewStyle>;
}

/** One labelled figure: a small muted label over its value, as figures stand in a row of facts. */
export function Figure({ label, value, unit, variant = 'numeric', tone = 'default', style }: FigureProps) {
  return (
    <View style={style}>
      <Text variant="overline" tone="muted">
        {label}
      </Text>
      <Text variant={variant} tone={tone}>
        {value}
        {unit !== undefined ? (
          <>
            {' '}
            <Text variant="caption" tone="muted">{unit}</Text>
          </>
        ) : null}
      </Text>
    </View>
  );
}
