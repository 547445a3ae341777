import { Badge, type BadgeTone } from '@/components/ui/Badge';
import type { IconName } from '@/components/ui/Icon';
import { VERSION_STATUS_LABELS, type VersionStatus } from '@/shared/contracts/version-status';

/** Tone and icon per version status: amber waits on someone, green is cleared, red needs work. */
const LOOK: Record<VersionStatus, { tone: BadgeTone; icon: IconName }> = {
  drafting: { tone: 'neutral', icon: 'edit-3' },
  under_review: { tone: 'accent', icon: 'clock' },
  cleared: { tone: 'success', icon: 'check-circle' },
  sent_back: { tone: 'danger', icon: 'corner-up-left' },
  replaced: { tone: 'neutral', icon: 'layers' },
  recheck: { tone: 'danger', icon: 'alert-triangle' },
};

/** Props of {@link VersionStatusBadge}. */
export interface VersionStatusBadgeProps {
  status: VersionStatus;
}

/** A sequence version's status in the product's words ("Under review", "Cleared", "Re-check needed"). */
export function VersionStatusBadge({ status }: VersionStatusBadgeProps) {
  const look = LOOK[status];
  return <Badge label={VERSION_STATUS_LABELS[status]} tone={look.tone} icon={look.icon} />;
}
