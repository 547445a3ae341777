import { useState } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';

import { SplitView } from '@/components/layout/SplitView';
import { useIsWide } from '@/components/layout/use-is-wide';
import { gaps, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { Screen } from '@/components/ui/Screen';
import { SegmentedControl } from '@/components/ui/SegmentedControl';
import type { AuditEvent } from '@/shared/contracts/team';

import { type AuditFilterForm, EMPTY_AUDIT_FILTER_FORM, toAuditFilters } from './audit-filter-form';
import { AuditEventDetail } from './AuditEventDetail';
import { AuditEventList } from './AuditEventList';
import { AuditFiltersPanel } from './AuditFiltersPanel';
import { BackgroundWorkList } from './BackgroundWorkList';
import { InvitationList } from './InvitationList';
import { InviteForm } from './InviteForm';
import { PeopleList } from './PeopleList';
import { TeamMemberDetail } from './TeamMemberDetail';

type Section = 'people' | 'invitations' | 'audit' | 'jobs';
const SECTIONS = [
  { value: 'people', label: 'People' },
  { value: 'invitations', label: 'Invitations' },
  { value: 'audit', label: 'Audit log' },
  { value: 'jobs', label: 'Jobs' },
] as const;

/** Admin's Team tab: people (roles, access), invitations (and the invite form), and the audit log. */
export function TeamScreen() {
  const wide = useIsWide();
  const [section, setSection] = useState<Section>('people');
  const [selectedUserId, setSelectedUserId] = useState<string | null>(null);
  const [inviting, setInviting] = useState(false);
  const [event, setEvent] = useState<AuditEvent | null>(null);
  const [auditForm, setAuditForm] = useState<AuditFilterForm>(EMPTY_AUDIT_FILTER_FORM);

  const openInvite = () => {
    setSection('invitations');
    setInviting(true);
  };

  return (
    <Screen
      title="Team"
      subtitle="People, roles, the record of who did what, and background jobs"
      scroll={false}
      actions={section !== 'invitations' || !wide ? <Button label="Invite" icon="user-plus" size="sm" onPress={openInvite} /> : null}
    >
      <View style={styles.switcher}>
        <SegmentedControl label="Team section" hideLabel options={SECTIONS} value={section} onChange={setSection} />
      </View>

      {section === 'people' ? (
        <SplitView
          listLabel="People"
          detailLabel="Person"
          list={<PeopleList selectedId={selectedUserId} onSelect={setSelectedUserId} />}
          detail={selectedUserId ? <TeamMemberDetail key={selectedUserId} userId={selectedUserId} /> : null}
          detailTitle="People"
          onCloseDetail={() => setSelectedUserId(null)}
          placeholder={<EmptyState icon="user" title="Select a person" body="Pick someone on the left to change their role or their access." />}
        />
      ) : null}

      {section === 'invitations' ? (
        <SplitView
          listLabel="Invitations"
          detailLabel="Invite someone"
          list={
            <View style={gaps.md}>
              {!wide ? <Button label="Invite someone" icon="user-plus" onPress={() => setInviting(true)} /> : null}
              <InvitationList />
            </View>
          }
          detail={inviting && !wide ? <InviteForm /> : null}
          detailTitle="Invitations"
          onCloseDetail={() => setInviting(false)}
          placeholder={<InviteForm />}
        />
      ) : null}

      {section === 'audit' ? (
        <View style={styles.auditStack}>
          {!event || wide ? <AuditFiltersPanel value={auditForm} onApply={setAuditForm} /> : null}
          <SplitView
            listLabel="Audit events"
            detailLabel="Event"
            list={<AuditEventList filters={toAuditFilters(auditForm)} selectedId={event?.id ?? null} onSelect={setEvent} />}
            detail={event ? <AuditEventDetail event={event} /> : null}
            detailTitle="Audit log"
            onCloseDetail={() => setEvent(null)}
            placeholder={<EmptyState icon="list" title="Select an event" body="Pick an event on the left to see who did it, to what, when, and the recorded detail." />}
          />
        </View>
      ) : null}
      {section === 'jobs' ? (
        <ScrollView style={styles.jobs} contentContainerStyle={styles.jobsContent}>
          <BackgroundWorkList />
        </ScrollView>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  switcher: { maxWidth: 460 },
  auditStack: { flex: 1, minHeight: 0, gap: spacing.md },
  jobs: { flex: 1, minHeight: 0 },
  jobsContent: { paddingBottom: spacing.lg },
});
