import { Redirect, useLocalSearchParams, useRouter } from 'expo-router';

import { useSessionQuery } from '@/components/api/use-session';
import { AuthCard } from '@/components/auth/AuthCard';
import { SignInForm } from '@/components/auth/SignInForm';
import { SignInNotice } from '@/components/auth/SignInNotice';
import { safeReturnPath } from '@/components/shell/return-path';
import { homeTab } from '@/components/shell/tab-access';

export default function SignInScreen() {
  const router = useRouter();
  const { notice, next } = useLocalSearchParams<{ notice?: string; next?: string }>();
  const returnTo = safeReturnPath(next);
  const session = useSessionQuery();
  if (session.data) return <Redirect href={returnTo ?? `/${homeTab(session.data.role)}`} />;
  return (
    <AuthCard title="Sign in" subtitle="Use the e-mail address your administrator invited.">
      <SignInNotice notice={notice} />
      <SignInForm onSignedIn={(user) => router.replace(returnTo ?? `/${homeTab(user.role)}`)} />
    </AuthCard>
  );
}
