import { StyleSheet, View } from 'react-native';

import { useIsWide } from '@/components/layout/use-is-wide';
import { colors, spacing } from '@/components/theme';
import type { SessionUser } from '@/shared/contracts/auth';

import { CautionLine } from './CautionLine';
import { ProductMark } from './ProductMark';
import { UserMenu } from './UserMenu';

/** Props of {@link AppHeader}. */
export interface AppHeaderProps {
  user: SessionUser;
  onChangePassword: () => void;
  onSignOut: () => void;
}

/** The signed-in header: product mark, the user's chip with its menu, and the caution line beneath. */
export function AppHeader({ user, onChangePassword, onSignOut }: AppHeaderProps) {
  const wide = useIsWide();
  return (
    <View role="banner">
      <View style={[styles.bar, wide && styles.barWide]}>
        <ProductMark />
        <View style={styles.spacer} />
        <UserMenu user={user} compact={!wide} onChangePassword={onChangePassword} onSignOut={onSignOut} />
      </View>
      <CautionLine />
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    flexDirection: 'row',
    alignItems: 'center',
    paddingHorizontal: spacing.lg,
    paddingVertical: spacing.sm + 2,
    backgroundColor: colors.background,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
    gap: spacing.md,
  },
  barWide: { paddingHorizontal: spacing.xl },
  spacer: { flex: 1 },
});
