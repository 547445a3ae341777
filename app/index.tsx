import { Redirect } from 'expo-router';

import { useSessionQuery } from '@/components/api/use-session';
import { homeTab } from '@/components/shell/tab-access';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';

/** `/`: sends signed-in people to their role's first tab and everyone else to sign-in. */
export default function Index() {
  const session = useSessionQuery();
  if (session.isPending) return <LoadingState fill label="Checking your session…" />;
  if (session.isError) return <ErrorBanner error={session.error} onRetry={() => void session.refetch()} />;
  if (!session.data) return <Redirect href="/sign-in" />;
  return <Redirect href={`/${homeTab(session.data.role)}`} />;
}
