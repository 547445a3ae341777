import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Icon } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';

const NOTICES: Record<string, string> = {
  'signed-out': 'You are signed out.',
  'password-changed': 'Password changed. Sign in with your new password.',
  'session-ended': 'Your session ended. Sign in again to continue.',
  'sign-in-to-continue': 'Sign in to open the page you followed.',
};

/** Props of {@link SignInNotice}. */
export interface SignInNoticeProps {
  /** The `?notice=` value the sign-in page was opened with (unknown values show nothing). */
  notice?: string;
}

/** A calm one-line notice above the sign-in form (after signing out or changing the password). */
export function SignInNotice({ notice }: SignInNoticeProps) {
  const text = notice ? NOTICES[notice] : undefined;
  if (!text) return null;
  return (
    <View style={styles.box} role="status">
      <Icon name="check-circle" size={16} color={colors.success} />
      <Text style={styles.text}>{text}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    padding: spacing.md,
    borderRadius: radii.md,
    backgroundColor: colors.successTint,
  },
  text: { flex: 1 },
});
