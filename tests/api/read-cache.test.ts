/**
 * The read cache's delivery (server/http/read-cache.ts): a cached body is gzipped once and sent
 * only to clients that accept gzip (HTTP content negotiation, RFC 9110 §12.5.3), concurrent misses
 * build once, and the 3D player's motion, now served through it, never outlives a write. Also the
 * session-token memo (server/auth/tokens.ts): a remembered token still expires on time.
 */
import { once } from 'node:events';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { gunzipSync } from 'node:zlib';

import { eq } from 'drizzle-orm';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';

import { sequenceVersions } from '../../db/schema/index.ts';
import { TokenService } from '../../server/auth/tokens.ts';
import { ReadCache } from '../../server/http/read-cache.ts';
import type { SequenceListItem } from '../../shared/contracts/maneuver.ts';
import type { MotionResponse } from '../../shared/contracts/motion.ts';
import { PEOPLE } from '../maneuvers/maneuver-api.ts';
import { crewMemberOf, insertProfileVersion, insertVersion } from '../rehearse/rehearsal-fixture.ts';
import { startTestApp, type TestApp } from '../support/test-app.ts';

let t: TestApp;
let server: http.Server;
let port: number;
beforeAll(async () => {
  t = await startTestApp();
  server = http.createServer(t.app).listen(0, '127.0.0.1');
  await once(server, 'listening');
  port = (server.address() as AddressInfo).port;
}, 120_000);
afterAll(async () => {
  server?.close();
  await t?.close();
});

/** A GET with node's own client, which (unlike supertest and fetch) neither asks for nor undoes compression. */
async function raw(path: string, email: string, headers: Record<string, string> = {}) {
  const token = await t.tokenForEmail(email);
  return new Promise<{ status: number; headers: http.IncomingHttpHeaders; body: Buffer }>((resolve, reject) => {
    http.get({ host: '127.0.0.1', port, path: `/api${path}`, headers: { authorization: `Bearer ${token}`, ...headers } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    }).on('error', reject);
  });
}

describe('compressed cached reads', () => {
  it('gzips the maneuver list for a client that accepts gzip; the same JSON uncompressed otherwise', async () => {
    const plain = await raw('/sequences', PEOPLE.planner);
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    const zipped = await raw('/sequences', PEOPLE.planner, { 'accept-encoding': 'gzip, deflate, br' });
    expect(zipped.status).toBe(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.headers.vary).toMatch(/accept-encoding/i);
    expect(zipped.body.length).toBeLessThan(plain.body.length / 3);
    // Inflated by node's zlib, the gzipped copy is byte for byte the uncompressed body.
    expect(gunzipSync(zipped.body).equals(plain.body)).toBe(true);
    const list = (JSON.parse(plain.body.toString('utf8')) as { sequences: SequenceListItem[] }).sequences;
    expect(list.length).toBeGreaterThan(0);
    // Same representation, same (weak) validator: a revalidation with it answers 304 either way.
    expect(zipped.headers.etag).toBe(plain.headers.etag);
    const again = await raw('/sequences', PEOPLE.planner, { 'accept-encoding': 'gzip', 'if-none-match': String(plain.headers.etag) });
    expect(again.status).toBe(304);
  });

  it('sends identity to a client that refuses gzip (q=0) or asks for an encoding it does not have', async () => {
    for (const ae of ['gzip;q=0, identity', 'br', 'identity']) {
      const res = await raw('/sequences', PEOPLE.planner, { 'accept-encoding': ae });
      expect(res.status, ae).toBe(200);
      expect(res.headers['content-encoding'], ae).toBeUndefined();
      expect(() => JSON.parse(res.body.toString('utf8')) as unknown, ae).not.toThrow();
    }
  });

  it('leaves a small body uncompressed (below 1 KiB, the compression package’s default threshold)', async () => {
    const cache = new ReadCache();
    const entry = await cache.obtain('k', 'm', () => Promise.resolve('{"ok":true}'));
    expect(entry.gzipped).toBeNull();
    const big = await cache.obtain('k2', 'm', () => Promise.resolve(JSON.stringify({ items: Array.from({ length: 200 }, (_, i) => ({ i, name: `item ${i}` })) })));
    expect(gunzipSync(big.gzipped!).equals(big.body)).toBe(true);
  });
});

/** A build that takes a few milliseconds (so concurrent misses overlap) and counts its calls. */
function slowBuild(ms: number, finish: (calls: number) => string) {
  const count = { calls: 0 };
  const build = async () => {
    count.calls++;
    await new Promise((r) => setTimeout(r, ms));
    return finish(count.calls);
  };
  return { build, count };
}

describe('concurrent misses', () => {
  it('build once per key and data mark; a new mark builds again', async () => {
    const cache = new ReadCache();
    const { build, count } = slowBuild(20, (n) => JSON.stringify({ n }));
    const first = await Promise.all(Array.from({ length: 10 }, () => cache.obtain('list', '0/1', build)));
    expect(count.calls).toBe(1);
    expect(new Set(first).size).toBe(1);
    await cache.obtain('list', '0/1', build);
    expect(count.calls).toBe(1);
    const next = await cache.obtain('list', '0/2', build);
    expect(count.calls).toBe(2);
    expect(next.body.toString()).toBe('{"n":2}');
  });

  it('share a failed build’s error and keep nothing', async () => {
    const cache = new ReadCache();
    const { build: failing, count } = slowBuild(5, () => {
      throw new Error('not found');
    });
    const results = await Promise.allSettled(Array.from({ length: 5 }, () => cache.obtain('x', 'm', failing)));
    expect(results.every((r) => r.status === 'rejected')).toBe(true);
    expect(count.calls).toBe(1);
    expect(cache.size).toBe(0);
    await expect(cache.obtain('x', 'm', () => Promise.resolve('{}'))).resolves.toMatchObject({ mark: 'm' });
  });
});

describe('the motion through the read cache', () => {
  it('serves the cached motion until a write, then applies the trainee rule to the new status', async () => {
    const reed = await crewMemberOf(t.ctx.db, PEOPLE.trainee);
    const pv = await insertProfileVersion(t.ctx.db, reed);
    const id = await insertVersion(t.ctx.db, { crewMemberId: reed, profileVersionId: pv, status: 'cleared', name: 'Cache check sweep' });
    const a = await raw(`/motion/${id}`, PEOPLE.trainee);
    expect(a.status).toBe(200);
    const b = await raw(`/motion/${id}`, PEOPLE.trainee, { 'accept-encoding': 'gzip' });
    expect(b.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(b.body).equals(a.body)).toBe(true);
    expect((JSON.parse(a.body.toString('utf8')) as MotionResponse).status).toBe('cleared');
    // A profile change sends the version to re-check (written here as a worker would): the next read refuses it.
    await t.ctx.db.update(sequenceVersions).set({ status: 'recheck' }).where(eq(sequenceVersions.id, id));
    const c = await raw(`/motion/${id}`, PEOPLE.trainee);
    expect(c.status).toBe(403);
    // Staff still see it, with the new status.
    const d = await raw(`/motion/${id}`, PEOPLE.reviewer);
    expect(d.status).toBe(200);
    expect((JSON.parse(d.body.toString('utf8')) as MotionResponse).status).toBe('recheck');
  });
});

describe('remembered session tokens', () => {
  afterEach(() => {
    vi.useRealTimers();
  });

  it('a token verified once is refused after its expiry, and a tampered one is never accepted', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date('2026-01-01T00:00:00Z'));
    const tokens = new TokenService('a-secret-that-is-long-enough-0123456789abc', '60s');
    const token = await tokens.issue({ sub: '00000000-0000-4000-8000-000000000001', role: 'planner', tv: 1 });
    expect(await tokens.verify(token)).toEqual({ sub: '00000000-0000-4000-8000-000000000001', role: 'planner', tv: 1 });
    vi.setSystemTime(new Date('2026-01-01T00:00:59Z'));
    expect(await tokens.verify(token)).not.toBeNull();
    // RFC 7519 §4.1.4: not accepted on or after `exp` (issued at 00:00:00 + 60 s).
    vi.setSystemTime(new Date('2026-01-01T00:01:00Z'));
    expect(await tokens.verify(token)).toBeNull();
    expect(await tokens.verify(token)).toBeNull();
    // The signature's last character changed: refused, however often it is sent.
    const tampered = token.slice(0, -2) + (token.at(-2) === 'A' ? 'B' : 'A') + token.at(-1);
    vi.setSystemTime(new Date('2026-01-01T00:00:10Z'));
    expect(await tokens.verify(tampered)).toBeNull();
    expect(await tokens.verify(tampered)).toBeNull();
  });
});
