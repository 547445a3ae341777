import { useLocalSearchParams, useRouter } from 'expo-router';

import { isApiStatus } from '@/components/api/client';
import { useInvitationPreviewQuery } from '@/components/api/use-invitation';
import { AuthCard } from '@/components/auth/AuthCard';
import { InvitationSummary } from '@/components/auth/InvitationSummary';
import { lazyScreen } from '@/components/shell/lazy-screen';
import { homeTab } from '@/components/shell/tab-access';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';

// The password form loads (with the signed-in screens) only on a valid invitation.
const AcceptInvitationForm = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.AcceptInvitationForm));

const MALFORMED_LINK = 'This invitation link is not valid: it may be cut off or mistyped. Open it again from the e-mail, or ask your administrator for a new one.';

/** `/invite/<token>`: the link from the invitation e-mail. Shows who it is for, then sets a password. */
export default function InviteScreen() {
  const router = useRouter();
  const { token = '' } = useLocalSearchParams<{ token: string }>();
  const preview = useInvitationPreviewQuery(token);
  if (preview.isPending) {
    return (
      <AuthCard title="Your invitation">
        <LoadingState label="Opening your invitation…" />
      </AuthCard>
    );
  }
  if (preview.isError) {
    return (
      <AuthCard title="Invitation not usable">
        {/* A cut-off or mistyped link fails validation (400): say what the person can do, not which rule broke. */}
        <ErrorBanner error={isApiStatus(preview.error, 400) ? MALFORMED_LINK : preview.error} />
        <Button label="Go to sign-in" variant="secondary" onPress={() => router.replace('/sign-in')} />
      </AuthCard>
    );
  }
  return (
    <AuthCard title={`Welcome, ${preview.data.name}`} subtitle="Choose a password to finish setting up your account.">
      <InvitationSummary invitation={preview.data} />
      <AcceptInvitationForm token={token} onAccepted={(user) => router.replace(`/${homeTab(user.role)}`)} />
    </AuthCard>
  );
}
