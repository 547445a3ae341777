/**
 * In-memory cache of computed motions. Safe because what a motion depends on is frozen: a cleared
 * version's compiled steps and its profile version's body never change (database triggers), and the
 * key includes the engine version. Status is re-read on every request and patched into the copy.
 */
import { ENGINE_VERSION } from '../engine/version.ts';

/** A small least-recently-used cache of promises (concurrent requests for one key share one computation). */
export class MotionCache<T> {
  private readonly entries = new Map<string, Promise<T>>();

  /** @param capacity entries kept (default 32; a 30 s motion at 30 Hz is ≈150 KB). */
  constructor(private readonly capacity = 32) {}

  /** Key of a version's motion at a sample rate under the running engine. */
  static key(versionId: string, profileVersionId: string, rateHz: number): string {
    return `${versionId}|${profileVersionId}|${rateHz}|${ENGINE_VERSION}`;
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
