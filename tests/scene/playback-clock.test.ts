/** The player's clock: beats per cycle, speed, loop, end, step jumps, completed steps. */
import { describe, expect, it } from 'vitest';

import { PlaybackClock } from '../../scene/playback/playback-clock.ts';
import { cycleAt, stepIndexAt } from '../../scene/playback/step-position.ts';

// The ARM_SWEEP timeline: move 0–1 s, 3 cycles of 1.5 s 1–5.5 s, hold 5.5–6 s, move 6–7 s.
const STEPS = [
  { start: 0, end: 1, cycles: null, period: null },
  { start: 1, end: 5.5, cycles: 3, period: 1.5 },
  { start: 5.5, end: 6, cycles: null, period: null },
  { start: 6, end: 7, cycles: null, period: null },
];

/** Plays `seconds` of wall time in 1/60 s frames. */
function run(c: PlaybackClock, seconds: number) {
  for (let i = 0; i < Math.round(seconds * 60); i++) c.advance(1 / 60, i / 60);
}

describe('step position', () => {
  it('cycle 2 of 3 at t = 3.4 s (1.5 s into the cyclic step that starts at 1 s)', () => {
    expect(stepIndexAt(STEPS, 3.4)).toBe(1);
    expect(cycleAt(STEPS[1], 3.4)).toEqual({ cycle: 2, of: 3 });
  });
  it('a step boundary (t = 5.5 s) belongs to the step that starts there', () => {
    expect(stepIndexAt(STEPS, 5.5)).toBe(2);
  });
});

describe('playback clock', () => {
  it('plays the 7 s sequence through at 1×: beats at each step start and each cycle start, then ends with 4 steps done', () => {
    const c = new PlaybackClock(7, STEPS);
    c.play();
    run(c, 8);
    const s = c.getSnapshot();
    expect(s.ended).toBe(true);
    expect(s.playing).toBe(false);
    expect(c.t).toBe(7);
    // Steps 1, 2, 3 start (3 beats) + cycles 2 and 3 start (2 beats) = 5.
    expect(s.beats).toBe(5);
    expect(s.completedSteps).toBe(4);
  });

  it('at 2× reaches the same time in half the wall time (3.5 s → t = 7 s)', () => {
    const c = new PlaybackClock(7, STEPS);
    c.setSpeed(2);
    c.play();
    run(c, 3.4);
    expect(c.t).toBeCloseTo(6.8, 9);
  });

  it('loops the cyclic step: after 10 s at 1× it is still inside 1–5.5 s', () => {
    const c = new PlaybackClock(7, STEPS);
    c.goToStep(1);
    c.toggleLoop();
    c.play();
    run(c, 10);
    expect(c.t).toBeGreaterThanOrEqual(1);
    expect(c.t).toBeLessThan(5.5);
    expect(c.getSnapshot().playing).toBe(true);
  });

  it('next/previous step jump to step starts; seeking does not count steps as completed', () => {
    const c = new PlaybackClock(7, STEPS);
    c.nextStep();
    expect(c.t).toBe(1);
    c.nextStep();
    expect(c.t).toBe(5.5);
    c.prevStep();
    expect(c.t).toBe(1);
    c.seek(6.5);
    expect(c.getSnapshot().step).toBe(3);
    expect(c.getSnapshot().completedSteps).toBe(0);
  });

  it('publishes a new snapshot only when something shown changes (not every frame)', () => {
    const c = new PlaybackClock(7, STEPS);
    let n = 0;
    c.subscribe(() => n++);
    c.play();
    run(c, 1);
    // 1 s of frames: play + ~10 time ticks + 1 step change, far fewer than 60 frames.
    expect(n).toBeLessThan(15);
    expect(n).toBeGreaterThan(5);
  });
});
