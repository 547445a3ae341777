/**
 * The status machine as a table: every (status, event) pair against the life cycle written in the
 * issue (draft → in review → approved | returned; a newer version supersedes; a profile change
 * makes approved and in-review versions stale), in Holonaut's words.
 */
import { describe, expect, it } from 'vitest';

import { refusal, transition, type VersionEvent } from '../../server/maneuvers/status-machine.ts';
import { VERSION_STATUSES, type VersionStatus } from '../../shared/contracts/version-status.ts';

const EVENTS: VersionEvent[] = ['submit', 'clear', 'send_back', 'supersede_by_save', 'supersede_by_clear', 'profile_changed'];

/** The allowed moves, spelled out independently of the implementation's table. */
const ALLOWED: [VersionStatus, VersionEvent, VersionStatus][] = [
  ['drafting', 'submit', 'under_review'],
  ['drafting', 'supersede_by_save', 'replaced'],
  ['under_review', 'clear', 'cleared'],
  ['under_review', 'send_back', 'sent_back'],
  ['under_review', 'supersede_by_save', 'replaced'],
  ['under_review', 'profile_changed', 'recheck'],
  ['cleared', 'supersede_by_clear', 'replaced'],
  ['cleared', 'profile_changed', 'recheck'],
  ['sent_back', 'supersede_by_save', 'replaced'],
  ['recheck', 'supersede_by_save', 'replaced'],
  ['recheck', 'supersede_by_clear', 'replaced'],
];

describe('the version status machine', () => {
  const pairs = VERSION_STATUSES.flatMap((s) => EVENTS.map((e) => [s, e] as const));
  it.each(pairs)('%s + %s', (status, event) => {
    const hit = ALLOWED.find(([s, e]) => s === status && e === event);
    expect(transition(status, event)).toBe(hit ? hit[2] : null);
  });

  it('nothing leaves replaced, and a cleared version never goes back to drafting or review', () => {
    expect(EVENTS.map((e) => transition('replaced', e))).toEqual(EVENTS.map(() => null));
    expect(EVENTS.map((e) => transition('cleared', e)).filter((s) => s === 'drafting' || s === 'under_review')).toEqual([]);
  });

  it('a refusal names the status and the statuses that would allow the action', () => {
    expect(refusal('cleared', 'submit')).toBe('This version is cleared and cannot be submitted for review (only a version that is drafting can).');
  });
});
