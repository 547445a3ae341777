import { EmptyState } from '@/components/ui/EmptyState';
import { Screen } from '@/components/ui/Screen';

// Placeholder until the 3D player lands: replace with the trainee's cleared maneuvers.
export default function RehearseScreen() {
  return (
    <Screen title="Rehearse" subtitle="Cleared maneuvers for your body">
      <EmptyState
        icon="play-circle"
        title="No cleared maneuvers yet"
        body="Maneuvers cleared for you will appear here. Play each one on your own body in 3D, follow the cues and the beat, and log every rehearsal."
      />
    </Screen>
  );
}
