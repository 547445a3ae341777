/**
 * The overlaid candidate plots' time axis: linear interpolation is checked against straight lines
 * (exact for linear data by definition) and a hand-worked case; a line ends at its candidate's end.
 */
import { describe, expect, it } from 'vitest';

import { nearestTurn, overlayGrid, valuesOnGrid } from '../../components/maneuvers/planner/candidate-overlay.ts';

describe('candidate overlay', () => {
  it('spans 0 to the longest end and contains every end exactly', () => {
    const grid = overlayGrid([12.34, 40, 7.5], 11);
    expect(grid[0]).toBe(0);
    expect(grid.at(-1)).toBe(40);
    expect(grid).toContain(12.34);
    expect(grid).toContain(7.5);
    for (let i = 1; i < grid.length; i++) expect(grid[i]).toBeGreaterThan(grid[i - 1]);
  });

  it('reproduces a straight line at any instant and leaves NaN after the track ends', () => {
    // v = 3t − 2 sampled unevenly: linear interpolation is exact on a line.
    const t = [0, 0.7, 1.9, 4, 6.5];
    const track = { t, values: t.map((x) => 3 * x - 2) };
    const grid = overlayGrid([6.5, 10], 21);
    const v = valuesOnGrid(track, grid);
    grid.forEach((x, i) => {
      if (x <= 6.5) expect(v[i]).toBeCloseTo(3 * x - 2, 12);
      else expect(v[i]).toBeNaN();
    });
  });

  it('interpolates between neighbours (hand-worked: halfway between 10 and 20 is 15)', () => {
    expect(valuesOnGrid({ t: [0, 1, 2], values: [0, 10, 20] }, [1.5, 2])).toEqual([15, 20]);
    expect(valuesOnGrid({ t: [], values: [] }, [0, 1]).every(Number.isNaN)).toBe(true);
  });

  it('draws a target beside an unwrapped track at the equivalent angle nearest its end', () => {
    expect(nearestTurn(-180, 179)).toBe(180);
    expect(nearestTurn(90, 450.2)).toBe(450);
    expect(nearestTurn(45, 40)).toBe(45);
  });
});
