import type { JobState } from '@/shared/contracts/job-state';

import { Badge, type BadgeTone } from './Badge';

/** Grey waits, teal runs, green ended well, red failed, amber was stopped by someone. */
const LOOK: Record<JobState, { label: string; tone: BadgeTone }> = {
  queued: { label: 'Queued', tone: 'neutral' },
  running: { label: 'Running', tone: 'teal' },
  done: { label: 'Done', tone: 'success' },
  failed: { label: 'Failed', tone: 'danger' },
  cancelled: { label: 'Cancelled', tone: 'accent' },
};

/** Props of {@link JobStateBadge}. */
export interface JobStateBadgeProps {
  /** A background job's state (plans, robustness runs and re-verifications share these states). */
  state: JobState;
  /** The word for `done` where a screen says what was done (e.g. "Computed"); default "Done". */
  doneLabel?: string;
}

/** The state of a background job, in one look wherever jobs show. */
export function JobStateBadge({ state, doneLabel }: JobStateBadgeProps) {
  const look = LOOK[state];
  return <Badge label={state === 'done' && doneLabel ? doneLabel : look.label} tone={look.tone} />;
}
