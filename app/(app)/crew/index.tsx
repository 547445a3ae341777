import { EmptyState } from '@/components/ui/EmptyState';
import { Screen } from '@/components/ui/Screen';

// Placeholder until the crew profiles land: replace with the crew list.
export default function CrewScreen() {
  return (
    <Screen title="Crew" subtitle="Crew members and their inertia profiles">
      <EmptyState
        icon="users"
        title="No crew members yet"
        body="Each crew member's inertia profile will appear here: body measurements, suit and carried gear, the derived segment table and its version history."
      />
    </Screen>
  );
}
