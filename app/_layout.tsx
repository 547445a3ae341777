import { Inter_400Regular } from '@expo-google-fonts/inter/400Regular';
import { Inter_500Medium } from '@expo-google-fonts/inter/500Medium';
import { Inter_600SemiBold } from '@expo-google-fonts/inter/600SemiBold';
import { Inter_700Bold } from '@expo-google-fonts/inter/700Bold';
import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { DarkTheme, Stack, ThemeProvider } from 'expo-router';
import { useState } from 'react';

import { createQueryClient } from '@/components/api/query-client';
import { navigationTheme } from '@/components/shell/navigation-theme';
import { applyPageStyles } from '@/components/shell/page-styles';
import { colors } from '@/components/theme';
import { iconFont } from '@/components/ui/Icon';

applyPageStyles();

export default function RootLayout() {
  const [queryClient] = useState(createQueryClient);
  const [fontsLoaded, fontError] = useFonts({ Inter_400Regular, Inter_500Medium, Inter_600SemiBold, Inter_700Bold, ...iconFont });
  // Render nothing until the fonts are in, so no screen flashes in a fallback font (a failed load still shows the app).
  if (!fontsLoaded && !fontError) return null;
  return (
    <QueryClientProvider client={queryClient}>
      <ThemeProvider value={navigationTheme(DarkTheme)}>
        <Stack screenOptions={{ headerShown: false, contentStyle: { backgroundColor: colors.background } }} />
      </ThemeProvider>
    </QueryClientProvider>
  );
}
