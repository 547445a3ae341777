import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

import { describe, expect, it } from 'vitest';

import { type Body, validateBody } from '../../shared/contracts/body.ts';
import { deLevaRow } from './reference-tables.ts';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** Runs `npx tsx server/cli/body.ts ARGS` from the project root. */
function body(...args: string[]) {
  const r = spawnSync('npx', ['tsx', 'server/cli/body.ts', ...args], { cwd: ROOT, encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** The CLI's output, checked against the body contract. */
function validBody(stdout: string): Body {
  const checked = validateBody(JSON.parse(stdout));
  if (!checked.ok) throw new Error(`not a valid body: ${JSON.stringify(checked.issues)}`);
  return checked.value;
}

describe('npm run body', () => {
  it('prints only contract JSON that validates, with de Leva (1996) Table 4 mass fractions', () => {
    const r = body('--sex', 'female', '--stature', '1.68', '--mass', '61');
    expect(r.code).toBe(0);
    const json = validBody(r.stdout);
    const thigh = json.segments.find((s) => s.name === 'l_thigh')!;
    // the published female fractions sum to 0.9999: each is divided by that sum (residue in proportion)
    expect(thigh.mass / 61).toBeCloseTo(deLevaRow('female', 'thigh').mass / 0.9999, 12);
    const total = json.segments.reduce((sum, s) => sum + s.mass, 0);
    expect(Math.abs(total / 61 - 1)).toBeLessThanOrEqual(1e-9);
  });

  it('--suit adds the suit; --lengths replaces a segment length', () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'hn-body-'));
    const file = path.join(dir, 'lengths.json');
    writeFileSync(file, JSON.stringify({ shank: 0.45 }));
    const r = body('--sex', 'male', '--stature', '1.8', '--mass', '80', '--suit', 'pressurised-suit', '--lengths', file);
    expect(r.code).toBe(0);
    const json = validBody(r.stdout);
    expect(json.name).toMatch(/Pressurised suit/);
    expect(json.segments.find((s) => s.name === 'r_foot')?.joint?.origin[2]).toBeCloseTo(-0.45, 12);
  });

  it('--help prints usage and exits 0', () => {
    const r = body('--help');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/--sex female\|male/);
  });

  it('a missing --mass gets a clear message on stderr, nothing on stdout, non-zero exit', () => {
    const r = body('--sex', 'male', '--stature', '1.8');
    expect(r.code).not.toBe(0);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/--mass is required/);
  });

  it('an out-of-range stature names the flag', () => {
    const r = body('--sex', 'male', '--stature', '18', '--mass', '80');
    expect(r.code).not.toBe(0);
    expect(r.stderr).toMatch(/--stature: stature must be at most 2.3 m/);
  });

  it('a non-number, an unknown suit and an unknown option are rejected', () => {
    expect(body('--sex', 'male', '--stature', 'tall', '--mass', '80').stderr).toMatch(/--stature: "tall" is not a number/);
    expect(body('--sex', 'male', '--stature', '1.8', '--mass', '80', '--suit', 'nope').stderr).toMatch(/unknown suit "nope"/);
    const r = body('--sex', 'male', '--stature', '1.8', '--mass', '80', '--colour', 'red');
    expect(r.code).not.toBe(0);
    expect(r.stderr).toMatch(/--colour/);
  });

  it('a lengths file that is not JSON names the file', () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'hn-body-'));
    const file = path.join(dir, 'bad.json');
    writeFileSync(file, '{thigh: 0.4');
    const r = body('--sex', 'male', '--stature', '1.8', '--mass', '80', '--lengths', file);
    expect(r.code).not.toBe(0);
    expect(r.stderr).toMatch(/bad\.json" is not valid JSON/);
  });
});
