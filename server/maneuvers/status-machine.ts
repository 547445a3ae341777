/**
 * The life of a sequence version as a pure transition table (statuses in
 * shared/contracts/version-status.ts). Every status change in the server goes through `transition`,
 * so no path can skip the table.
 */
import type { VersionStatus } from '../../shared/contracts/version-status.ts';

/**
 * What can happen to a version:
 * - `submit`: the author sends a drafting version for review;
 * - `clear` / `send_back`: a reviewer's decision on a version under review;
 * - `supersede_by_save`: a newer version of the same sequence was saved;
 * - `supersede_by_clear`: a newer version of the same sequence was cleared;
 * - `profile_changed`: the crew member's current profile is no longer the one the version is bound to;
 * - `engine_changed`: re-verified under a newer engine, the result moved (DECISIONS.md "An engine change").
 */
export type VersionEvent = 'submit' | 'clear' | 'send_back' | 'supersede_by_save' | 'supersede_by_clear' | 'profile_changed' | 'engine_changed';

/** The events a version reacts to in each status, and the status each leads to. */
export const TRANSITIONS: Readonly<Record<VersionStatus, Partial<Record<VersionEvent, VersionStatus>>>> = {
  drafting: { submit: 'under_review', supersede_by_save: 'replaced' },
  // A newer save withdraws a pending review: the reviewer would be judging an outdated version.
  under_review: { clear: 'cleared', send_back: 'sent_back', supersede_by_save: 'replaced', profile_changed: 'recheck' },
  // A cleared version stays the one trainees rehearse until a newer one is cleared.
  cleared: { supersede_by_clear: 'replaced', profile_changed: 'recheck', engine_changed: 'recheck' },
  sent_back: { supersede_by_save: 'replaced' },
  replaced: {},
  // Recheck cannot be submitted again as is: a new version (bound to the new profile) replaces it.
  // The service applies `supersede_by_save` only to recheck versions that were never cleared, so a
  // once-cleared one stays visible (flagged) to trainees until its successor is cleared.
  recheck: { supersede_by_save: 'replaced', supersede_by_clear: 'replaced' },
};

/** The status after `event`, or null when the table does not allow it. */
export function transition(from: VersionStatus, event: VersionEvent): VersionStatus | null {
  return TRANSITIONS[from][event] ?? null;
}

/** Statuses from which `event` is allowed. */
export function statusesAllowing(event: VersionEvent): VersionStatus[] {
  return (Object.keys(TRANSITIONS) as VersionStatus[]).filter((s) => TRANSITIONS[s][event] !== undefined);
}

/** Words for refusing an event in a status (for 409 messages). */
export function refusal(from: VersionStatus, event: VersionEvent): string {
  const what: Record<VersionEvent, string> = {
    submit: 'submitted for review',
    clear: 'cleared',
    send_back: 'sent back',
    supersede_by_save: 'replaced by a new save',
    supersede_by_clear: 'replaced by a newer cleared version',
    profile_changed: 'flagged for a re-check',
    engine_changed: 'flagged for a re-check after an engine change',
  };
  const allowed = statusesAllowing(event).join(' or ');
  return `This version is ${from.replace('_', ' ')} and cannot be ${what[event]} (only a version that is ${allowed} can).`;
}
