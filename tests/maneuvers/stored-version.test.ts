/**
 * The one reader of stored versions: targets read as the attitude they ask for (closed-form
 * quaternions), compiled steps in both stored shapes, and a stored value that does not parse is a
 * 500 naming the version and the column, logged — never a default.
 */
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { sequenceVersions } from '../../db/schema/index.ts';
import { readAcknowledgedFailures, readReportSummary, readStoredCompiled, readVersionTarget, UnreadableStoredValue } from '../../server/maneuvers/stored-version.ts';
import { targetAttitude } from '../../server/maneuvers/target-attitude.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { targetWords } from '../../shared/product/target-words.ts';
import { ARM_SWEEP, crewMemberOf, insertProfileVersion, insertVersion } from '../rehearse/rehearsal-fixture.ts';
import { logLines } from '../support/log-lines.ts';
import { apiError } from '../support/response-body.ts';
import { startTestApp, type TestApp } from '../support/test-app.ts';

const target = (t: unknown) => sequenceTargetSchema.parse(t);
// Closed form: a rotation by θ about unit axis n is (cos θ/2, n sin θ/2).
const c = (deg: number) => Math.cos((deg * Math.PI) / 360);
const s = (deg: number) => Math.sin((deg * Math.PI) / 360);

describe('target attitude', () => {
  it('reads a yaw/pitch/roll target: yaw 90° is (cos 45°, 0, 0, sin 45°)', () => {
    const q = targetAttitude(target({ mode: 'ypr', yprDeg: { yaw: 90, pitch: 0, roll: 0 } }));
    expect(q.w).toBeCloseTo(c(90), 14);
    expect(q.z).toBeCloseTo(s(90), 14);
  });

  it('reads an axis-angle target with an unnormalised axis: 120° about (1,1,1) is (½, ½, ½, ½)', () => {
    const q = targetAttitude(target({ mode: 'axis_angle', axisAngle: { axis: [2, 2, 2], angleDeg: 120 } }));
    for (const v of [q.w, q.x, q.y, q.z]) expect(v).toBeCloseTo(0.5, 14);
  });

  it('composes yaw then pitch (z-y′-x″): yaw 90°, pitch 90° equals q_z(90°) ⊗ q_y(90°) = (½, −½, ½, ½)', () => {
    const q = targetAttitude(target({ mode: 'ypr', yprDeg: { yaw: 90, pitch: 90, roll: 0 } }));
    expect([q.w, q.x, q.y, q.z].map((v) => Math.round(v * 1e12) / 1e12)).toEqual([0.5, -0.5, 0.5, 0.5]);
  });

  it('gives a unit attitude with w ≥ 0 for a half turn: yaw −180° is (0, 0, 0, ±1)', () => {
    const q = targetAttitude(target({ mode: 'ypr', yprDeg: { yaw: -180, pitch: 0, roll: 0 } }));
    expect(q.w).toBeGreaterThanOrEqual(0);
    expect(Math.abs(q.z)).toBeCloseTo(1, 14);
    expect(Math.hypot(q.w, q.x, q.y, q.z)).toBeCloseTo(1, 14);
  });

  it('words targets in whole degrees', () => {
    expect(targetWords(target({ mode: 'ypr', yprDeg: { yaw: -39.04, pitch: 0, roll: 1 } }))).toBe('yaw -39°, pitch 0°, roll 1°');
    expect(targetWords(target({ mode: 'axis_angle', axisAngle: { axis: [0, 0, 1], angleDeg: 45 } }))).toBe('45° about [0, 0, 1]');
    // on screen with a typographic minus; −0.4° rounds to 0°, not −0°
    expect(targetWords(target({ mode: 'axis_angle', axisAngle: { axis: [0, -0.7071, 0.7071], angleDeg: 30.4 } }), '\u2212')).toBe('30° about [0, \u22120.71, 0.71]');
    expect(targetWords(target({ mode: 'ypr', yprDeg: { yaw: -0.4, pitch: -20, roll: 0 } }), '\u2212')).toBe('yaw 0°, pitch \u221220°, roll 0°');
  });
});

describe('reading stored values', () => {
  const id = '00000000-0000-4000-8000-000000000001';

  it('reads compiled steps stored bare (no cues, no step map) and wrapped with cues and a step map', () => {
    expect(readStoredCompiled(id, ARM_SWEEP)).toEqual({ sequence: ARM_SWEEP, cues: [], stepMap: [] });
    const stepMap = [{ primitive: 0, role: 'sweep', startS: 0, endS: 1 }];
    const one = { start: {}, steps: [{ kind: 'hold', duration: 1 }] };
    expect(readStoredCompiled(id, { sequence: one, cues: ['hold still for 1 s'], stepMap })).toEqual({ sequence: one, cues: ['hold still for 1 s'], stepMap });
  });

  it('names the version, the column and the path of a step it cannot read', () => {
    const read = () => readStoredCompiled(id, { sequence: { start: {}, steps: [{ kind: 'twirl' }] } });
    expect(read).toThrow(UnreadableStoredValue);
    expect(read).toThrow(expect.objectContaining({ status: 500, code: 'stored_value_unreadable' }));
    expect(read).toThrow(new RegExp(`compiled steps of sequence version ${id} .*sequence\\.steps\\.0\\.kind`));
  });

  it('never reads a bare { yaw } as a target (it used to become yaw/pitch/roll 0 for anything unreadable)', () => {
    expect(() => readVersionTarget(id, { yaw: 90 })).toThrow(/target of sequence version/);
    expect(() => readVersionTarget(id, null)).toThrow(UnreadableStoredValue);
  });

  it('reads a report summary and acknowledged failures as lists show them; null before there are any; an unknown check is an error', () => {
    const summary = { durationS: 4, targetErrorDeg: 0.4, withinTolerance: true, yprDeg: { yaw: 0, pitch: -20, roll: 0 }, rangeViolationCount: 0, peakJointRateDegS: 80, withinRateLimit: true, withinTimeBudget: true };
    expect(readReportSummary(id, summary)).toEqual(summary);
    expect(readReportSummary(id, null)).toBeNull();
    expect(() => readReportSummary(id, { ...summary, withinTolerance: 'yes' })).toThrow(new RegExp(`report summary of sequence version ${id} .*withinTolerance`));
    expect(readAcknowledgedFailures(id, [{ check: 'rate', message: 'peak 130°/s over 120°/s' }])).toEqual([{ check: 'rate', message: 'peak 130°/s over 120°/s' }]);
    expect(readAcknowledgedFailures(id, null)).toBeNull();
    expect(() => readAcknowledgedFailures(id, [{ check: 'mood', message: 'x' }])).toThrow(new RegExp(`acknowledged failures of sequence version ${id} .*0\\.check`));
  });
});

describe('a version whose stored target cannot be read', () => {
  const TAMSIN = 'tamsin.reed@lumen.example.test';
  const { lines, destination } = logLines();
  let t: TestApp;
  let broken: string;
  beforeAll(async () => {
    t = await startTestApp({ env: { LOG_LEVEL: 'warn' }, logDestination: destination });
    const reed = await crewMemberOf(t.ctx.db, TAMSIN);
    const pv = await insertProfileVersion(t.ctx.db, reed);
    const good = await insertVersion(t.ctx.db, { crewMemberId: reed, profileVersionId: pv, status: 'drafting', name: 'Broken target (test)' });
    // Version 2 as written behind the API's back: the same steps and report, a target no schema reads (a version's target never changes once written).
    const [{ id: _id, version: _version, reportSummary: _summary, ...v1 }] = await t.ctx.db.select().from(sequenceVersions).where(eq(sequenceVersions.id, good));
    [{ id: broken }] = await t.ctx.db.insert(sequenceVersions)
      .values({ ...v1, version: 2, target: { yaw: 'ninety' } as never, status: 'cleared', clearedAt: new Date() })
      .returning({ id: sequenceVersions.id });
  }, 60_000);
  afterAll(async () => {
    await t?.close();
  });
  const get = async (email: string, path: string) => request(t.app).get(path).set('Authorization', `Bearer ${await t.tokenForEmail(email)}`);

  it('answers the version detail, the player and the rehearsal list with a 500 naming the version and its target, and logs it', async () => {
    for (const [email, path] of [['juno.brack@lumen.example.test', `/api/sequences/versions/${broken}`], [TAMSIN, `/api/motion/${broken}`], [TAMSIN, '/api/rehearsals/available']]) {
      const res = await get(email, path);
      expect(res.status, path).toBe(500);
      expect(apiError(res)).toMatchObject({ code: 'stored_value_unreadable' });
      expect(apiError(res).message).toContain(`target of sequence version ${broken}`);
    }
    expect(lines.some((l) => l.includes('"level":50') && l.includes(broken))).toBe(true);
  });
});
