/**
 * How a robustness run is cut into chunk jobs: every sample in exactly one chunk, in order; a given
 * chunk size cuts equal chunks; the default split shrinks its chunks toward the end (large chunks
 * first for little queue work per sample, small ones last so workers finish together: the idea of
 * guided self-scheduling, Polychronopoulos & Kuck 1987, from memory).
 */
import { describe, expect, it } from 'vitest';

import { chunkRanges, CHUNKS_PER_RUN, MIN_CHUNK_SAMPLES } from '../../server/jobs/robustness/robustness-runs.ts';

/** The ranges tile [0, samples) with no gap, overlap or empty chunk. */
function expectTiles(ranges: { from: number; to: number }[], samples: number) {
  expect(ranges[0]?.from ?? 0).toBe(0);
  ranges.forEach((r, i) => {
    expect(r.to).toBeGreaterThan(r.from);
    if (i > 0) expect(r.from).toBe(ranges[i - 1].to);
  });
  expect(ranges.at(-1)?.to ?? 0).toBe(samples);
}

describe('chunkRanges', () => {
  it('with a chunk size, cuts equal chunks and a short last one', () => {
    const r = chunkRanges(40, 7);
    expectTiles(r, 40);
    expect(r.map((c) => c.to - c.from)).toEqual([7, 7, 7, 7, 7, 5]);
    expect(chunkRanges(10, 10)).toEqual([{ from: 0, to: 10 }]);
  });

  it('by default, cuts a run into at most CHUNKS_PER_RUN shrinking chunks, the last about a fifth of the first, none under the minimum', () => {
    for (const samples of [100, 250, 400, 1000, 2000, 10_000]) {
      const r = chunkRanges(samples);
      expectTiles(r, samples);
      const sizes = r.map((c) => c.to - c.from);
      expect(sizes.length).toBeLessThanOrEqual(CHUNKS_PER_RUN);
      for (let i = 1; i < sizes.length; i++) expect(sizes[i]).toBeLessThanOrEqual(sizes[i - 1]);
      for (const s of sizes) expect(s).toBeGreaterThanOrEqual(MIN_CHUNK_SAMPLES);
      if (sizes.length > 1) expect(sizes.at(-1)! / sizes[0]).toBeCloseTo(0.2, 1);
    }
    expect(chunkRanges(1000)).toHaveLength(CHUNKS_PER_RUN);
  });

  it('keeps a run smaller than two minimum chunks whole, and an empty run empty', () => {
    expect(chunkRanges(30)).toEqual([{ from: 0, to: 30 }]);
    expect(chunkRanges(1)).toEqual([{ from: 0, to: 1 }]);
    expect(chunkRanges(0)).toEqual([]);
  });
});
