import { EmptyState } from '@/components/ui/EmptyState';
import { Screen } from '@/components/ui/Screen';

// Placeholder until reviews land: replace with the review queue.
export default function ReviewsScreen() {
  return (
    <Screen title="Reviews" subtitle="Sequence versions waiting for a decision">
      <EmptyState
        icon="check-square"
        title="Nothing to review"
        body="Versions submitted for review will queue here. Open one to read its verification report, comment, and clear it or send it back."
      />
    </Screen>
  );
}
