/**
 * Acceptance: a maneuver composed from primitives and verified through the API reports the same
 * final attitude as `npm run simulate` (the CLI, run as a user would) on the same compiled steps
 * and the bound profile's body; the stored inputs hash reproduces from those two files.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

import { eq } from 'drizzle-orm';
import { expect, it } from 'vitest';

import { profileVersions } from '../../db/schema/index.ts';
import { canonicalJson } from '../../server/maneuvers/inputs-hash.ts';
import type { VersionDetail } from '../../shared/contracts/maneuver.ts';
import { simulationResultSchema } from '../../shared/contracts/result.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { as, createSequence, crewOf, PEOPLE, saveVersion, THREE_STEPS } from './maneuver-api.ts';

const root = fileURLToPath(new URL('../../', import.meta.url).href);
const t = testAppForFile();

it('the API report and the simulate CLI agree on the final attitude (≤ 1e-9 rad) for the same steps and body', async () => {
  const crew = await crewOf(t, PEOPLE.otherTrainee);
  const sequenceId = await createSequence(t, crew, 'Acceptance check');
  const primitives = [...THREE_STEPS, { kind: 'hip_swirl' as const, halfAngleDeg: 12, centreFlexDeg: 20, turn: 'to_right' as const, cycles: 2, periodS: 2 }];
  const saved = await saveVersion(t, sequenceId, 0, PEOPLE.planner, primitives);
  expect(saved.status).toBe(201);
  const v = bodyOf<VersionDetail>(await as(t, PEOPLE.planner).get(`/sequences/versions/${bodyOf<VersionDetail>(saved).id}`));
  const report = v.report!;
  const [pv] = await t.ctx.db.select().from(profileVersions).where(eq(profileVersions.id, v.profileVersionId));

  const dir = mkdtempSync(join(tmpdir(), 'hn-accept-'));
  writeFileSync(join(dir, 'body.json'), JSON.stringify(pv.body));
  writeFileSync(join(dir, 'sequence.json'), JSON.stringify(v.compiled));
  const cli = spawnSync(process.execPath, ['--import', 'tsx', join(root, 'server/cli/simulate.ts'), join(dir, 'body.json'), join(dir, 'sequence.json'), '--rate', '20'], { cwd: root, encoding: 'utf8' });
  expect(cli.stderr).toBe('');
  expect(cli.status).toBe(0);
  const result = simulationResultSchema.parse(JSON.parse(cli.stdout));

  const q = (a: { w: number; x: number; y: number; z: number }) => [a.w, a.x, a.y, a.z];
  expect(quatAngleBetween(q(result.final.attitude), q(report.final.attitude))).toBeLessThan(1e-9);
  expect(result.final.yprDeg.yaw).toBeCloseTo(report.final.yprDeg.yaw, 6);
  expect(result.duration).toBeCloseTo(report.durationS, 9);
  expect(result.engineVersion).toBe(v.engineVersion);
  // The maneuver really turns the body (the comparison is not between two identities).
  expect(report.final.rotation.angleDeg).toBeGreaterThan(1);

  // sha256 (node:crypto) of the canonical JSON of exactly these inputs is the stored hash.
  const body: unknown = JSON.parse(readFileSync(join(dir, 'body.json'), 'utf8'));
  const sequence: unknown = JSON.parse(readFileSync(join(dir, 'sequence.json'), 'utf8'));
  expect(createHash('sha256').update(canonicalJson({ body, sequence })).digest('hex')).toBe(v.inputsHash);
}, 120_000);
