import { z } from 'zod';

/**
 * Life of a sequence version, in Holonaut's own words:
 * drafting → under_review → cleared | sent_back; a newer version makes older ones `replaced`;
 * a profile change makes cleared/under-review ones `recheck` until re-submitted.
 */
export const VERSION_STATUSES = ['drafting', 'under_review', 'cleared', 'sent_back', 'replaced', 'recheck'] as const;
export const versionStatusSchema = z.enum(VERSION_STATUSES);
export type VersionStatus = z.infer<typeof versionStatusSchema>;

/** Labels shown to people. */
export const VERSION_STATUS_LABELS: Record<VersionStatus, string> = {
  drafting: 'Drafting',
  under_review: 'Under review',
  cleared: 'Cleared',
  sent_back: 'Sent back',
  replaced: 'Replaced',
  recheck: 'Re-check needed',
};
