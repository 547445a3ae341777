import { describe, expect, it } from 'vitest';

import { homeTab } from '../../components/shell/tab-access.ts';

describe('where each role lands after signing in', () => {
  it('a reviewer lands on Reviews, where their work waits', () => expect(homeTab('reviewer')).toBe('reviews'));
  it('a trainee lands on Rehearse', () => expect(homeTab('trainee')).toBe('rehearse'));
  it('a planner and an admin land on Crew, their first tab', () => {
    expect(homeTab('planner')).toBe('crew');
    expect(homeTab('admin')).toBe('crew');
  });
});
