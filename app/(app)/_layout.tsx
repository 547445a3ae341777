import { Redirect, useGlobalSearchParams, usePathname, useRouter } from 'expo-router';
import { Tabs } from 'expo-router/js-tabs';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useSessionQuery, useSignOutMutation } from '@/components/api/use-session';
import { useIsWide } from '@/components/layout/use-is-wide';
import { AppHeader } from '@/components/shell/AppHeader';
import { lazyScreen } from '@/components/shell/lazy-screen';
import { signInHrefFor, takeEntryPath } from '@/components/shell/return-path';
import { canSeeTab, TAB_NAMES, TABS } from '@/components/shell/tab-access';
import { tabNavigatorOptions, tabScreenOptions } from '@/components/shell/tab-bar-options';
import { colors } from '@/components/theme';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';

// Loaded (and mounted) only when opened, like the screens.
const ChangePasswordSheet = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.ChangePasswordSheet), null);

/** The signed-in shell: header with the user menu and caution, and the role's tabs. */
export default function AppLayout() {
  const router = useRouter();
  const wide = useIsWide();
  const session = useSessionQuery();
  const signOut = useSignOutMutation();
  const [changingPassword, setChangingPassword] = useState(false);
  const pathname = usePathname();
  const params = useGlobalSearchParams();

  if (session.isPending) return <LoadingState fill label="Checking your session…" />;
  if (session.isError) {
    return (
      <View style={styles.center}>
        <ErrorBanner title="Could not check your session" error={session.error} onRetry={() => void session.refetch()} />
      </View>
    );
  }
  const user = session.data;
  if (!user) {
    // Keep the page the person was opening (e.g. a review link from an e-mail) for after sign-in.
    const entry = takeEntryPath();
    if (entry && entry !== '/') {
      const [entryPathname, entrySearch = ''] = entry.split('?');
      return <Redirect href={signInHrefFor(entryPathname, entrySearch ? `?${entrySearch}` : '')} />;
    }
    const query = new URLSearchParams(
      Object.entries(params).flatMap(([k, v]) => (pathname.includes(String(v)) ? [] : [[k, String(v)]])),
    ).toString();
    return <Redirect href={signInHrefFor(pathname, query ? `?${query}` : '')} />;
  }

  return (
    <View style={styles.root}>
      <AppHeader
        user={user}
        onChangePassword={() => setChangingPassword(true)}
        onSignOut={() => signOut.mutate(undefined, { onSettled: () => router.replace('/sign-in?notice=signed-out') })}
      />
      <Tabs screenOptions={tabNavigatorOptions(wide)}>
        {/* A tab the role does not have is left out of the navigator (so its address leads to the role's
            first tab) and its button is hidden with href: null. The server enforces the same split. */}
        {TAB_NAMES.map((name) => (
          <Tabs.Protected key={name} guard={canSeeTab(user.role, name)}>
            <Tabs.Screen name={name} options={tabScreenOptions(TABS[name], canSeeTab(user.role, name))} />
          </Tabs.Protected>
        ))}
      </Tabs>
      {changingPassword && (
        <ChangePasswordSheet
          visible
          onClose={() => setChangingPassword(false)}
          onChanged={() => {
            setChangingPassword(false);
            router.replace('/sign-in?notice=password-changed');
          }}
        />
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.background },
  center: { flex: 1, justifyContent: 'center', padding: 24, backgroundColor: colors.background },
});
