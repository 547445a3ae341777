/**
 * A recording against a body: channels the body has no dof for are dropped (frames cut to match),
 * and each kept channel's margin to its range is the smallest distance inside it over the trimmed
 * frames (hand-computed values below).
 */
import { describe, expect, it } from 'vitest';

import { channelMargins, fitChannelsToBody } from '../../shared/primitives/recorded-channels.ts';

const recording = {
  dofs: ['waist_rot', 'waist_flex', 'l_sh_flex'],
  frames: [[1, 2, 3], [4, 5, 6], [7, 8, 9], [10, 11, 12]],
};

describe('fitChannelsToBody', () => {
  it('drops a channel the body lacks (a suit-locked waist flexion) and cuts every frame to match', () => {
    const fitted = fitChannelsToBody(recording, (d) => d !== 'waist_flex');
    expect(fitted).toEqual({ dofs: ['waist_rot', 'l_sh_flex'], frames: [[1, 3], [4, 6], [7, 9], [10, 12]], dropped: ['waist_flex'] });
  });

  it('keeps everything when the body has every channel', () => {
    expect(fitChannelsToBody(recording, () => true)).toEqual({ ...recording, dropped: [] });
  });

  it('keeps nothing when the body has none of them', () => {
    expect(fitChannelsToBody(recording, () => false).dofs).toEqual([]);
  });
});

describe('channelMargins', () => {
  // 1 Hz, 5 frames: trimming to [1 s, 3 s] keeps frames 1–3.
  const sweep = { dofs: ['l_sh_flex', 'l_sh_abd'], frames: [[-80, 0], [10, 20], [150, 40], [30, 185], [500, 0]], rateHz: 1, trimStartS: 1, trimEndS: 3 };
  const ranges = { l_sh_flex: { min: -50, max: 180 }, l_sh_abd: { min: -20, max: 180 } };

  it('measures the margin over the trimmed frames only (the first and last frames are beyond but trimmed away)', () => {
    const [flex] = channelMargins(sweep, ranges);
    // flexion 10…150 in [−50, 180]: 60° above the minimum, 30° below the maximum → 30°, maximum nearest
    expect(flex).toEqual({ dof: 'l_sh_flex', lowDeg: 10, highDeg: 150, range: ranges.l_sh_flex, marginDeg: 30, nearest: 'max' });
  });

  it('is negative by the overshoot when a frame is beyond a limit', () => {
    const [, abd] = channelMargins(sweep, ranges);
    // abduction 20…185 in [−20, 180]: 5° beyond the maximum
    expect(abd.marginDeg).toBe(-5);
    expect(abd.nearest).toBe('max');
  });

  it('has no margin for a channel without a range', () => {
    expect(channelMargins(sweep, { l_sh_flex: ranges.l_sh_flex })[1]).toMatchObject({ range: null, marginDeg: null, nearest: null });
  });
});
