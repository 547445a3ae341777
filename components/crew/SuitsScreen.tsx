import { useRouter } from 'expo-router';
import { View } from 'react-native';

import { useSessionQuery } from '@/components/api/use-session';
import { useSuitsQuery } from '@/components/api/use-suits';
import { gaps } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Screen } from '@/components/ui/Screen';

import { SuitCard } from './SuitCard';

/** The suit configurations (everyone reads; planners and admins edit). */
export function SuitsScreen() {
  const router = useRouter();
  const session = useSessionQuery();
  const suits = useSuitsQuery();
  const canEdit = session.data?.role === 'planner' || session.data?.role === 'admin';
  return (
    <Screen
      title="Suit configurations"
      subtitle="Added mass per segment, suited joint ranges and locked joints"
      actions={<Button label="Back to crew" icon="chevron-left" size="sm" variant="secondary" onPress={() => router.replace('/crew')} />}
    >
      {suits.isPending ? <LoadingState label="Loading suit configurations…" /> : null}
      {suits.isError ? <ErrorBanner title="Could not load the suit configurations" error={suits.error} onRetry={() => void suits.refetch()} /> : null}
      <View style={gaps.md}>
        {suits.data?.map((s) => <SuitCard key={s.id} suit={s} canEdit={canEdit} />)}
      </View>
    </Screen>
  );
}
