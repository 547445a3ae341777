import { StateBadge, type StateLooks } from '@/components/ui/StateBadge';
import { VERSION_STATUS_LABELS as WORDS, type VersionStatus } from '@/shared/contracts/version-status';

/** Amber waits on someone, green is cleared, red needs work; the words are the contract's. */
const VERSION_STATUS_LOOKS: StateLooks<VersionStatus> = {
  drafting: { label: WORDS.drafting, tone: 'neutral', icon: 'edit-3' },
  under_review: { label: WORDS.under_review, tone: 'accent', icon: 'clock' },
  cleared: { label: WORDS.cleared, tone: 'success', icon: 'check-circle' },
  sent_back: { label: WORDS.sent_back, tone: 'danger', icon: 'corner-up-left' },
  replaced: { label: WORDS.replaced, tone: 'neutral', icon: 'layers' },
  recheck: { label: WORDS.recheck, tone: 'danger', icon: 'alert-triangle' },
};

/** A sequence version's status in the product's words ("Under review", "Cleared", "Re-check needed"). */
export function VersionStatusBadge({ status }: { status: VersionStatus }) {
  return <StateBadge looks={VERSION_STATUS_LOOKS} state={status} />;
}
