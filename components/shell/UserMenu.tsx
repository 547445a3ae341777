import { useState } from 'react';
import { Modal, Pressable, StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Avatar } from '@/components/ui/Avatar';
import { Icon, type IconName } from '@/components/ui/Icon';
import { pressStyle } from '@/components/ui/press-state';
import { Text } from '@/components/ui/Text';
import type { SessionUser } from '@/shared/contracts/auth';
import { ROLE_LABELS } from '@/shared/contracts/role-labels';

/** Props of {@link UserMenu}. */
export interface UserMenuProps {
  user: SessionUser;
  /** Narrow layout: role under the name in smaller type. */
  compact?: boolean;
  onChangePassword: () => void;
  onSignOut: () => void;
}

/** The signed-in user's chip (name and role) opening a menu with "Change password" and "Sign out". */
export function UserMenu({ user, compact = false, onChangePassword, onSignOut }: UserMenuProps) {
  const [open, setOpen] = useState(false);
  const choose = (action: () => void) => () => {
    setOpen(false);
    action();
  };
  return (
    <>
      <Pressable
        role="button"
        aria-label={`Account menu for ${user.name}`}
        aria-haspopup="menu"
        aria-expanded={open}
        onPress={() => setOpen(true)}
        style={pressStyle(({ hovered }) => [styles.chip, hovered && styles.chipHover])}
      >
        <Avatar name={user.name} size={30} />
        <View style={[styles.who, compact && styles.whoCompact]}>
          <Text variant="label" numberOfLines={1} testID="signed-in-name">
            {user.name}
          </Text>
          <Text variant="caption" tone="muted" numberOfLines={1} style={compact && styles.roleCompact} testID="signed-in-role">
            {ROLE_LABELS[user.role]}
          </Text>
        </View>
        <Icon name="chevron-down" size={16} color={colors.muted} />
      </Pressable>
      <Modal visible={open} transparent animationType="fade" onRequestClose={() => setOpen(false)}>
        <Pressable style={styles.backdrop} onPress={() => setOpen(false)} aria-label="Close menu">
          <View role="menu" aria-label="Account" style={styles.menu}>
            <View style={styles.menuHead}>
              <Text variant="bodyStrong" numberOfLines={1}>
                {user.name}
              </Text>
              <Text variant="caption" tone="muted" numberOfLines={1}>
                {user.email}
              </Text>
            </View>
            <MenuItem icon="key" label="Change password" onPress={choose(onChangePassword)} />
            <MenuItem icon="log-out" label="Sign out" onPress={choose(onSignOut)} />
          </View>
        </Pressable>
      </Modal>
    </>
  );
}

function MenuItem({ icon, label, onPress }: { icon: IconName; label: string; onPress: () => void }) {
  return (
    <Pressable
      role="menuitem"
      aria-label={label}
      onPress={onPress}
      style={pressStyle(({ hovered, focused }) => [styles.item, (hovered || focused) && styles.itemHover])}
    >
      <Icon name={icon} size={16} color={colors.muted} />
      <Text variant="label">{label}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  chip: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    paddingVertical: spacing.xs,
    paddingLeft: spacing.xs,
    paddingRight: spacing.sm,
    borderRadius: radii.pill,
    borderWidth: 1,
    borderColor: colors.border,
    backgroundColor: colors.surface,
    maxWidth: 240,
  },
  chipHover: { backgroundColor: colors.raised },
  who: { flexShrink: 1, minWidth: 0 },
  whoCompact: { maxWidth: 130 },
  roleCompact: { fontSize: 11, lineHeight: 14 },
  backdrop: { flex: 1, backgroundColor: 'rgba(5, 9, 14, 0.35)', alignItems: 'flex-end', paddingTop: 60, paddingRight: spacing.lg },
  menu: {
    width: 250,
    backgroundColor: colors.raised,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    paddingVertical: spacing.xs,
    shadowColor: '#000',
    shadowOpacity: 0.4,
    shadowRadius: 24,
    shadowOffset: { width: 0, height: 8 },
  },
  menuHead: { paddingHorizontal: spacing.lg, paddingVertical: spacing.md, borderBottomWidth: 1, borderBottomColor: colors.border, marginBottom: spacing.xs },
  item: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, paddingHorizontal: spacing.lg, minHeight: 44 },
  itemHover: { backgroundColor: colors.surface },
});
