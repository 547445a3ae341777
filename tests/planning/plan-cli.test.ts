/**
 * `npm run plan`, run as a user would (tsx in a child process): JSON only on stdout in the issue's
 * shape, each candidate's `sequence` accepted by `npm run simulate` as it is and reaching the
 * target there; bad flags get a message naming the flag, a non-zero exit and nothing on stdout.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

import { describe, expect, it } from 'vitest';

import { targetQuat } from '../../server/maneuvers/target-attitude.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { planCandidateSchema } from '../../shared/contracts/plan.ts';
import { simulationResultSchema } from '../../shared/contracts/result.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { demoBody } from './planner-bodies.ts';

const root = fileURLToPath(new URL('../../', import.meta.url).href);
const run = (script: string, ...args: string[]) =>
  spawnSync(process.execPath, ['--import', 'tsx', join(root, script), ...args], { cwd: root, encoding: 'utf8' });
const dir = mkdtempSync(join(tmpdir(), 'holonaut-plan-'));
const bodyFile = join(dir, 'suited.json');
writeFileSync(bodyFile, JSON.stringify(demoBody('kettle')));

describe('npm run plan', () => {
  it('prints ranked candidates whose sequences npm run simulate accepts and that reach the target', () => {
    const r = run('server/cli/plan.ts', bodyFile, '--axis', '0,0,1', '--angle', '90', '--candidates', '2', '--samples', '10', '--seed', '3');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { target: unknown; candidates: unknown[]; notes: string[] };
    expect(Object.keys(out).sort()).toEqual(['candidates', 'notes', 'target']);
    const candidates = out.candidates.map((c) => planCandidateSchema.parse(c));
    expect(candidates.map((c) => c.rank)).toEqual(candidates.map((_c, i) => i + 1));
    const best = candidates[0];
    expect(best.robustness.samples).toBe(10);
    expect(best.robustness.seed).toBe(3);
    const seqFile = join(dir, 'best.json');
    writeFileSync(seqFile, JSON.stringify(best.sequence));
    const sim = run('server/cli/simulate.ts', bodyFile, seqFile, '--rate', '1');
    expect(sim.status).toBe(0);
    const a = simulationResultSchema.parse(JSON.parse(sim.stdout)).final.attitude;
    const target = targetQuat(sequenceTargetSchema.parse({ mode: 'axis_angle', axisAngle: { axis: [0, 0, 1], angleDeg: 90 } }));
    expect((quatAngleBetween([a.w, a.x, a.y, a.z], target) * 180) / Math.PI).toBeLessThan(2);
  }, 180_000);

  for (const [args, flag] of [
    [['--yaw', 'ninety'], '--yaw'],
    [['--yaw', '90', '--tolerance', '-1'], '--tolerance'],
    [['--pitch', '120'], '--pitch'],
    [['--axis', '1,0', '--angle', '30'], '--axis'],
    [['--yaw', '90', '--samples', '5'], '--samples'],
    [['--yaw', '90', '--candidates', '0'], '--candidates'],
    [['--yaw', '10', '--axis', '1,0,0', '--angle', '5'], '--axis'],
    [['--yaw', '90', '--rate-limit', 'x'], '--rate-limit'],
  ] as const) {
    it(`rejects ${args.join(' ')} naming ${flag}, exit non-zero, nothing on stdout`, () => {
      const r = run('server/cli/plan.ts', bodyFile, ...args);
      expect(r.status).not.toBe(0);
      expect(r.stdout).toBe('');
      expect(r.stderr).toContain(flag);
    }, 60_000);
  }

  it('rejects a bad body naming the field', () => {
    const bad = join(dir, 'bad.json');
    const body = demoBody('reed');
    body.segments[1].mass = -1;
    writeFileSync(bad, JSON.stringify(body));
    const r = run('server/cli/plan.ts', bad, '--yaw', '90');
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/mass/);
  }, 60_000);
});
