import { useRouter } from 'expo-router';

import { useRehearsableVersionsQuery } from '@/components/api/use-rehearsals';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Screen } from '@/components/ui/Screen';

import { RehearsableList } from './RehearsableList';

/** Rehearse tab: the trainee's cleared maneuvers with target, duration and last rehearsal. */
export function RehearseScreen() {
  const router = useRouter();
  const versions = useRehearsableVersionsQuery();
  return (
    <Screen title="Rehearse" subtitle="Cleared maneuvers for your body">
      {versions.isPending ? (
        <LoadingState label="Loading your maneuvers…" />
      ) : versions.isError ? (
        <ErrorBanner error={versions.error} onRetry={() => void versions.refetch()} />
      ) : versions.data.length === 0 ? (
        <EmptyState
          icon="play-circle"
          title="No cleared maneuvers yet"
          body="Maneuvers cleared for you will appear here. Play each one on your own body in 3D, follow the cues and the beat, and log every rehearsal."
        />
      ) : (
        <RehearsableList versions={versions.data} onOpen={(id) => router.push(`/rehearse/${id}`)} />
      )}
    </Screen>
  );
}
