/**
 * In-memory cache of built motions. Safe because what a motion is built from is frozen: a version's
 * compiled steps and verification report, and its profile version's body, never change once the
 * version is playable (database triggers); nothing in it depends on the engine running now.
 * Status and the running engine are added per request.
 */

/** A small least-recently-used cache of promises (concurrent requests for one key share one computation). */
export class MotionCache<T> {
  private readonly entries = new Map<string, Promise<T>>();

  /** @param capacity entries kept (default 32; a 30 s motion at 20 Hz is ≈100 KB). */
  constructor(private readonly capacity = 32) {}

  /** Key of a version's motion at a sample rate (undefined: as verified). */
  static key(versionId: string, rateHz: number | undefined): string {
    return `${versionId}|${rateHz ?? 'verified'}`;
  }

  /** The cached value, or compute() once and keep it; a failed computation is not kept. */
  get(key: string, compute: () => Promise<T>): Promise<T> {
    const hit = this.entries.get(key);
    if (hit) {
      // Refresh recency.
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    const p = compute();
    this.entries.set(key, p);
    p.catch(() => this.entries.delete(key));
    while (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value as string);
    return p;
  }

  /** Number of entries (for tests). */
  get size(): number {
    return this.entries.size;
  }
}
