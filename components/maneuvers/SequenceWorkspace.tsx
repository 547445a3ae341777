import { useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { isApiStatus } from '@/components/api/client';
import { useSequenceQuery, useVersionQuery } from '@/components/api/use-sequences';
import { useSessionQuery } from '@/components/api/use-session';
import { spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Screen } from '@/components/ui/Screen';

import { Composer, type ComposerPanel } from './Composer';

/** Props of {@link SequenceWorkspace}. */
export interface SequenceWorkspaceProps {
  sequenceId: string;
  /** Version to show (from `?version=`); default the newest. */
  versionId?: string;
  /** Phone panel to open first (from `?panel=`). */
  panel?: ComposerPanel;
}

/**
 * One sequence: loads it and the chosen version, then hands both to the composer. The composer is
 * keyed by the version, so opening another version (or saving a new one) starts a fresh draft.
 */
export function SequenceWorkspace({ sequenceId, versionId, panel }: SequenceWorkspaceProps) {
  const router = useRouter();
  const session = useSessionQuery();
  const sequence = useSequenceQuery(sequenceId);
  const selectedId = versionId ?? sequence.data?.versions[0]?.id;
  const version = useVersionQuery(selectedId);
  const back = <Button label="All maneuvers" icon="chevron-left" variant="ghost" size="sm" onPress={() => router.navigate('/maneuvers')} />;

  if (sequence.isPending) return <LoadingState fill label="Loading the maneuver…" />;
  if (sequence.isError) {
    return (
      <Screen>
        {back}
        {isApiStatus(sequence.error, 404, 403, 400) ? (
          <EmptyState icon="slash" title="This maneuver is not available" body="It does not exist, or your role cannot see it." />
        ) : (
          <ErrorBanner title="Could not load the maneuver" error={sequence.error} onRetry={() => void sequence.refetch()} />
        )}
      </Screen>
    );
  }
  if (selectedId && version.isPending) return <LoadingState fill label="Loading the version…" />;
  if (selectedId && version.isError) {
    return (
      <Screen>
        {back}
        <ErrorBanner title="Could not load the version" error={version.error} onRetry={() => void version.refetch()} />
      </Screen>
    );
  }
  const role = session.data?.role;
  return (
    <View style={styles.fill}>
      <Composer
        key={selectedId ?? 'new'}
        sequence={sequence.data}
        version={version.data ?? null}
        canCompose={role === 'planner' || role === 'admin'}
        initialPanel={panel}
        onOpenVersion={(id, p) => router.setParams({ version: id, panel: p })}
        onBack={() => router.navigate('/maneuvers')}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  fill: { flex: 1, gap: spacing.md },
});
