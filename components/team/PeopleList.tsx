import { View } from 'react-native';

import { useTeamUsersQuery } from '@/components/api/use-team';
import { gaps } from '@/components/theme';
import { Avatar } from '@/components/ui/Avatar';
import { Badge } from '@/components/ui/Badge';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { ListRow } from '@/components/ui/ListRow';
import { LoadingState } from '@/components/ui/LoadingState';
import { ROLE_LABELS } from '@/shared/contracts/roles';

/** Props of {@link PeopleList}. */
export interface PeopleListProps {
  selectedId: string | null;
  onSelect: (id: string) => void;
}

/** Every user with role and status; pressing one opens it in the detail pane. */
export function PeopleList({ selectedId, onSelect }: PeopleListProps) {
  const users = useTeamUsersQuery();
  if (users.isPending) return <LoadingState label="Loading the team…" />;
  if (users.isError) return <ErrorBanner title="Could not load the team" error={users.error} onRetry={() => void users.refetch()} />;
  if (users.data.length === 0) return <EmptyState icon="users" title="No people yet" body="Invite someone to get started." />;
  return (
    <View style={gaps.xxs} role="list" aria-label="People">
      {users.data.map((u) => (
        <ListRow
          key={u.id}
          title={u.name}
          subtitle={u.email}
          leading={<Avatar name={u.name} dimmed={u.disabled} />}
          trailing={
            <>
              {u.disabled ? <Badge label="Disabled" tone="danger" /> : null}
              <Badge label={ROLE_LABELS[u.role]} tone={u.role === 'admin' ? 'accent' : 'teal'} />
            </>
          }
          selected={u.id === selectedId}
          onPress={() => onSelect(u.id)}
          accessibilityLabel={`${u.name}, ${ROLE_LABELS[u.role]}${u.disabled ? ', disabled' : ''}`}
        />
      ))}
    </View>
  );
}
