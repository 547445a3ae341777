import { EmptyState } from '@/components/ui/EmptyState';
import { Screen } from '@/components/ui/Screen';

// Placeholder until the composer lands: replace with the sequence list.
export default function ManeuversScreen() {
  return (
    <Screen title="Maneuvers" subtitle="Limb-sweep sequences and their verification">
      <EmptyState
        icon="rotate-cw"
        title="No maneuvers yet"
        body="Sequences composed for each crew member will appear here, with the target reorientation, the verification report, version history and review status."
      />
    </Screen>
  );
}
