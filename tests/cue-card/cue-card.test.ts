/**
 * The printable cue card: content assembled from a seeded cleared version (every step's cue, the
 * target, the cautions), the download route's access rules, and the PDF itself read back with
 * poppler's pdftotext (Debian package poppler-utils), a general-purpose PDF reader outside the project.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';

import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { auditEvents, profileVersions, sequences, sequenceVersions } from '../../db/schema/index.ts';
import { DEMO_PEOPLE } from '../../db/seed/demo-people.ts';
import { cueCardContent } from '../../server/cue-card/cue-card-content.ts';
import { cueCardFileName } from '../../server/cue-card/cue-card-file-name.ts';
import { loadVersionDetail } from '../../server/maneuvers/version-detail.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import { bodySchema } from '../../shared/contracts/body.ts';
import { cueFor, leadInCue } from '../../shared/primitives/primitive-cues.ts';
import { apiError } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

const TAMSIN = 'tamsin.reed@lumen.example.test';
const BRAM = 'bram.kettle@lumen.example.test';
const PLANNER = 'orrin.vale@lumen.example.test';

const t = testAppForFile();
/** Ids of seeded versions: Reed's cleared "Cabin yaw with hip swirls", her drafting "Yaw trim…", Kettle's cleared one. */
let cleared: string, drafting: string, kettles: string;

/** The id of the seeded version of `name` in `status`. */
async function versionOf(name: string, status: 'cleared' | 'drafting'): Promise<string> {
  const [row] = await t.ctx.db.select({ id: sequenceVersions.id }).from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .where(and(eq(sequences.name, name), eq(sequenceVersions.status, status)));
  if (!row) throw new Error(`seed has no ${status} version of ${name}`);
  return row.id;
}

beforeAll(async () => {
  cleared = await versionOf('Cabin yaw with hip swirls', 'cleared');
  drafting = await versionOf('Yaw trim with right-arm loops', 'drafting');
  kettles = await versionOf('Spacewalk pitch trim with leg pedalling', 'cleared');
});

const download = async (email: string, versionId: string) =>
  request(t.app).get(`/api/sequences/versions/${versionId}/cue-card.pdf`).set('Authorization', `Bearer ${await t.tokenForEmail(email)}`)
    .buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });

/** The text of a PDF as poppler reads it (layout kept, so a row's words stay on one line). */
const pdfText = (pdf: Buffer) => execFileSync('pdftotext', ['-layout', '-', '-'], { input: pdf }).toString('utf8');

const admin: SessionUser = { id: '00000000-0000-0000-0000-000000000001', role: 'admin', name: 'Test', email: 'a@example.test', crewMemberId: null };

describe('cue card content (pure assembly from the version)', () => {
  it('lists every compiled step with its primitive’s cue, the target, the reached result and the cautions', async () => {
    const v = await loadVersionDetail(t.ctx.db, admin, cleared);
    const card = cueCardContent(v, { callSign: 'HERON' }, v.engineVersion!);
    expect(card.sequenceName).toBe('Cabin yaw with hip swirls');
    expect(card.crewMemberName).toBe('Tamsin Reed');
    expect(card.callSign).toBe('HERON');
    expect(card.statusLabel).toBe('Cleared');
    expect(card.clearedByName).toBe(DEMO_PEOPLE.find((p) => p.role === 'reviewer')!.name);
    // One printed step per composer step (DECISIONS.md "Steps"), numbered as the composer numbers them,
    // each with its primitive's cue; a joining blend is the step's short lead-in, not a step.
    expect(card.steps).toHaveLength(v.primitives.length);
    v.primitives.forEach((p, i) => {
      const first = v.stepMap.find((o) => o.primitive === i)!;
      expect(card.steps[i].number).toBe(i + 1);
      expect(card.steps[i].cue.toLowerCase()).toBe(cueFor(p).toLowerCase());
      expect(card.steps[i].startS).toBeCloseTo(first.startS, 9);
      expect(card.steps[i].leadIn !== null).toBe(first.role === 'blend');
      if (card.steps[i].leadIn) expect(card.steps[i].leadIn.toLowerCase()).toContain(leadInCue(p));
    });
    expect(v.stepMap.length).toBeGreaterThan(v.primitives.length); // the seed's version does have joining blends
    // Step times add up to the engine's duration in the stored report.
    expect(card.steps.reduce((sum, s) => sum + s.durationS, 0)).toBeCloseTo(v.report!.durationS, 6);
    // Target: the seed's yaw/pitch/roll in whole degrees.
    const target = v.sequence.target;
    if (target.mode !== 'ypr') throw new Error('seeded target is yaw/pitch/roll');
    expect(card.targetText).toBe(`yaw ${target.yprDeg.yaw}°, pitch ${target.yprDeg.pitch}°, roll ${target.yprDeg.roll}°`);
    expect(card.reached?.errorDeg).toBe(v.report!.target.errorDeg);
    expect(card.peakJointRate?.limitDegS).toBe(target.rateLimitDegS);
    // DESIGN.md "Cautions shown in the product".
    const cautions = card.cautions.join(' ');
    for (const words of ['planning and training aid', 'flight rules', 'tethering rules', 'certified procedures', 'injury risk', 'uncertainty']) {
      expect(cautions).toContain(words);
    }
    // The deciding figure is on the card: the level's sentence and the run's percentiles and seed.
    const rb = v.report!.robustness!;
    expect(rb.state).toBe('done');
    expect(card.robustness.level).toBe(rb.level);
    expect(card.robustness.sentence).toContain(`${rb.feedbackP95Deg!.toFixed(1)}°`);
    if (rb.level !== 'robust') expect(card.robustness.sentence).toMatch(/^Caution, (marginal|not robust):/);
    expect(card.robustness.figures).toContain(`seed ${rb.seed}`);
    expect(card.engineVersionShort).toBe(v.engineVersion!.split('+')[0] + '+' + v.engineVersion!.split('+')[1].slice(0, 8));
    expect(card.inputsHashShort).toBe(v.inputsHash!.slice(0, 12));
    expect(card.engineNote).toBeNull();
  });

  it('says so when the server now runs another engine than the one that verified the version, keeping the verified figures', async () => {
    const v = await loadVersionDetail(t.ctx.db, admin, cleared);
    const same = cueCardContent(v, { callSign: null }, v.engineVersion!);
    const card = cueCardContent(v, { callSign: null }, '99.0.0+0123456789abcdef');
    expect(card.engineNote).toContain(`Verified by engine ${card.engineVersionShort}.`);
    expect(card.engineNote).toContain('now runs engine 99.0.0+01234567');
    expect(card.reached).toEqual(same.reached);
    expect(card.steps).toEqual(same.steps);
  });

  it('refuses a version that is not cleared (409 not_cleared)', async () => {
    const v = await loadVersionDetail(t.ctx.db, admin, drafting);
    expect(() => cueCardContent(v, { callSign: null }, v.engineVersion!)).toThrow(expect.objectContaining({ status: 409, code: 'not_cleared' }));
  });

  it('names the file from the sequence name, with only letters, digits and hyphens', () => {
    expect(cueCardFileName('Cabin yaw with hip swirls', 1)).toBe('cabin-yaw-with-hip-swirls-v1-cue-card.pdf');
    expect(cueCardFileName('Ré-entry "drill" / A\\B;\r\n', 12)).toBe('re-entry-drill-a-b-v12-cue-card.pdf');
    expect(cueCardFileName('???', 3)).toBe('sequence-v3-cue-card.pdf');
  });
});

describe('GET /api/sequences/versions/:versionId/cue-card.pdf', () => {
  it('sends the trainee a PDF of her own cleared version that reads back with the sequence name and its cues', async () => {
    const res = await download(TAMSIN, cleared);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toBe('attachment; filename="cabin-yaw-with-hip-swirls-v1-cue-card.pdf"');
    const pdf = res.body as Buffer;
    // PDF 1.x file structure (ISO 32000-1:2008, 7.5.2 header, 7.5.5 trailer).
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.subarray(-6).toString('latin1')).toMatch(/%%EOF\s*$/);
    const text = pdfText(pdf).replace(/\s+/g, ' ');
    expect(text).toContain('Cabin yaw with hip swirls');
    expect(text).toContain('HERON');
    expect(text).toMatch(/legs together and straight, small hip circles/i);
    expect(text).toContain('injury risk');
    expect(text).toMatch(/(Robust|Caution, marginal|Caution, not robust): with feedback/);
    expect(text).toMatch(/95th percentile with feedback \d+(\.\d)?°/);
    const audits = await t.ctx.db.select().from(auditEvents).where(and(eq(auditEvents.action, 'cue_card.download'), eq(auditEvents.objectId, cleared)));
    expect(audits.length).toBeGreaterThanOrEqual(1);
  });

  it('draws a pose pictogram beside every step and the verified attitude plot, kept as a picture of the first page', async () => {
    const res = await download(TAMSIN, cleared);
    const pdf = res.body as Buffer;
    const text = pdfText(pdf).replace(/\s+/g, ' ');
    expect(text).toContain('POSE');
    expect(text).toContain('Attitude during the verified run');
    expect(text).toContain('dashed: target');
    // The figures are vector strokes: the first page as pixels (poppler's pdftoppm) has far more ink than text alone gives.
    const dir = path.join('test-results', 'cue-card');
    mkdirSync(dir, { recursive: true });
    writeFileSync(path.join(dir, 'cleared-cue-card.pdf'), pdf);
    execFileSync('pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '1', path.join(dir, 'cleared-cue-card.pdf'), path.join(dir, 'cleared-cue-card')]);
    expect(readdirSync(dir).some((f) => /^cleared-cue-card-0*1\.png$/.test(f))).toBe(true);
    const v = await loadVersionDetail(t.ctx.db, admin, cleared);
    const [profile] = await t.ctx.db.select({ body: profileVersions.body }).from(profileVersions).where(eq(profileVersions.id, v.profileVersionId));
    const card = cueCardContent(v, { callSign: null }, v.engineVersion!, bodySchema.parse(profile.body));
    expect(card.pictograms).toHaveLength(card.steps.length);
    // A moving step is drawn at both ends of its swing; the attitude plot ends where the verified run ends.
    expect(card.pictograms!.some((p) => p.poses.length === 2)).toBe(true);
    expect(card.attitude!.yaw.at(-1)).toBeCloseTo(v.report!.series.yawDeg.at(-1)!, 12);
  });

  it('gives a planner the card too, and 409 not_cleared for a drafting version', async () => {
    expect((await download(PLANNER, cleared)).status).toBe(200);
    const res = await request(t.app).get(`/api/sequences/versions/${drafting}/cue-card.pdf`).set('Authorization', `Bearer ${await t.tokenForEmail(PLANNER)}`);
    expect(res.status).toBe(409);
    expect(apiError(res).code).toBe('not_cleared');
  });

  it('hides another crew member’s version from a trainee (404) and refuses anyone signed out (401)', async () => {
    expect((await download(TAMSIN, kettles)).status).toBe(404);
    expect((await download(BRAM, kettles)).status).toBe(200);
    expect((await request(t.app).get(`/api/sequences/versions/${cleared}/cue-card.pdf`)).status).toBe(401);
  });
});
