/** The simulate CLI, run as a user would (tsx in a child process). */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

import { describe, expect, it } from 'vitest';

import { simulate } from '../../server/engine/simulate.ts';
import { simulationResultSchema } from '../../shared/contracts/result.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { fixturePath, loadBody, loadSequence, quatOf } from './fixtures.ts';

const root = fileURLToPath(new URL('../../', import.meta.url).href);
const cli = (...args: string[]) =>
  spawnSync(process.execPath, ['--import', 'tsx', join(root, 'server/cli/simulate.ts'), ...args], { cwd: root, encoding: 'utf8' });

describe('npm run simulate', () => {
  it('prints only the result JSON on stdout, matching the in-process engine', () => {
    const r = cli(fixturePath('bodies', 'nested-chain'), fixturePath('sequences', 'nested-chain-maneuver'), '--rate', '10');
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    const result = simulationResultSchema.parse(JSON.parse(r.stdout));
    expect(result.samples.rateHz).toBe(10);
    const body = loadBody('nested-chain');
    const direct = simulate(body, loadSequence('nested-chain-maneuver', body));
    expect(quatAngleBetween(quatOf(result.final.attitude), quatOf(direct.final.attitude))).toBeLessThan(1e-12);
  });

  it('--help explains usage on stdout with exit 0', () => {
    const r = cli('--help');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/Usage: npm run simulate -- BODY\.json SEQUENCE\.json/);
  });

  it('a bad body names the file, field and reason on stderr, no stack trace, exit 1', () => {
    const dir = mkdtempSync(join(tmpdir(), 'holonaut-cli-'));
    const bad = join(dir, 'body.json');
    const body = loadBody('arm-on-trunk');
    body.segments[1].mass = -1;
    writeFileSync(bad, JSON.stringify(body));
    const r = cli(bad, fixturePath('sequences', 'arm-cone'));
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/invalid body in '.*body\.json'/);
    expect(r.stderr).toMatch(/segments\[1\]\.mass: segment 'r_upper_arm': mass: mass must be positive/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });

  it('malformed JSON, a missing file and a bad option are reported without a stack trace', () => {
    const dir = mkdtempSync(join(tmpdir(), 'holonaut-cli-'));
    const broken = join(dir, 'seq.json');
    writeFileSync(broken, '{ "steps": [ ');
    const a = cli(fixturePath('bodies', 'arm-on-trunk'), broken);
    expect(a.status).toBe(1);
    expect(a.stderr).toMatch(/sequence file '.*seq\.json' is not valid JSON/);
    const b = cli(join(dir, 'nope.json'), broken);
    expect(b.stderr).toMatch(/cannot read body file '.*nope\.json': ENOENT/);
    const c = cli(fixturePath('bodies', 'arm-on-trunk'), fixturePath('sequences', 'arm-cone'), '--rate', '1000');
    expect(c.status).toBe(2);
    expect(c.stderr).toMatch(/rateHz must be at most 240 Hz/);
    for (const r of [a, b, c]) { expect(r.stdout).toBe(''); expect(r.stderr).not.toMatch(/\n\s+at /); }
  });
});
