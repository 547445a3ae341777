/**
 * The compact attitude track stored with every planner candidate: a steady turn about one body axis
 * has a closed form (quaternion of angle θ about z: [cos θ/2, 0, 0, sin θ/2] is yaw θ, pitch 0,
 * roll 0 in z-y′-x″ angles), so the thinned, unwrapped track must read θ(t) exactly at the kept
 * points, end at the last sample and keep at most the asked number of points.
 */
import { describe, expect, it } from 'vitest';

import { candidateTrack } from '../../server/planning/candidate-track.ts';
import { CANDIDATE_TRACK_POINTS } from '../../shared/contracts/plan.ts';

const RAD = Math.PI / 180;

/** Samples of a steady turn about the body's z (yaw) or x (roll) axis at `rateDegS`, `rateHz` samples a second. */
function steadyTurn(axis: 'z' | 'x', rateDegS: number, durationS: number, rateHz: number) {
  const n = Math.round(durationS * rateHz);
  return Array.from({ length: n + 1 }, (_, i) => {
    const t = i / rateHz;
    const h = (rateDegS * t * RAD) / 2;
    const attitude = axis === 'z' ? { w: Math.cos(h), x: 0, y: 0, z: Math.sin(h) } : { w: Math.cos(h), x: Math.sin(h), y: 0, z: 0 };
    return { t, attitude, jointsDeg: [] };
  });
}

describe('candidate attitude track', () => {
  it('reads a steady 1.5-turn yaw as one rising line (unwrapped past ±180°), thinned to the limit, ending at the last sample', () => {
    // 540° in 60 s at 30 Hz: 1,801 samples, more than the stored limit.
    const frames = steadyTurn('z', 9, 60, 30);
    const tr = candidateTrack(frames);
    expect(tr.t.length).toBeLessThanOrEqual(CANDIDATE_TRACK_POINTS);
    expect(tr.t.length).toBeGreaterThan(CANDIDATE_TRACK_POINTS / 2);
    expect(tr.t[0]).toBe(0);
    expect(tr.t.at(-1)).toBe(60);
    tr.t.forEach((t, i) => {
      expect(tr.yawDeg[i]).toBeCloseTo(9 * t, 1);
      expect(Math.abs(tr.pitchDeg[i])).toBeLessThan(0.01);
      expect(Math.abs(tr.rollDeg[i])).toBeLessThan(0.01);
    });
    expect(tr.yawDeg.at(-1)).toBeCloseTo(540, 1);
  });

  it('unwraps roll too, and keeps the last sample when the stride does not land on it', () => {
    // 10 s at 30 Hz (301 samples) thinned to 7 points: stride 50 lands on 0…300; 11 s (331) does not.
    const frames = steadyTurn('x', -40, 11, 30);
    const tr = candidateTrack(frames, 7);
    expect(tr.t.length).toBeLessThanOrEqual(7);
    expect(tr.t.at(-1)).toBe(11);
    expect(tr.rollDeg.at(-1)).toBeCloseTo(-440, 1);
    for (let i = 1; i < tr.t.length; i++) expect(tr.rollDeg[i]).toBeLessThan(tr.rollDeg[i - 1]);
  });

  it('keeps every sample of a short run and refuses a limit below two points', () => {
    const frames = steadyTurn('z', 10, 1, 20);
    expect(candidateTrack(frames).t).toHaveLength(frames.length);
    expect(() => candidateTrack(frames, 1)).toThrow('maxPoints');
  });
});
