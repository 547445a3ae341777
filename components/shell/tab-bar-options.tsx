import type { BottomTabNavigationOptions } from 'expo-router/js-tabs';

import { colors, fonts, spacing } from '@/components/theme';
import { Icon, type IconName } from '@/components/ui/Icon';

/** Tab bar look shared by every tab: a bottom bar on phones, a left rail with labels on wide screens. */
export function tabNavigatorOptions(wide: boolean): BottomTabNavigationOptions {
  return {
    headerShown: false,
    tabBarPosition: wide ? 'left' : 'bottom',
    tabBarLabelPosition: wide ? 'beside-icon' : 'below-icon',
    tabBarActiveTintColor: colors.accent,
    tabBarInactiveTintColor: colors.muted,
    tabBarActiveBackgroundColor: wide ? colors.accentTint : 'transparent',
    tabBarLabelStyle: { fontFamily: fonts.medium, fontSize: wide ? 14 : 11 },
    tabBarStyle: wide
      ? { backgroundColor: colors.background, borderRightColor: colors.border, width: 220, minWidth: 220, paddingTop: spacing.md }
      : { backgroundColor: colors.surface, borderTopColor: colors.border, height: 62, paddingTop: spacing.xs, paddingBottom: spacing.sm },
    tabBarItemStyle: wide
      ? { borderRadius: 10, marginHorizontal: spacing.sm, marginVertical: 2, justifyContent: 'flex-start', paddingHorizontal: spacing.md, maxHeight: 44 }
      : undefined,
    sceneStyle: { backgroundColor: colors.background },
  };
}

/** One tab's options: title, icon, and `href: null` to hide it from roles that do not have it. */
export function tabScreenOptions(tab: { title: string; icon: IconName }, visible: boolean): BottomTabNavigationOptions & { href?: null } {
  return {
    title: tab.title,
    tabBarAccessibilityLabel: tab.title,
    tabBarButtonTestID: `tab-${tab.title.toLowerCase()}`,
    tabBarIcon: ({ color, size }) => <Icon name={tab.icon} size={Math.min(size, 22)} color={String(color)} />,
    ...(visible ? {} : { href: null }),
  };
}
