import { useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';

import { useSessionQuery } from '@/components/api/use-session';
import { SplitView } from '@/components/layout/SplitView';
import { gaps } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { Screen } from '@/components/ui/Screen';
import { Sheet } from '@/components/ui/Sheet';

import { CrewList } from './CrewList';
import { MemberDetail, type MemberView } from './MemberDetail';
import { NewMemberForm } from './NewMemberForm';

const VIEWS: readonly MemberView[] = ['profile', 'history', 'edit'];

/**
 * The Crew tab: crew list with search beside the selected member's profile (wide screens), or the
 * list then the member (phones). The selection and section live in the URL (?member=…&view=…), so
 * reloads and links keep them. A trainee sees only their own member, opened directly.
 */
export function CrewScreen() {
  const router = useRouter();
  const params = useLocalSearchParams<{ member?: string; view?: string }>();
  const session = useSessionQuery();
  const user = session.data;
  const canEdit = user?.role === 'planner' || user?.role === 'admin';
  const [adding, setAdding] = useState(false);
  // No `member` in the URL: a trainee lands on their own member; `member=` (empty) is the list itself.
  const selected = params.member !== undefined ? params.member || null : user?.role === 'trainee' ? (user.crewMemberId ?? null) : null;
  const view: MemberView = VIEWS.includes(params.view as MemberView) ? (params.view as MemberView) : 'profile';

  const select = (id: string | null, next: MemberView = 'profile') => router.setParams({ member: id ?? '', view: id ? next : undefined });

  return (
    <Screen
      title="Crew"
      subtitle="Crew members and their inertia profiles"
      scroll={false}
      headInList
      actions={
        canEdit ? (
          <>
            <Button label="Upload" icon="upload" size="sm" variant="secondary" onPress={() => router.push('/crew/upload')} />
            <Button label="New crew member" icon="user-plus" size="sm" onPress={() => setAdding(true)} />
          </>
        ) : null
      }
    >
      <SplitView
        listLabel="Crew members"
        detailLabel="Crew member"
        list={
          <View style={gaps.md}>
            <CrewList selectedId={selected} onSelect={(id) => select(id)} showArchive={user?.role !== 'trainee'} />
            <Button label="Suit configurations" icon="layers" size="sm" variant="ghost" onPress={() => router.push('/crew/suits')} />
          </View>
        }
        detail={selected ? <MemberDetail key={selected} crewMemberId={selected} view={view} onView={(v) => select(selected, v)} canEdit={canEdit} /> : null}
        // The back bar names the list it returns to; the member's name is the detail's own heading.
        detailTitle="All crew"
        onCloseDetail={() => select(null)}
        placeholder={<EmptyState icon="user" title="Select a crew member" body="Pick someone on the left to see their inertia profile, its history and the derived segment table." />}
      />
      <Sheet visible={adding} onClose={() => setAdding(false)} title="New crew member">
        <NewMemberForm
          onCreated={(id) => {
            setAdding(false);
            select(id, 'edit');
          }}
        />
      </Sheet>
    </Screen>
  );
}
