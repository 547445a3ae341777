import { View } from 'react-native';

import { colors, fonts, radii, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';

/** Props of {@link FilePicker}. */
export interface FilePickerProps {
  /** Visible label and accessible name of the file input. */
  label: string;
  /** Accepted extensions, e.g. ".csv" or ".csv,.json". */
  accept: string;
  onPick: (file: File | null) => void;
  hint?: string;
}

/**
 * The browser's own file input (the app targets the web only, see app.json), so keyboard use,
 * drag-and-drop onto the control and the phone's file sheet come for free.
 */
export function FilePicker({ label, accept, onPick, hint }: FilePickerProps) {
  return (
    <View style={{ gap: spacing.xs + 2 }}>
      <Text variant="label" tone="muted">
        {label}
      </Text>
      <input
        type="file"
        accept={accept}
        aria-label={label}
        onChange={(e) => onPick(e.target.files?.[0] ?? null)}
        style={{
          color: colors.text,
          fontFamily: fonts.regular,
          fontSize: 15,
          padding: spacing.sm,
          borderRadius: radii.md,
          border: `1px dashed ${colors.borderStrong}`,
          backgroundColor: colors.raised,
          colorScheme: 'dark',
        }}
      />
      {hint ? (
        <Text variant="caption" tone="muted">
          {hint}
        </Text>
      ) : null}
    </View>
  );
}
