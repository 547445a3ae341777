import { useMemo } from 'react';
import { View } from 'react-native';

import { useCrewListQuery } from '@/components/api/use-crew';
import { useTeamUsersQuery } from '@/components/api/use-team';
import { gaps } from '@/components/theme';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { Select } from '@/components/ui/Select';
import { Text } from '@/components/ui/Text';

/** Props of {@link CrewMemberPicker}. */
export interface CrewMemberPickerProps {
  /** Selected crew member id; `''` while none is chosen. */
  value: string;
  onChange: (crewMemberId: string) => void;
  error?: string;
  /** A user left out of the "linked to" marks (the trainee being edited, who is not linked to themselves). */
  exceptUserId?: string;
}

/**
 * Chooses the crew member a trainee invitation links to (GET /api/crew), so the invitee sees their own
 * profile and maneuvers from the first sign-in. Members already linked to a trainee are marked, since
 * two accounts on one body is rarely meant.
 */
export function CrewMemberPicker({ value, onChange, error, exceptUserId }: CrewMemberPickerProps) {
  const crew = useCrewListQuery('');
  const people = useTeamUsersQuery();
  const options = useMemo(() => {
    const linked = new Map<string, string[]>();
    for (const u of people.data ?? []) if (u.crewMemberId && u.id !== exceptUserId) linked.set(u.crewMemberId, [...(linked.get(u.crewMemberId) ?? []), u.name]);
    return (crew.data ?? []).map((m) => {
      const holder = linked.get(m.id);
      const name = m.callSign ? `${m.name} (${m.callSign})` : m.name;
      return { value: m.id, label: holder ? `${name} — linked to ${holder.join(', ')}` : name };
    });
  }, [crew.data, people.data, exceptUserId]);

  if (crew.isError) return <ErrorBanner error="The crew list did not load, so the trainee cannot be linked yet. Reload the page to try again." />;
  if (crew.isPending) {
    return (
      <View style={gaps.xs}>
        <Text variant="label" tone="muted">
          Crew member
        </Text>
        <Text tone="muted">Loading the crew list…</Text>
      </View>
    );
  }
  if (options.length === 0) {
    return (
      <View style={gaps.xs}>
        <Text variant="label" tone="muted">
          Crew member
        </Text>
        <Text tone="accent" role="alert">
          There are no crew members yet. A planner adds the trainee&apos;s crew member on the Crew tab first.
        </Text>
      </View>
    );
  }
  return (
    <Select
      label="Crew member"
      placeholder="Choose the trainee's crew member"
      options={options}
      value={value}
      onChange={onChange}
      error={error}
      hint="The trainee sees this crew member's profile and rehearses the maneuvers cleared for it."
    />
  );
}
