/**
 * The web build's assets go out compressed: the build step writes .br and .gz copies
 * (server/scripts/compress-web.ts) and the server sends the one the browser accepts, with the
 * original's content type, so the sizes `npm run bench:web` reports are what a phone downloads.
 * Decompressed with Node's zlib (an implementation outside the project) and compared byte for byte.
 */
import { mkdirSync, mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';

import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { compressWebBuild } from '../../server/scripts/compress-web.ts';
import { startTestApp, type TestApp } from '../support/test-app.ts';

const web = mkdtempSync(path.join(os.tmpdir(), 'hn-web-'));
const bundle = `${'export const answer = 42; // a line of a bundle\n'.repeat(400)}`;
let t: TestApp;
let server: http.Server;

function get(url: string, acceptEncoding: string): Promise<{ status: number; headers: http.IncomingHttpHeaders; body: Buffer }> {
  const { port } = server.address() as AddressInfo;
  return new Promise((resolve, reject) => {
    http.get({ host: '127.0.0.1', port, path: url, headers: { 'accept-encoding': acceptEncoding } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    }).on('error', reject);
  });
}

beforeAll(async () => {
  mkdirSync(path.join(web, '_expo', 'static', 'js'), { recursive: true });
  writeFileSync(path.join(web, 'index.html'), '<!doctype html><title>Holonaut</title>');
  writeFileSync(path.join(web, '_expo', 'static', 'js', 'entry.js'), bundle);
  writeFileSync(path.join(web, 'favicon.ico'), Buffer.alloc(4096, 1));
  expect(compressWebBuild(web)).toBe(1);
  t = await startTestApp({ seed: false, env: { WEB_DIST: web } });
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
}, 60_000);
afterAll(async () => {
  await new Promise((r) => server.close(r));
  await t.close();
});

describe('web assets', () => {
  it('writes .br and .gz beside text assets of 1 KB or more only (not the small page, not the icon)', () => {
    expect(readdirSync(path.join(web, '_expo', 'static', 'js')).sort()).toEqual(['entry.js', 'entry.js.br', 'entry.js.gz']);
    expect(readdirSync(web).filter((f) => f.endsWith('.gz') || f.endsWith('.br'))).toEqual([]);
  });

  it('sends brotli to a browser that accepts it, as JavaScript, with the original bytes inside', async () => {
    const res = await get('/_expo/static/js/entry.js', 'gzip, deflate, br, zstd');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers.vary).toMatch(/Accept-Encoding/i);
    expect(brotliDecompressSync(res.body).toString()).toBe(bundle);
    expect(res.body.length).toBeLessThan(bundle.length / 10);
  });

  it('sends gzip to a client that accepts only gzip, and the plain file to one that accepts neither', async () => {
    const gz = await get('/_expo/static/js/entry.js', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(gz.body).toString()).toBe(bundle);
    const plain = await get('/_expo/static/js/entry.js', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body.toString()).toBe(bundle);
  });

  it('still answers client-side routes with the single page', async () => {
    const res = await get('/maneuvers/some-id', 'gzip');
    expect(res.status).toBe(200);
    expect(res.body.toString()).toContain('<title>Holonaut</title>');
  });
});
