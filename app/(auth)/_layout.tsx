import { Stack } from 'expo-router';

import { colors } from '@/components/theme';

/** Signed-out screens: no header, no tabs. */
export default function AuthLayout() {
  return <Stack screenOptions={{ headerShown: false, contentStyle: { backgroundColor: colors.background } }} />;
}
