/**
 * Serialised GET responses kept per process, each tagged with the database's write-ahead-log insert
 * position read when its request was authenticated (`req.dataMark`, in the same query as the user:
 * no extra round trip). Every committed write inserts WAL first, so while the position has not
 * moved, nothing the response was built from can have changed, and the stored bytes are served
 * (with their ETag) instead of running the route's queries and JSON building again. Any write in
 * the cluster — ours, a job worker's, another database's — moves the position and retires every
 * entry on its next read. Entries are per user and URL (visibility rules differ by user). Only
 * 200 responses are kept; a bounded LRU by bytes.
 *
 * A body worth compressing is gzipped once, when its entry is made, and that copy goes to every
 * client that accepts gzip (browsers do): compressing per request would cost each request the CPU
 * that the cache saves.
 */
import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { gzip as gzipCallback } from 'node:zlib';

import type { Request, Response } from 'express';

const gzip = promisify(gzipCallback);

/** Bytes of response bodies kept at most (the oldest used go first). */
const MAX_BYTES = 64 * 1024 * 1024;
/** A single response larger than this is not kept. */
const MAX_ENTRY_BYTES = 4 * 1024 * 1024;
/** Bodies smaller than this go uncompressed (the `compression` package's default threshold). */
const GZIP_MIN_BYTES = 1024;
/** zlib level: 6 (zlib's default) costs about twice level 1's time for a few per cent fewer bytes; once per entry, 6 is affordable. */
const GZIP_LEVEL = 6;

/** A stored response: the JSON bytes, their gzipped copy (when worth it) and the ETag. */
export interface Entry { mark: string; body: Buffer; gzipped: Buffer | null; etag: string; bytes: number }

/** An LRU of serialised responses (Map order = use order). */
export class ReadCache {
  private readonly entries = new Map<string, Entry>();
  /** Builds in flight by key and mark: concurrent misses share one (a burst after a write runs the queries once). */
  private readonly building = new Map<string, Promise<Entry>>();
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

  /** Stores a JSON text built at data mark `mark` (gzipping it when worth it). */
  async set(key: string, mark: string, json: string): Promise<Entry> {
    const body = Buffer.from(json);
    const gzipped = body.length >= GZIP_MIN_BYTES ? await gzip(body, { level: GZIP_LEVEL }) : null;
    const bytes = body.length + (gzipped?.length ?? 0);
    const entry: Entry = { mark, body, gzipped, etag: `W/"${createHash('sha1').update(body).digest('base64url')}"`, bytes };
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

  /** The entry for `key` at `mark`: stored, being built, or built now by `build()` (which serialises). */
  obtain(key: string, mark: string, build: () => Promise<string>): Promise<Entry> {
    const stored = this.get(key, mark);
    if (stored) {
      this.hits++;
      return Promise.resolve(stored);
    }
    const flight = `${mark}\u0000${key}`;
    const pending = this.building.get(flight);
    if (pending) {
      this.hits++;
      return pending;
    }
    this.misses++;
    const made = build().then((json) => this.set(key, mark, json));
    this.building.set(flight, made);
    const done = () => { this.building.delete(flight); };
    made.then(done, done);
    return made;
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

const serialise = (value: unknown) => (value instanceof RawJson ? value.text : JSON.stringify(value));

/** Sends a stored entry: 304 when the client holds it, else its gzipped copy when accepted, else the JSON. */
function sendEntry(req: Request, res: Response, entry: Entry): void {
  // The ETag set here spares Express hashing the body again (and answers If-None-Match with 304).
  res.set('Cache-Control', 'private, max-age=0');
  res.set('ETag', entry.etag);
  if (entry.gzipped) res.vary('Accept-Encoding');
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  res.type('application/json');
  if (entry.gzipped && req.acceptsEncodings('gzip', 'identity') === 'gzip') {
    res.set('Content-Encoding', 'gzip');
    res.send(entry.gzipped);
  } else {
    res.send(entry.body);
  }
}

/**
 * Answers a signed-in GET with `build()`'s JSON, from the cache when the data mark has not moved
 * since it was built. Without a data mark (no guard ran) it just builds. `variant` names anything
 * else the response is built from that could differ between two requests with the same user, URL
 * and mark (e.g. the running engine's version).
 */
export async function sendCachedJson(cache: ReadCache, req: Request, res: Response, build: () => Promise<unknown>, variant = ''): Promise<void> {
  const mark = req.dataMark;
  const user = req.user;
  if (!mark || !user) {
    const value = await build();
    if (value instanceof RawJson) res.type('application/json').send(value.text);
    else res.json(value);
    return;
  }
  const key = `${user.id}\u0000${user.role}\u0000${variant}\u0000${req.originalUrl}`;
  sendEntry(req, res, await cache.obtain(key, mark, async () => serialise(await build())));
}
