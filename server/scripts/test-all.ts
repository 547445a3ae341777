/**
 * `npm test`: every check the project has, in one run, ending with the plain line
 * `N passed, N failed` that sums them. Exits non-zero on any failure.
 *   1. typecheck (tsc --noEmit) and lint (eslint), one check each;
 *   2. unit and integration tests (vitest, real PostgreSQL in a throwaway cluster);
 *   3. web build (expo export) and sign-in's first-load budget (tests/bench/web.ts), then browser e2e
 *      (Playwright in Debian's Chromium).
 * Installs Debian's chromium and poppler-utils with apt-get when missing (never a downloaded browser).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

import { ensurePostgresBinaries } from './postgres-cluster.ts';
import { ensureWebBuild } from './web-build.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const reports = path.join(root, 'test-results');
mkdirSync(reports, { recursive: true });

let passed = 0;
let failed = 0;
const lines: string[] = [];
const record = (name: string, p: number, f: number) => {
  passed += p;
  failed += f;
  lines.push(`${name.padEnd(12)} ${p} passed, ${f} failed`);
};

function run(cmd: string, args: string[], env: Record<string, string> = {}): number {
  console.log(`\n$ ${cmd} ${args.join(' ')}`);
  const res = spawnSync(cmd, args, { cwd: root, stdio: 'inherit', env: { ...process.env, ...env } });
  return res.status ?? 1;
}

/** Installs Debian packages whose program is missing: chromium (e2e) and poppler-utils (pdftotext reads cue cards). */
function ensureDebianTools() {
  const wanted = [
    { program: '/usr/bin/chromium', pkg: 'chromium' },
    { program: '/usr/bin/pdftotext', pkg: 'poppler-utils' },
  ].filter((t) => !existsSync(t.program));
  if (!wanted.length) return;
  const pkgs = wanted.map((t) => t.pkg);
  if (process.getuid?.() !== 0) throw new Error(`Missing Debian packages: sudo apt-get install -y ${pkgs.join(' ')}`);
  console.log(`Installing Debian ${pkgs.join(', ')} (apt-get)…`);
  const env = { DEBIAN_FRONTEND: 'noninteractive' };
  if (run('apt-get', ['update', '-qq'], env) !== 0 || run('apt-get', ['install', '-y', '-qq', ...pkgs], env) !== 0) {
    throw new Error(`apt-get install ${pkgs.join(' ')} failed`);
  }
}

interface VitestJson { numPassedTests: number; numFailedTests: number; numTotalTests: number }
interface PlaywrightJson { stats: { expected: number; unexpected: number; flaky: number; skipped: number } }

ensurePostgresBinaries((s) => console.log(s));
ensureDebianTools();

const ok = (code: number) => (code === 0 ? 1 : 0);
const typecheck = run('npx', ['tsc', '--noEmit', '-p', '.']);
record('typecheck', ok(typecheck), 1 - ok(typecheck));
const lint = run('npx', ['eslint', '.', '--max-warnings=0']);
record('lint', ok(lint), 1 - ok(lint));

const vitestOut = path.join(reports, 'vitest.json');
rmSync(vitestOut, { force: true });
const vitestCode = run('npx', ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${vitestOut}`]);
if (existsSync(vitestOut)) {
  const v = JSON.parse(readFileSync(vitestOut, 'utf8')) as VitestJson;
  // A suite that failed to load counts as a failure even when no test in it ran.
  record('vitest', v.numPassedTests, v.numFailedTests + (vitestCode !== 0 && v.numFailedTests === 0 ? 1 : 0));
} else record('vitest', 0, 1);

let built = true;
try {
  ensureWebBuild(root, path.join(root, 'dist', 'web'), (s) => console.log(s));
} catch (err) {
  console.error((err as Error).message);
  built = false;
}
record('web build', built ? 1 : 0, built ? 0 : 1);
if (built) {
  // Sign-in's first load stays within its budget of gzipped JavaScript (npm run bench:web fails over it).
  const budget = run('npx', ['tsx', 'tests/bench/web.ts']);
  record('web budget', ok(budget), 1 - ok(budget));
}

const e2eOut = path.join(reports, 'e2e-report.json');
rmSync(e2eOut, { force: true });
if (built) {
  const e2eCode = run('npx', ['playwright', 'test'], { PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1' });
  if (existsSync(e2eOut)) {
    const s = (JSON.parse(readFileSync(e2eOut, 'utf8')) as PlaywrightJson).stats;
    record('e2e', s.expected + s.flaky, s.unexpected + (e2eCode !== 0 && s.unexpected === 0 ? 1 : 0));
  } else record('e2e', 0, 1);
}

console.log('\nSummary');
for (const l of lines) console.log(`  ${l}`);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
