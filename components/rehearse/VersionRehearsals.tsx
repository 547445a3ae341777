import { View } from 'react-native';

import { useRehearsalHistoryQuery } from '@/components/api/use-rehearsals';
import { useSessionQuery } from '@/components/api/use-session';
import { gaps } from '@/components/theme';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';

import { RehearsalHistory } from './RehearsalHistory';

/** Props of {@link VersionRehearsals}. */
export interface VersionRehearsalsProps {
  versionId: string;
}

/**
 * The rehearsals trainees logged of one version, for the staff who open the version: each with its
 * recording (what the trainee's motion would have done in free fall); reviewers and admins sign
 * the recordings off here.
 */
export function VersionRehearsals({ versionId }: VersionRehearsalsProps) {
  const me = useSessionQuery().data;
  const history = useRehearsalHistoryQuery(versionId);
  if (history.isPending) return <LoadingState label="Loading the rehearsals…" />;
  if (history.isError) return <ErrorBanner title="Could not load the rehearsals" error={history.error} onRetry={() => void history.refetch()} />;
  return (
    <View style={gaps.sm} testID="version-rehearsals">
      <RehearsalHistory
        title="Rehearsals of this version"
        rehearsals={history.data}
        showTrainee
        canSignOff={me?.role === 'reviewer' || me?.role === 'admin'}
      />
    </View>
  );
}
