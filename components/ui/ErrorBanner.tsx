import { StyleSheet, View } from 'react-native';

import { errorMessage } from '@/components/api/client';
import { colors, radii, spacing } from '@/components/theme';

import { Button } from './Button';
import { Icon } from './Icon';
import { Text } from './Text';

/** Props of {@link ErrorBanner}. */
export interface ErrorBannerProps {
  /** An ApiError, any Error, or a message; the banner renders nothing when it is null/undefined. */
  error: unknown;
  /** Optional heading above the message, e.g. "Could not load the team". */
  title?: string;
  /** Shows a "Try again" button. */
  onRetry?: () => void;
}

/** A red banner that states what went wrong in words (role "alert"), with an optional retry. */
export function ErrorBanner({ error, title, onRetry }: ErrorBannerProps) {
  if (error == null) return null;
  return (
    <View style={styles.banner} role="alert">
      <Icon name="alert-triangle" size={18} color={colors.danger} />
      <View style={styles.body}>
        {title ? <Text variant="bodyStrong">{title}</Text> : null}
        <Text tone={title ? 'muted' : 'default'}>{errorMessage(error)}</Text>
      </View>
      {onRetry ? <Button label="Try again" size="sm" variant="secondary" onPress={onRetry} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  banner: {
    flexDirection: 'row',
    alignItems: 'flex-start',
    gap: spacing.md,
    padding: spacing.md,
    borderRadius: radii.md,
    backgroundColor: colors.dangerTint,
    borderWidth: 1,
    borderColor: 'rgba(255, 107, 107, 0.4)',
    alignSelf: 'stretch',
  },
  body: { flex: 1, gap: 2 },
});
