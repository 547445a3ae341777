/**
 * Lean list reads: the report summary PostgreSQL computes for lists (generated column
 * `report_summary`, migration 0004) agrees with summarizeReport() on every seeded report, and the
 * sequence list gives each sequence its newest and rehearsable versions as the detail does.
 */
import { isNotNull } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { sequenceVersions } from '../../db/schema/index.ts';
import { summarizeReport } from '../../server/maneuvers/build-report.ts';
import type { SequenceDetail, SequenceSummary, VerificationReport } from '../../shared/contracts/maneuver.ts';
import { startTestApp, type TestApp } from '../support/test-app.ts';
import { PEOPLE, as } from './maneuver-api.ts';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
}, 120_000);
afterAll(async () => {
  await t?.close();
});

describe('report summary column', () => {
  it('equals summarizeReport() for every seeded report (two code paths that must agree)', async () => {
    const rows = await t.ctx.db.select({ report: sequenceVersions.report, summary: sequenceVersions.reportSummary }).from(sequenceVersions).where(isNotNull(sequenceVersions.report));
    expect(rows.length).toBeGreaterThan(5);
    for (const r of rows) expect(r.summary).toEqual(summarizeReport(r.report as VerificationReport));
  });

  it('is null for a version without a report and counts a malformed report as no range violations', async () => {
    const { rows } = await t.pool.query(`SELECT holonaut_report_summary(NULL) AS a, holonaut_report_summary('"x"'::jsonb) AS b, holonaut_report_summary('{"durationS": 2}'::jsonb) AS c`);
    expect(rows[0].a).toBeNull();
    expect(rows[0].b).toBeNull();
    expect(rows[0].c).toMatchObject({ durationS: 2, rangeViolationCount: 0 });
  });
});

describe('sequence list', () => {
  it('gives every sequence the same count, newest and rehearsable version as its detail, for staff and a trainee', async () => {
    for (const who of [PEOPLE.planner, PEOPLE.trainee]) {
      const list = (await as(t, who).get('/sequences')).body.sequences as SequenceSummary[];
      expect(list.length).toBeGreaterThan(0);
      for (const s of list) {
        const d = (await as(t, who).get(`/sequences/${s.id}`)).body as SequenceDetail;
        const { versions, ...head } = d;
        expect(head).toEqual(s);
        expect(s.versionCount).toBe(versions.length);
      }
    }
  });
});
