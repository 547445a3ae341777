import { useState } from 'react';
import { View } from 'react-native';

import { useCrewListQuery } from '@/components/api/use-crew';
import { gaps } from '@/components/theme';
import { Avatar } from '@/components/ui/Avatar';
import { Badge } from '@/components/ui/Badge';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { ListRow } from '@/components/ui/ListRow';
import { LoadingState } from '@/components/ui/LoadingState';
import { SegmentedControl } from '@/components/ui/SegmentedControl';
import { TextField } from '@/components/ui/TextField';

import { fixed } from './format-values';

/** Props of {@link CrewList}. */
export interface CrewListProps {
  selectedId: string | null;
  onSelect: (id: string) => void;
  /** Offer the archived list too (staff; a trainee has only their own member). */
  showArchive?: boolean;
}

const SHELVES = [
  { value: 'active', label: 'In use' },
  { value: 'archived', label: 'Archived' },
] as const;

/** Search box and the crew members the user may see, with current version, mass and suit. */
export function CrewList({ selectedId, onSelect, showArchive = false }: CrewListProps) {
  const [q, setQ] = useState('');
  const [shelf, setShelf] = useState<'active' | 'archived'>('active');
  const list = useCrewListQuery(q.trim(), shelf === 'archived');
  return (
    <View style={gaps.md}>
      {showArchive ? <SegmentedControl label="Which crew members" hideLabel options={SHELVES} value={shelf} onChange={setShelf} /> : null}
      <TextField label="Search crew" placeholder="Name or call sign" value={q} onChangeText={setQ} autoComplete="off" autoCapitalize="none" />
      {list.isPending ? <LoadingState label="Loading the crew…" /> : null}
      {list.isError ? <ErrorBanner title="Could not load the crew" error={list.error} onRetry={() => void list.refetch()} /> : null}
      {list.data && list.data.length === 0 ? (
        <EmptyState
          icon="users"
          title={q ? 'No match' : shelf === 'archived' ? 'Nobody archived' : 'No crew members yet'}
          body={q ? `Nobody's name or call sign contains "${q}".` : shelf === 'archived' ? 'Archived crew members wait here, with every profile version, until restored.' : 'Planners add crew members and their inertia profiles here.'}
        />
      ) : null}
      <View style={gaps.xxs} role="list" aria-label="Crew members">
        {list.data?.map((m) => (
          <ListRow
            key={m.id}
            title={m.name}
            subtitle={[m.callSign, m.currentMass !== null ? `${fixed(m.currentMass, 1)} kg${m.currentSuit ? ' incl. suit' : ''}` : 'no profile yet', m.currentSuit].filter(Boolean).join(' · ')}
            leading={<Avatar name={m.name} />}
            trailing={m.currentVersion ? <Badge label={`v${m.currentVersion}`} tone="teal" /> : <Badge label="New" />}
            selected={m.id === selectedId}
            onPress={() => onSelect(m.id)}
            accessibilityLabel={`${m.name}${m.currentVersion ? `, profile version ${m.currentVersion}` : ', no profile yet'}`}
          />
        ))}
      </View>
    </View>
  );
}
