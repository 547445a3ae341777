/**
 * Lean list reads: the report summary PostgreSQL computes for lists (generated column
 * `report_summary`, migration 0004) agrees with summarizeReport() on every seeded report; the
 * sequence list gives each sequence briefs of its newest and rehearsable versions that agree with the
 * detail; and a cached read never outlives a write (server/http/read-cache.ts).
 */
import { eq, isNotNull } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { sequences, sequenceVersions } from '../../db/schema/index.ts';
import { summarizeReport } from '../../server/maneuvers/build-report.ts';
import { type SequenceDetail, type SequenceListItem, sequenceListItemSchema, type VerificationReport, type VersionSummary } from '../../shared/contracts/maneuver.ts';
import { bodyOf } from '../support/response-body.ts';
import { startTestApp, type TestApp } from '../support/test-app.ts';
import { as, PEOPLE } from './maneuver-api.ts';

// Response bodies as the web client reads them.
type SequencesBody = { sequences: SequenceListItem[] };

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
    const { rows } = await t.pool.query<{ a: unknown; b: unknown; c: unknown }>(`SELECT holonaut_report_summary(NULL) AS a, holonaut_report_summary('"x"'::jsonb) AS b, holonaut_report_summary('{"durationS": 2}'::jsonb) AS c`);
    expect(rows[0].a).toBeNull();
    expect(rows[0].b).toBeNull();
    expect(rows[0].c).toMatchObject({ durationS: 2, rangeViolationCount: 0 });
  });
});

/** The list's brief of a full version summary. */
function brief(v: VersionSummary | null) {
  if (!v) return null;
  const m = v.summary;
  return {
    id: v.id, version: v.version, status: v.status,
    summary: m ? { durationS: m.durationS, targetErrorDeg: m.targetErrorDeg, withinTolerance: m.withinTolerance, rangeViolationCount: m.rangeViolationCount } : null,
    robustness: v.robustness,
  };
}

describe('sequence list', () => {
  it('gives every sequence the same count and briefs of the newest and rehearsable version as its detail, for staff and a trainee', async () => {
    for (const who of [PEOPLE.planner, PEOPLE.trainee]) {
      const list = bodyOf<SequencesBody>(await as(t, who).get('/sequences')).sequences;
      expect(list.length).toBeGreaterThan(0);
      for (const s of list) {
        // Lean: nothing beyond the list contract (no full summaries, reports or samples).
        expect(() => sequenceListItemSchema.strict().parse(s)).not.toThrow();
        for (const v of [s.latest, s.cleared]) if (v) expect(Object.keys(v).sort()).toEqual(['id', 'robustness', 'status', 'summary', 'version']);
        const d = (await as(t, who).get(`/sequences/${s.id}`)).body as SequenceDetail;
        const { versions, latest, cleared, ...head } = d;
        expect({ ...head, latest: brief(latest), cleared: brief(cleared) }).toEqual(s);
        expect(s.versionCount).toBe(versions.length);
      }
    }
  });

  it('a cached list shows a write made on another connection (as a job worker would) at the next read', async () => {
    const first = bodyOf<SequencesBody>(await as(t, PEOPLE.planner).get('/sequences')).sequences;
    const again = await as(t, PEOPLE.planner).get('/sequences');
    expect(bodyOf<SequencesBody>(again).sequences).toEqual(first);
    const target = first[0];
    await t.pool.query('UPDATE sequences SET name = $1 WHERE id = $2', [`${target.name} (renamed elsewhere)`, target.id]);
    const after = bodyOf<SequencesBody>(await as(t, PEOPLE.planner).get('/sequences')).sequences;
    expect(after.find((s) => s.id === target.id)?.name).toBe(`${target.name} (renamed elsewhere)`);
    await t.ctx.db.update(sequences).set({ name: target.name }).where(eq(sequences.id, target.id));
    const restored = bodyOf<SequencesBody>(await as(t, PEOPLE.planner).get('/sequences')).sequences;
    expect(restored.find((s) => s.id === target.id)?.name).toBe(target.name);
  });
});
