/**
 * Serialised GET responses kept per process, each tagged with the database's write-ahead-log insert
 * position read when its request was authenticated (`req.dataMark`, in the same query as the user:
 * no extra round trip). Every committed write inserts WAL first, so while the position has not
 * moved, nothing the response was built from can have changed, and the stored bytes are served
 * (with their ETag) instead of running the route's queries and JSON building again. Any write in
 * the cluster — ours, a job worker's, another database's — moves the position and retires every
 * entry on its next read. Entries are per user and URL (visibility rules differ by user). Only
 * 200 responses are kept; a bounded LRU by bytes.
 */
import { createHash } from 'node:crypto';

import type { Request, Response } from 'express';

/** Bytes of response bodies kept at most (the oldest used go first). */
const MAX_BYTES = 64 * 1024 * 1024;
/** A single response larger than this is not kept. */
const MAX_ENTRY_BYTES = 4 * 1024 * 1024;

interface Entry { mark: string; body: string; etag: string; bytes: number }

/** An LRU of serialised responses (Map order = use order). */
export class ReadCache {
  private readonly entries = new Map<string, Entry>();
  private bytes = 0;
  hits = 0;
  misses = 0;

  /** The stored entry for `key` if it was built at data mark `mark`. */
  get(key: string, mark: string): Entry | undefined {
    const e = this.entries.get(key);
    if (!e) return undefined;
    this.entries.delete(key);
    if (e.mark !== mark) { this.bytes -= e.bytes; return undefined; }
    this.entries.set(key, e);
    return e;
  }

  /** Stores a body built at data mark `mark`. */
  set(key: string, mark: string, body: string): Entry {
    const bytes = Buffer.byteLength(body);
    const entry = { mark, body, etag: `W/"${createHash('sha1').update(body).digest('base64url')}"`, bytes };
    const old = this.entries.get(key);
    if (old) { this.entries.delete(key); this.bytes -= old.bytes; }
    if (bytes > MAX_ENTRY_BYTES) return entry;
    this.entries.set(key, entry);
    this.bytes += bytes;
    for (const [k, e] of this.entries) {
      if (this.bytes <= MAX_BYTES) break;
      this.entries.delete(k);
      this.bytes -= e.bytes;
    }
    return entry;
  }

  /** Bytes held. */
  get size(): number {
    return this.bytes;
  }
}

/** JSON already serialised by the route (sent as is). */
export class RawJson {
  constructor(readonly text: string) {}
}

/**
 * Answers a signed-in GET with `build()`'s JSON, from the cache when the data mark has not moved
 * since it was built. Without a data mark (no guard ran) it just builds.
 */
export async function sendCachedJson(cache: ReadCache, req: Request, res: Response, build: () => Promise<unknown>): Promise<void> {
  const mark = req.dataMark;
  const user = req.user;
  if (!mark || !user) {
    const value = await build();
    if (value instanceof RawJson) res.type('application/json').send(value.text);
    else res.json(value);
    return;
  }
  const key = `${user.id}\u0000${user.role}\u0000${req.originalUrl}`;
  let entry = cache.get(key, mark);
  if (entry) cache.hits++;
  else {
    cache.misses++;
    const value = await build();
    entry = cache.set(key, mark, value instanceof RawJson ? value.text : JSON.stringify(value));
  }
  // The ETag set here spares Express hashing the body again (and answers If-None-Match with 304).
  res.set('Cache-Control', 'private, max-age=0');
  res.set('ETag', entry.etag);
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  res.type('application/json').send(entry.body);
}
