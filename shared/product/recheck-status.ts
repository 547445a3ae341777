/**
 * What a version waiting for its re-check (a profile change made it stale) is waiting for, and the
 * one sentence a trainee reads about it. Built from the records as they are at that moment, so the
 * message is never ahead of or behind the truth (DECISIONS.md "Re-check creates the next version").
 */

import type { JobState } from '../contracts/job-state.ts';

/** The state of a stale version's re-check. */
export interface RecheckInfo {
  /** What made it stale: a profile change, or a newer engine whose result moved (absent: profile). */
  cause?: 'profile' | 'engine';
  /** When the profile change made it stale (ISO 8601). */
  staleSince: string | null;
  /** The newest re-verification on a newer profile (null: none recorded). */
  reverification: {
    state: JobState;
    /** How far the final attitude moved on the new profile, degrees (null until done). */
    attitudeShiftDeg: number | null;
    error: string | null;
  } | null;
  /** The newest newer version of the maneuver (the automatic re-check version or a planner's), null when none. */
  successor: {
    version: number;
    status: 'drafting' | 'under_review' | 'cleared' | 'sent_back' | 'replaced' | 'recheck';
    /** True when it is the automatic re-check version of this one. */
    automatic: boolean;
  } | null;
}

const deg = (x: number) => `${x < 0.1 ? x.toFixed(2) : x.toFixed(1)}°`;

/**
 * One or two sentences on why the maneuver cannot be rehearsed now and what it waits for: for the
 * trainee ("your profile", "your reviewer"), or for staff ("the crew member's profile").
 */
export function recheckMessage(r: RecheckInfo, audience: 'trainee' | 'staff' = 'trainee'): string {
  const text = audienceWords(r, audience === 'trainee' ? 'Until then it cannot be rehearsed.' : 'Until then the crew member cannot rehearse it.');
  return audience === 'trainee' ? text : text.replace(/Your profile/g, 'The crew member’s profile').replace(/your reviewer/g, 'a reviewer');
}

function audienceWords(r: RecheckInfo, blocked: string): string {
  if (r.cause === 'engine') return engineWords(r, blocked);
  const s = r.successor;
  if (s?.status === 'under_review') {
    const rv = r.reverification;
    const moved = s.automatic && rv?.state === 'done' && rv.attitudeShiftDeg !== null ? `; re-verified, attitude moved ${deg(rv.attitudeShiftDeg)}` : '';
    return s.automatic
      ? `Waiting for your reviewer after a profile change${moved}. ${blocked}`
      : `Your profile changed; a planner revised this maneuver (version ${s.version}) and it is waiting for your reviewer. ${blocked}`;
  }
  if (s?.status === 'sent_back') return `Your profile changed and the reviewer sent the re-checked version ${s.version} back; a planner has to revise it. ${blocked}`;
  if (s?.status === 'drafting') return `Your profile changed; a planner is revising this maneuver (draft version ${s.version}). ${blocked}`;
  const rv = r.reverification;
  if (!rv || rv.state === 'queued' || rv.state === 'running') return `Your profile changed; this maneuver is being re-verified on the new profile${rv?.state === 'running' ? ' now' : ''}. A reviewer then decides on it again. ${blocked}`;
  if (rv.state === 'failed') return `Your profile changed and re-verifying this maneuver failed${rv.error ? ` (${rv.error})` : ''}; a planner has to look at it. ${blocked}`;
  if (rv.state === 'cancelled') return `Your profile changed and its re-verification was stopped; a planner has to save it again for review. ${blocked}`;
  return `Your profile changed; re-verified (attitude moved ${deg(rv.attitudeShiftDeg ?? 0)}) and waiting for a planner to send it for review. ${blocked}`;
}

/** A newer engine moved the result: the same steps on the same profile, re-verified, wait for a reviewer. */
function engineWords(r: RecheckInfo, blocked: string): string {
  const s = r.successor;
  const rv = r.reverification;
  const moved = rv?.state === 'done' && rv.attitudeShiftDeg !== null ? ` (attitude moved ${deg(rv.attitudeShiftDeg)})` : '';
  const why = `The simulation engine was updated and re-verifying this maneuver changed its result${moved}`;
  if (s?.status === 'under_review') return `${why}; version ${s.version} is waiting for your reviewer. ${blocked}`;
  if (s?.status === 'sent_back') return `${why}, and the reviewer sent the re-checked version ${s.version} back; a planner has to revise it. ${blocked}`;
  if (s?.status === 'drafting') return `${why}; a planner is revising this maneuver (draft version ${s.version}). ${blocked}`;
  return `${why}; a planner has to send it for review again. ${blocked}`;
}
