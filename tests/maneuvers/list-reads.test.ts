/**
 * Lean list reads: the report summary PostgreSQL computes for lists (generated column
 * `report_summary`, migration 0004) agrees with summarizeReport() on every seeded report; the
 * sequence list gives each sequence briefs of its newest and rehearsable versions that agree with the
 * detail; and a cached read never outlives a write (server/http/read-cache.ts).
 */
import { eq, isNotNull } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';

import { sequences, sequenceVersions } from '../../db/schema/index.ts';
import { summarizeReport } from '../../server/maneuvers/build-report.ts';
import { type SequenceDetail, type SequenceListItem, sequenceListItemSchema, type VerificationReport, type VersionSummary } from '../../shared/contracts/maneuver.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { as, createSequence, crewOf, PEOPLE } from './maneuver-api.ts';

// Response bodies as the web client reads them.
type SequencesBody = { sequences: SequenceListItem[]; next: string | null };

const t = testAppForFile();

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
  it('gives every sequence the same name, crew member, target and briefs of the newest and rehearsable version as its detail, for staff and a trainee', async () => {
    for (const who of [PEOPLE.planner, PEOPLE.trainee]) {
      const list = bodyOf<SequencesBody>(await as(t, who).get('/sequences')).sequences;
      expect(list.length).toBeGreaterThan(0);
      for (const s of list) {
        // Lean: nothing beyond the list contract (no full summaries, reports or samples).
        expect(() => sequenceListItemSchema.strict().parse(s)).not.toThrow();
        if (s.latest) expect(Object.keys(s.latest).sort()).toEqual(['id', 'robustness', 'status', 'summary', 'version']);
        if (s.cleared) expect(Object.keys(s.cleared).sort()).toEqual(['id', 'status', 'version']);
        const d = (await as(t, who).get(`/sequences/${s.id}`)).body as SequenceDetail;
        const { latest, cleared } = d;
        expect({
          id: d.id, name: d.name, crewMemberName: d.crewMemberName, target: d.target, latest: brief(latest),
          cleared: cleared && { id: cleared.id, version: cleared.version, status: cleared.status },
        }).toEqual(s);
        // A trainee's list holds only maneuvers with something they may open.
        if (who === PEOPLE.trainee) expect(d.versions.length).toBeGreaterThan(0);
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

describe('sequence list pages and filters', () => {
  type Page = { sequences: SequenceListItem[]; next: string | null };
  const page = async (who: string, query: string) => {
    const res = await as(t, who).get(`/sequences?${query}`);
    expect(res.status, `${query}: ${JSON.stringify(res.body)}`).toBe(200);
    return bodyOf<Page>(res);
  };
  /** Every page of a query, following `next`. */
  async function allPages(who: string, query: string, limit: number) {
    const out: SequenceListItem[] = [];
    let after: string | null = null;
    let pages = 0;
    do {
      const p: Page = await page(who, `${query}&limit=${limit}${after ? `&after=${encodeURIComponent(after)}` : ''}`);
      expect(p.sequences.length).toBeLessThanOrEqual(limit);
      out.push(...p.sequences);
      after = p.next;
      pages++;
    } while (after && pages < 100);
    return { out, pages };
  }

  beforeAll(async () => {
    // Names that sort together (same name twice: the id decides) and names with LIKE's wildcards.
    const member = await crewOf(t, PEOPLE.trainee);
    for (const name of ['Twin turn', 'Twin turn', '100% roll', 'Yaw_slow', 'Yawxslow']) await createSequence(t, member, name);
  });

  it('pages of any size, followed by next, give the whole list in order, once each, for staff and a trainee', async () => {
    for (const who of [PEOPLE.planner, PEOPLE.trainee]) {
      const whole = (await page(who, '')).sequences;
      expect((await page(who, '')).next).toBeNull();
      for (const limit of [1, 2, 5, 200]) {
        const { out, pages } = await allPages(who, 'archived=false', limit);
        expect(out).toEqual(whole);
        expect(pages).toBe(Math.max(1, Math.ceil(whole.length / limit)));
      }
    }
  });

  it('search and status filters give what filtering the whole list by the same rule gives', async () => {
    const whole = (await page(PEOPLE.planner, '')).sequences;
    // The rule the list screen applied before the server did: the name or crew member's name contains the text, any case.
    const contains = (text: string) => whole.filter((s) => s.name.toLowerCase().includes(text.toLowerCase()) || s.crewMemberName.toLowerCase().includes(text.toLowerCase()));
    for (const text of ['twin', 'TAMSIN', '100%', '%', 'yaw_', '_', 'no such maneuver']) {
      const { out } = await allPages(PEOPLE.planner, `q=${encodeURIComponent(text)}`, 3);
      expect(out.map((s) => s.id), text).toEqual(contains(text).map((s) => s.id));
    }
    expect((await page(PEOPLE.planner, 'q=%25')).sequences.map((s) => s.name)).toEqual(['100% roll']);
    for (const status of ['drafting', 'cleared', 'under_review', 'recheck'] as const) {
      const { out } = await allPages(PEOPLE.planner, `status=${status}`, 4);
      expect(out.map((s) => s.id), status).toEqual(whole.filter((s) => s.latest?.status === status).map((s) => s.id));
    }
    const both = (await page(PEOPLE.planner, 'q=twin&status=drafting')).sequences;
    expect(both).toEqual(whole.filter((s) => s.name.toLowerCase().includes('twin') && s.latest?.status === 'drafting'));
  });

  it('names the field of a bad page request (400)', async () => {
    for (const [query, field] of [['limit=0', 'limit'], ['limit=201', 'limit'], ['limit=2.5', 'limit'], ['limit=x', 'limit'], ['after=garbage', 'after'],
      [`after=${Buffer.from(JSON.stringify(['a', 'not-a-uuid'])).toString('base64url')}`, 'after'], ['status=finished', 'status']] as const) {
      const res = await as(t, PEOPLE.planner).get(`/sequences?${query}`);
      expect(res.status, query).toBe(400);
      expect(apiError(res).field, query).toBe(field);
    }
  });
});
