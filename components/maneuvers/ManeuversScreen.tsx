import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useCrewListQuery } from '@/components/api/use-crew';
import { useSequencesQuery } from '@/components/api/use-sequences';
import { useSessionQuery } from '@/components/api/use-session';
import { useIsWide } from '@/components/layout/use-is-wide';
import { gaps, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Screen } from '@/components/ui/Screen';
import { SegmentedControl } from '@/components/ui/SegmentedControl';
import { Select } from '@/components/ui/Select';
import { TextField } from '@/components/ui/TextField';
import { VERSION_STATUS_LABELS, VERSION_STATUSES, type VersionStatus } from '@/shared/contracts/version-status';

import { CreateSequenceSheet } from './CreateSequenceSheet';
import { ManeuverCautions } from './ManeuverCautions';
import { SequenceRow } from './SequenceRow';

/** Which list is shown: the maneuvers in use, or the archived ones. */
type Shelf = 'active' | 'archived';
const SHELVES = [
  { value: 'active', label: 'In use' },
  { value: 'archived', label: 'Archived' },
] as const satisfies readonly { value: Shelf; label: string }[];

/** The Maneuvers tab: every sequence with its latest status, search and filters, and "new maneuver". */
export function ManeuversScreen() {
  const router = useRouter();
  const wide = useIsWide();
  const session = useSessionQuery();
  const [crewMemberId, setCrewMemberId] = useState('');
  const [status, setStatus] = useState<VersionStatus | ''>('');
  const [search, setSearch] = useState('');
  const [creating, setCreating] = useState(false);
  const [shelf, setShelf] = useState<Shelf>('active');
  const needle = search.trim();
  // The server filters and pages (by name): only what the screen shows travels.
  const sequences = useSequencesQuery({ crewMemberId: crewMemberId || undefined, archived: shelf === 'archived', q: needle || undefined, status: status || undefined });
  const crew = useCrewListQuery('');
  const canCompose = session.data?.role === 'planner' || session.data?.role === 'admin';
  const filtered = !!needle || !!status;

  const shown = useMemo(() => (sequences.data?.pages ?? []).flatMap((p) => p.sequences), [sequences.data]);

  return (
    <Screen
      title="Maneuvers"
      subtitle="Limb-sweep sequences, their verification and review"
      actions={canCompose ? <Button label="New maneuver" icon="plus" onPress={() => setCreating(true)} /> : null}
    >
      {session.data?.role !== 'trainee' ? (
        <SegmentedControl label="Which maneuvers" hideLabel options={SHELVES} value={shelf} onChange={setShelf} />
      ) : null}
      <View style={styles.filters}>
        <View style={[styles.filter, styles.search]}>
          <TextField label="Search" value={search} onChangeText={setSearch} placeholder="Name or crew member" autoCapitalize="none" />
        </View>
        <View style={styles.filter}>
          <Select
            label="Crew member"
            options={(crew.data ?? []).map((m) => ({ value: m.id, label: m.name }))}
            value={crewMemberId}
            onChange={setCrewMemberId}
            placeholder="Everyone"
          />
        </View>
        <View style={styles.filter}>
          <Select label="Status" options={VERSION_STATUSES.map((s) => ({ value: s, label: VERSION_STATUS_LABELS[s] }))} value={status} onChange={setStatus} placeholder="Any status" />
        </View>
      </View>
      {sequences.isPending ? <LoadingState label="Loading maneuvers…" /> : null}
      {sequences.isError ? (
        <ErrorBanner
          title={sequences.isFetchNextPageError ? 'Could not load more maneuvers' : 'Could not load the maneuvers'}
          error={sequences.error}
          onRetry={() => void (sequences.isFetchNextPageError ? sequences.fetchNextPage() : sequences.refetch())}
        />
      ) : null}
      {sequences.data && shown.length === 0 ? (
        <EmptyState
          icon="rotate-cw"
          title={filtered || crewMemberId ? 'No maneuver matches' : shelf === 'archived' ? 'Nothing archived' : 'No maneuvers yet'}
          body={
            filtered || crewMemberId
              ? 'Clear the search or the filters to see every maneuver.'
              : shelf === 'archived'
                ? 'Archived maneuvers (and those of archived crew members) wait here, with every version and review, until restored.'
                : 'A maneuver belongs to one crew member and has a target reorientation. Compose it from limb sweeps and let the engine verify it.'
          }
          action={canCompose && !filtered && !crewMemberId && shelf === 'active' ? <Button label="New maneuver" icon="plus" onPress={() => setCreating(true)} /> : undefined}
        />
      ) : null}
      <View role="list" aria-label="Maneuvers" style={[gaps.sm, wide && styles.listWide]}>
        {shown.map((s) => (
          <View key={s.id} role="listitem" style={wide ? styles.cellWide : undefined}>
            <SequenceRow sequence={s} onOpen={() => router.push(`/maneuvers/${s.id}`)} />
          </View>
        ))}
      </View>
      {sequences.hasNextPage ? (
        <View style={styles.more}>
          <Button label="Show more maneuvers" variant="secondary" loading={sequences.isFetchingNextPage} onPress={() => void sequences.fetchNextPage()} />
        </View>
      ) : null}
      <ManeuverCautions compact />
      <CreateSequenceSheet
        visible={creating}
        crewMemberId={crewMemberId || undefined}
        onClose={() => setCreating(false)}
        onCreated={(s) => {
          setCreating(false);
          router.push(`/maneuvers/${s.id}`);
        }}
      />
    </Screen>
  );
}

const styles = StyleSheet.create({
  // A wrapping row: search takes a full line on a phone, the two pickers share the next one.
  filters: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-start', gap: spacing.md },
  filter: { flexGrow: 1, flexBasis: 140 },
  search: { flexBasis: 260, flexGrow: 2 },
  listWide: { flexDirection: 'row', flexWrap: 'wrap' },
  cellWide: { flexBasis: '48%', flexGrow: 1 },
  more: { alignItems: 'center' },
});
