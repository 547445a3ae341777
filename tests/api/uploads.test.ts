import { createHash } from 'node:crypto';

import { eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { uploadRows, uploads } from '../../db/schema/index.ts';
import type { CrewMemberView } from '../../shared/contracts/crew.ts';
import type { ProfileVersionView } from '../../shared/contracts/profile-version.ts';
import type { UploadResult } from '../../shared/contracts/uploads.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

// Response bodies as the web client reads them.
type MembersBody = { members: CrewMemberView[] };
type CurrentBody = { member: CrewMemberView; current: ProfileVersionView };

const t = testAppForFile();
let planner: string;
beforeAll(async () => {
  planner = `Bearer ${await t.tokenFor('planner')}`;
});

const api = () => request(t.app);
const crewCount = async () => (await t.ctx.db.execute<{ n: number }>(sql`SELECT count(*)::int AS n FROM crew_members`)).rows[0].n;
const versionCount = async () => (await t.ctx.db.execute<{ n: number }>(sql`SELECT count(*)::int AS n FROM profile_versions`)).rows[0].n;

const HEADER = 'name,call_sign,sex,stature_m,mass_kg,suit,thigh_m';
const GOOD = [HEADER, 'Nell Arbor,KITE,female,1.64,58.2,cabin-clothing,', 'Oskar Fenn,,male,1.79,80.5,,0.45', 'Rui Calder,LARK,male,1.71,72,pressurised-suit,'].join('\n') + '\n';
const ONE_BAD = GOOD.replace('Oskar Fenn,,male,1.79,80.5', 'Oskar Fenn,,male,1.79,8O.5');

describe('measurements CSV', () => {
  it('a file with one bad row imports nothing, names row 3 and the column, keeps the raw file in S3 and the rejection in PostgreSQL', async () => {
    const [crewBefore, versionsBefore] = [await crewCount(), await versionCount()];
    const res = await api().post('/api/uploads/measurements').set('Authorization', planner).attach('file', Buffer.from(ONE_BAD), 'crew-week-12.csv');
    expect(res.status).toBe(422);
    expect(apiError(res).code).toBe('upload_rejected');
    expect(apiError(res).message).toMatch(/nothing was imported.*row 3, column mass_kg: "8O.5" is not a number/);
    expect(bodyOf<UploadResult>(res).upload.errors).toEqual([{ row: 3, column: 'mass_kg', reason: '"8O.5" is not a number (use a decimal point, e.g. 1.75)' }]);
    expect([await crewCount(), await versionCount()]).toEqual([crewBefore, versionsBefore]);

    const [row] = await t.ctx.db.select().from(uploads).where(eq(uploads.id, bodyOf<UploadResult>(res).upload.id));
    expect(row).toMatchObject({ status: 'rejected', kind: 'measurements_csv', fileName: 'crew-week-12.csv', rowCount: 3, sizeBytes: Buffer.byteLength(ONE_BAD) });
    expect(row.objectKey).toBe(`uploads/${row.id}/crew-week-12.csv`);
    expect((await t.ctx.db.select().from(uploadRows).where(eq(uploadRows.uploadId, row.id))).length).toBe(0);
    expect((await t.ctx.storage.get(row.objectKey)).toString('utf8')).toBe(ONE_BAD);
  });

  it('reports every bad row and column, including model limits, unknown suits and duplicate names', async () => {
    const csv = [HEADER, 'A One,,female,3.2,60,,', 'B Two,,other,1.7,60,,', 'C Three,,male,1.7,60,moon-suit,', 'A One,,female,1.6,60,,', ',,male,1.7,60,,'].join('\n');
    const res = await api().post('/api/uploads/measurements').set('Authorization', planner).attach('file', Buffer.from(csv), 'many.csv');
    expect(res.status).toBe(422);
    const where = bodyOf<UploadResult>(res).upload.errors.map((e: { row: number; column: string }) => `${e.row}:${e.column}`);
    expect(where).toEqual(['2:stature_m', '3:sex', '4:suit', '5:name', '6:name']);
    expect(bodyOf<UploadResult>(res).upload.errors[0].reason).toBe('stature must be at most 2.3 m');
  });

  it('lists every problem of one row in a single upload: bad sex, out-of-range stature and mass, unknown suit, negative length', async () => {
    const csv = [HEADER, 'D Four,,other,2.9,25,moon-suit,-0.4', 'E Five,,male,1.7,60,,'].join('\n');
    const res = await api().post('/api/uploads/measurements').set('Authorization', planner).attach('file', Buffer.from(csv), 'one-row-many.csv');
    expect(res.status).toBe(422);
    const errors = bodyOf<UploadResult>(res).upload.errors as { row: number; column: string; reason: string }[];
    expect(errors.map((e) => e.column).sort()).toEqual(['mass_kg', 'sex', 'stature_m', 'suit', 'thigh_m']);
    expect(errors.every((e) => e.row === 2)).toBe(true);
    expect(errors.find((e) => e.column === 'stature_m')?.reason).toBe('stature must be at most 2.3 m');
    expect(errors.find((e) => e.column === 'mass_kg')?.reason).toBe('mass must be at least 30 kg');
    expect(errors.find((e) => e.column === 'thigh_m')?.reason).toBe('thigh length must be positive');
  });

  it('refuses an unknown column in the header (row 1)', async () => {
    const res = await api().post('/api/uploads/measurements').set('Authorization', planner).attach('file', Buffer.from('name,sex,stature_m,mass_kg,height\nX,male,1.7,70,1\n'), 'h.csv');
    expect(res.status).toBe(422);
    expect(bodyOf<UploadResult>(res).upload.errors[0]).toMatchObject({ row: 1, column: 'height' });
  });

  it('the fixed file imports three new crew members with version 1, rows and metadata in PostgreSQL, raw file in S3', async () => {
    const res = await api().post('/api/uploads/measurements').set('Authorization', planner).attach('file', Buffer.from(GOOD), 'crew-week-12.csv');
    expect(res.status).toBe(201);
    expect(bodyOf<UploadResult>(res).imported.map((r: { row: number; name: string; action: string; version: number }) => [r.row, r.name, r.action, r.version])).toEqual([
      [2, 'Nell Arbor', 'created', 1],
      [3, 'Oskar Fenn', 'created', 1],
      [4, 'Rui Calder', 'created', 1],
    ]);
    const [row] = await t.ctx.db.select().from(uploads).where(eq(uploads.id, bodyOf<UploadResult>(res).upload.id));
    expect(row).toMatchObject({ status: 'imported', rowCount: 3, errors: [], sha256: createHash('sha256').update(GOOD).digest('hex') });
    const rows = await t.ctx.db.select().from(uploadRows).where(eq(uploadRows.uploadId, row.id)).orderBy(uploadRows.rowNumber);
    expect(rows.map((r) => [r.rowNumber, (r.data as { name: string }).name])).toEqual([[2, 'Nell Arbor'], [3, 'Oskar Fenn'], [4, 'Rui Calder']]);
    expect((await t.ctx.storage.get(row.objectKey)).toString('utf8')).toBe(GOOD);

    const oskar = bodyOf<CurrentBody>(await api().get(`/api/crew/${bodyOf<UploadResult>(res).imported[1].crewMemberId}`).set('Authorization', planner)).current;
    expect(oskar.inputs).toMatchObject({ sex: 'male', stature: 1.79, mass: 80.5, lengths: { thigh: 0.45 }, suit: null });
    const rui = bodyOf<CurrentBody>(await api().get(`/api/crew/${bodyOf<UploadResult>(res).imported[2].crewMemberId}`).set('Authorization', planner));
    expect(rui.member.callSign).toBe('LARK');
    expect(rui.current.inputs.suit?.id).toBe('pressurised-suit');
  });

  it('a row naming an existing crew member adds a version to that member', async () => {
    const csv = `${HEADER}\nNell Arbor,KITE,female,1.64,57.4,cabin-clothing,\n`;
    const res = await api().post('/api/uploads/measurements').set('Authorization', planner).attach('file', Buffer.from(csv), 'nell.csv');
    expect(res.status).toBe(201);
    expect(bodyOf<UploadResult>(res).imported[0]).toMatchObject({ name: 'Nell Arbor', action: 'updated', version: 2 });
  });

  it('refuses a file of the wrong type (415) or over the size limit (413), naming the limit', async () => {
    const wrong = await api().post('/api/uploads/measurements').set('Authorization', planner).attach('file', Buffer.from('x'), 'crew.xlsx');
    expect(wrong.status).toBe(415);
    expect(apiError(wrong).message).toMatch(/not a \.csv file/);
    const big = await api().post('/api/uploads/measurements').set('Authorization', planner).attach('file', Buffer.alloc(1024 * 1024 + 1, 'a'), 'big.csv');
    expect(big.status).toBe(413);
    expect(apiError(big).message).toMatch(/larger than 1 MiB/);
    const none = await api().post('/api/uploads/measurements').set('Authorization', planner);
    expect(none.status).toBe(400);
    expect(apiError(none).field).toBe('file');
  });
});

describe('measured segment table', () => {
  async function member(name: string) {
    const m = bodyOf<MembersBody>(await api().get(`/api/crew?q=${encodeURIComponent(name)}`).set('Authorization', planner)).members[0];
    return m as { id: string; currentVersion: number };
  }

  it('a CSV replaces the listed segments\' mass properties as a new measured version; the rest stays', async () => {
    const m = await member('Ilse Moss');
    const before = bodyOf<CurrentBody>(await api().get(`/api/crew/${m.id}`).set('Authorization', planner)).current;
    const csv = 'segment,mass_kg,com_x_m,com_y_m,com_z_m,ixx_kgm2,iyy_kgm2,izz_kgm2\nhead_neck,4.6,0,0,0.12,0.024,0.026,0.017\nl_hand,0.4,0,0,-0.07,0.0006,0.0005,0.0002\n';
    const res = await api().post('/api/uploads/segment-table').set('Authorization', planner)
      .field('crewMemberId', m.id).field('baseVersion', String(m.currentVersion)).attach('file', Buffer.from(csv), 'moss-scan.csv');
    expect(res.status).toBe(201);
    const after = bodyOf<CurrentBody>(await api().get(`/api/crew/${m.id}`).set('Authorization', planner)).current;
    expect(after).toMatchObject({ version: before.version + 1, source: 'measured' });
    expect(after.inputs.measuredTable).toMatchObject({ fileName: 'moss-scan.csv', segments: ['head_neck', 'l_hand'] });
    const seg = (v: typeof after, n: string) => v.body.segments.find((s) => s.name === n)!;
    expect(seg(after, 'head_neck')).toMatchObject({ mass: 4.6, com: [0, 0, 0.12], inertia: [0.024, 0.026, 0.017] });
    expect(seg(after, 'r_thigh')).toEqual(seg(before, 'r_thigh'));
    const delta = 4.6 - seg(before, 'head_neck').mass + 0.4 - seg(before, 'l_hand').mass;
    expect(after.summary.mass - before.summary.mass).toBeCloseTo(delta, 9);
  });

  it('an inertia that breaks the triangle inequality is reported on its row; nothing is saved', async () => {
    const m = await member('Bram Kettle');
    const csv = 'segment,mass_kg,com_x_m,com_y_m,com_z_m,ixx_kgm2,iyy_kgm2,izz_kgm2\nhead_neck,4.6,0,0,0.12,0.024,0.026,0.017\nr_hand,0.4,0,0,-0.07,0.001,0.001,0.5\n';
    const res = await api().post('/api/uploads/segment-table').set('Authorization', planner)
      .field('crewMemberId', m.id).field('baseVersion', String(m.currentVersion)).attach('file', Buffer.from(csv), 'bad.csv');
    expect(res.status).toBe(422);
    expect(bodyOf<UploadResult>(res).upload.errors).toHaveLength(1);
    expect(bodyOf<UploadResult>(res).upload.errors[0]).toMatchObject({ row: 3, column: 'ixx_kgm2…iyz_kgm2' });
    expect(bodyOf<UploadResult>(res).upload.errors[0].reason).toMatch(/r_hand.*triangle inequality/);
    expect((await member('Bram Kettle')).currentVersion).toBe(m.currentVersion);
  });

  it('a contract JSON body replaces the whole body; a stale base version gets 409', async () => {
    const m = await member('Tamsin Reed');
    const body = { name: 'two blocks', segments: [
      { name: 'trunk', mass: 40, com: [0, 0, 0], inertia: [1.2, 1.0, 0.35] },
      { name: 'arm', parent: 'trunk', mass: 3, com: [0, 0, -0.2], inertia: [0.02, 0.02, 0.003], joint: { origin: [0, -0.2, 0.25], dofs: [{ name: 'sh', axis: [0, -1, 0], min: -50, max: 180 }] } },
    ] };
    const stale = await api().post('/api/uploads/segment-table').set('Authorization', planner)
      .field('crewMemberId', m.id).field('baseVersion', '1').attach('file', Buffer.from(JSON.stringify(body)), 'reed.json');
    expect(stale.status).toBe(409);
    expect(apiError(stale).code).toBe('stale_version');
    const ok = await api().post('/api/uploads/segment-table').set('Authorization', planner)
      .field('crewMemberId', m.id).field('baseVersion', String(m.currentVersion)).attach('file', Buffer.from(JSON.stringify(body)), 'reed.json');
    expect(ok.status).toBe(201);
    const current = bodyOf<CurrentBody>(await api().get(`/api/crew/${m.id}`).set('Authorization', planner)).current;
    expect(current.summary.mass).toBe(43);
    expect(current.body).toEqual(body);
  });

  it('a bad contract JSON names the segment and field', async () => {
    const m = await member('Tamsin Reed');
    const body = { name: 'x', segments: [{ name: 'trunk', mass: -1, com: [0, 0, 0], inertia: [1, 1, 1] }] };
    const res = await api().post('/api/uploads/segment-table').set('Authorization', planner)
      .field('crewMemberId', m.id).field('baseVersion', String(m.currentVersion)).attach('file', Buffer.from(JSON.stringify(body)), 'x.json');
    expect(res.status).toBe(422);
    expect(bodyOf<UploadResult>(res).upload.errors[0]).toMatchObject({ row: 0, column: 'segments[0].mass' });
    expect(bodyOf<UploadResult>(res).upload.errors[0].reason).toMatch(/segment 'trunk': mass: mass must be positive/);
  });
});
