import type { JobState } from '@/shared/contracts/job-state';

import { StateBadge, type StateLooks } from './StateBadge';

/** Grey waits, teal runs, green ended well, red failed, amber was stopped by someone. */
const JOB_STATE_LOOKS: StateLooks<JobState> = {
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
  return <StateBadge looks={JOB_STATE_LOOKS} state={state} label={state === 'done' && doneLabel ? doneLabel : undefined} />;
}
