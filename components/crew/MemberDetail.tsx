import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { isApiStatus } from '@/components/api/client';
import { bodyExportUrl, useCrewMemberQuery } from '@/components/api/use-crew';
import { spacing } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { SegmentedControl, type SegmentOption } from '@/components/ui/SegmentedControl';
import { Text } from '@/components/ui/Text';
import type { StaleVersion } from '@/shared/contracts/profile-version';

import { downloadUrl } from './download-file';
import { MemberArchive } from './MemberArchive';
import { ProfileEditor } from './ProfileEditor';
import { ProfileOverview } from './ProfileOverview';
import { ReverificationProgressCard } from './ReverificationProgressCard';
import { StaleAfterSave } from './StaleAfterSave';
import { VersionHistory } from './VersionHistory';

/** The sections of a member page. */
export type MemberView = 'profile' | 'history' | 'edit';

/** Props of {@link MemberDetail}. */
export interface MemberDetailProps {
  crewMemberId: string;
  view: MemberView;
  onView: (view: MemberView) => void;
  /** Planners and admins edit; reviewers and trainees read. */
  canEdit: boolean;
}

/** A crew member: current profile (whole body and segment table), history with comparison, editor. */
export function MemberDetail({ crewMemberId, view, onView, canEdit }: MemberDetailProps) {
  const q = useCrewMemberQuery(crewMemberId);
  // Bumped by "load the newest version" after a 409; a background refresh alone never restarts the editor.
  const [editorRound, setEditorRound] = useState(0);
  // What the last save made stale, shown until the next save or until dismissed.
  const [lastSave, setLastSave] = useState<{ version: number; stale: StaleVersion[] } | null>(null);
  if (q.isPending) return <LoadingState label="Loading the profile…" />;
  if (q.isError) {
    // A stale or mistyped link: retrying cannot help, so say what is missing instead.
    if (isApiStatus(q.error, 404, 400)) return <EmptyState icon="user-x" title="This crew member is not available" body="They do not exist, or your role cannot see them." />;
    return <ErrorBanner title="Could not load this crew member" error={q.error} onRetry={() => void q.refetch()} />;
  }
  const { member, current } = q.data;
  // An archived member's profile is read-only until restored (the server refuses new versions too).
  const editable = canEdit && member.archivedAt === null;
  const views: SegmentOption<MemberView>[] = [
    { value: 'profile', label: 'Profile' },
    { value: 'history', label: 'History' },
    ...(editable ? [{ value: 'edit' as const, label: current ? 'Edit' : 'Create profile' }] : []),
  ];
  const shown: MemberView = view === 'edit' && !editable ? 'profile' : view;

  return (
    <View style={styles.stack}>
      <View style={styles.head}>
        <View style={styles.titles}>
          <Text variant="title" role="heading" aria-level={2}>
            {member.name}
          </Text>
          <Text tone="muted">
            {[member.callSign, current ? `profile version ${current.version}` : 'no profile yet'].filter(Boolean).join(' · ')}
          </Text>
        </View>
        {member.archivedAt ? <Badge label="Archived" /> : current ? <Badge label={`v${current.version} current`} tone="success" /> : null}
      </View>
      <ReverificationProgressCard crewMemberId={member.id} canStop={canEdit} />
      {canEdit ? <MemberArchive member={member} /> : null}
      <SegmentedControl label="Member section" hideLabel options={views} value={shown} onChange={onView} />
      {lastSave ? <StaleAfterSave version={lastSave.version} stale={lastSave.stale} onDismiss={() => setLastSave(null)} /> : null}

      {shown === 'profile' && current ? (
        <>
          <Button label="Export body JSON" icon="download" variant="secondary" size="sm" onPress={() => downloadUrl(bodyExportUrl(member.id, current.version))} />
          <ProfileOverview version={current} />
        </>
      ) : null}
      {shown === 'profile' && !current ? (
        <EmptyState
          icon="user"
          title="No profile yet"
          body={editable ? 'Enter the body measurements, suit and gear to derive the first profile version.' : 'A planner has not entered this profile yet.'}
          action={editable ? <Button label="Create profile" icon="edit-3" onPress={() => onView('edit')} /> : undefined}
        />
      ) : null}
      {shown === 'history' ? <VersionHistory crewMemberId={member.id} /> : null}
      {shown === 'edit' ? (
        <ProfileEditor
          key={`${member.id}-${editorRound}`}
          crewMemberId={member.id}
          current={current}
          onSaved={(version, stale) => {
            setLastSave({ version, stale });
            onView('profile');
          }}
          onCancel={() => onView('profile')}
          onReload={() => void q.refetch().then(() => setEditorRound((n) => n + 1))}
        />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: spacing.md, padding: spacing.sm },
  head: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, flexWrap: 'wrap' },
  titles: { flex: 1, minWidth: 180, gap: 2 },
});
