import { Stack } from 'expo-router';

/** A stack inside the tab, so detail routes added to this folder keep the tab selected. */
export default function TabStackLayout() {
  return <Stack screenOptions={{ headerShown: false }} />;
}
