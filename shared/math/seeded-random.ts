/**
 * A small seeded PRNG for reproducible dispersion runs: mulberry32 (Tommy Ettinger's 32-bit
 * generator, widely used for seeded simulation; not cryptographic). Same seed → same sequence.
 */

/** Returns a function giving uniform numbers in [0, 1). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A uniform number in [−1, 1) from a [0, 1) generator. */
export function symmetricUnit(random: () => number): number {
  return 2 * random() - 1;
}
