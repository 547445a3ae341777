/**
 * Recording uploads through the API: the raw file in object storage, parsed rows and the track in
 * PostgreSQL, all or nothing; BVH mapping edits; and the track used as a step in POST /api/simulate.
 */
import { eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { recordings, uploadRows, uploads } from '../../db/schema/index.ts';
import type { RecordingView } from '../../shared/contracts/recording.ts';
import type { UploadResult } from '../../shared/contracts/uploads.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { writeBvh } from './bvh-writer.ts';

// Response bodies as the web client reads them.
type RecordingBody = { recording: RecordingView };

const t = testAppForFile();
let planner: string;
let trainee: string;
beforeAll(async () => {
  planner = `Bearer ${await t.tokenFor('planner')}`;
  trainee = `Bearer ${await t.tokenFor('trainee')}`;
});

const api = () => request(t.app);
const count = async (table: string) => (await t.ctx.db.execute<{ n: number }>(sql.raw(`SELECT count(*)::int AS n FROM ${table}`))).rows[0].n;

describe('recording uploads', () => {
  it('a joint-angle CSV becomes a recording: raw file in S3, one parsed row per line, the uniform track', async () => {
    const csv = ['time_s,r_sh_flex,r_sh_abd', ...Array.from({ length: 26 }, (_, k) => `${(k * 0.04).toFixed(2)},${90 + 30 * Math.sin(k / 4)},${20 + k}`)].join('\n');
    const res = await api().post('/api/uploads/joint-angles').set('Authorization', planner).field('name', 'Expert arm sweep').attach('file', Buffer.from(csv), 'sweep.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const rec = bodyOf<RecordingBody>(res).recording;
    expect(rec).toMatchObject({ name: 'Expert arm sweep', source: 'joint_angles_csv', rateHz: 25, dofs: ['r_sh_flex', 'r_sh_abd'], duration: 1 });
    expect(rec.frames).toHaveLength(26);
    const [up] = await t.ctx.db.select().from(uploads).where(eq(uploads.id, rec.uploadId));
    expect(up).toMatchObject({ kind: 'joint_angles_csv', status: 'imported', rowCount: 26 });
    expect((await t.ctx.storage.get(up.objectKey)).toString('utf8')).toBe(csv);
    const rows = await t.ctx.db.select().from(uploadRows).where(eq(uploadRows.uploadId, up.id)).orderBy(uploadRows.rowNumber);
    expect(rows).toHaveLength(26);
    expect(rows[0]).toMatchObject({ rowNumber: 2, data: { time_s: '0.00', r_sh_flex: '90', r_sh_abd: '20' } });
  });

  it('a bad CSV imports nothing and lists every error by row and column', async () => {
    const before = [await count('recordings'), await count('upload_rows')];
    const csv = 'time_s,r_sh_flex,r_sh_abd\n0,1,2\n0.1,x,3\n0.05,3,4\n0.3,4,\n0.4,5,6';
    const res = await api().post('/api/uploads/joint-angles').set('Authorization', planner).attach('file', Buffer.from(csv), 'bad.csv');
    expect(res.status).toBe(422);
    expect(bodyOf<UploadResult>(res).upload.errors.map((e: { row: number; column: string }) => `${e.row}:${e.column}`)).toEqual(['3:r_sh_flex', '4:time_s', '5:r_sh_abd']);
    expect([await count('recordings'), await count('upload_rows')]).toEqual(before);
    const [up] = await t.ctx.db.select().from(uploads).where(eq(uploads.id, bodyOf<UploadResult>(res).upload.id));
    expect(up.status).toBe('rejected');
  });

  it('a BVH file is parsed and mapped with the default mapping; a new mapping re-reads the stored file', async () => {
    const frames = Array.from({ length: 31 }, (_, k) => ({ LeftArm: [0, -(20 + 40 * Math.sin(k / 5)), 0] as [number, number, number], LeftForeArm: [0, -30, 0] as [number, number, number] }));
    const text = writeBvh(frames, 1 / 30);
    const res = await api().post('/api/uploads/bvh').set('Authorization', planner).attach('file', Buffer.from(text), 'capture.bvh');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const rec = bodyOf<RecordingBody>(res).recording;
    expect(rec.source).toBe('bvh');
    expect(rec.mapping!.joints).toMatchObject({ l_upper_arm: 'LeftArm', lower_trunk: 'Hips', upper_trunk: 'Chest' });
    expect(rec.bvhJoints!.map((j) => j.name)).toContain('RightForeArm');
    expect(rec.assumptions.join(' ')).toMatch(/faces \+Z/);
    const flex = rec.dofs.indexOf('l_sh_flex');
    expect(rec.frames[5][flex]).toBeCloseTo(20 + 40 * Math.sin(1), 3);
    expect(await count(`upload_rows WHERE upload_id = '${rec.uploadId}'`)).toBe(31);

    // Map only the left arm and keep its flexion and the elbow.
    const joints = { ...rec.mapping!.joints, l_thigh: '', l_shank: '', r_thigh: '', r_shank: '', r_upper_arm: '', r_forearm: '', lower_trunk: '' };
    const put = await api().put(`/api/recordings/${rec.id}/mapping`).set('Authorization', planner).send({ mapping: { joints, facing: '+z', dofs: ['l_sh_flex', 'l_elbow_flex'] } });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect(bodyOf<RecordingBody>(put).recording.dofs).toEqual(['l_sh_flex', 'l_elbow_flex']);
    expect(bodyOf<RecordingBody>(put).recording.frames[0][1]).toBeCloseTo(30, 4);
    const [row] = await t.ctx.db.select().from(recordings).where(eq(recordings.id, rec.id));
    expect(row.dofs).toEqual(['l_sh_flex', 'l_elbow_flex']);

    // A mapping naming a joint the file lacks is refused and changes nothing.
    const wrong = await api().put(`/api/recordings/${rec.id}/mapping`).set('Authorization', planner).send({ mapping: { joints: { ...joints, l_upper_arm: 'L_Humerus' }, facing: '+z' } });
    expect(wrong.status).toBe(400);
    expect(apiError(wrong).message).toMatch(/l_upper_arm: the file has no joint 'L_Humerus'/);
    const [after] = await t.ctx.db.select().from(recordings).where(eq(recordings.id, rec.id));
    expect(after.dofs).toEqual(['l_sh_flex', 'l_elbow_flex']);
  });

  it('a BVH with a frame count mismatch is rejected naming the Frames line', async () => {
    const text = writeBvh([{}, {}, {}, {}], 0.01).replace('Frames: 4', 'Frames: 6');
    const res = await api().post('/api/uploads/bvh').set('Authorization', planner).attach('file', Buffer.from(text), 'short.bvh');
    expect(res.status).toBe(422);
    expect(bodyOf<UploadResult>(res).upload.errors[0]).toMatchObject({ column: 'Frames' });
    expect(apiError(res).message).toMatch(/"Frames: 6" but the file holds 4 frame lines/);
  });

  it('trainees cannot upload or list recordings', async () => {
    expect((await api().get('/api/recordings').set('Authorization', trainee)).status).toBe(403);
    expect((await api().post('/api/uploads/bvh').set('Authorization', trainee).attach('file', Buffer.from('x'), 'a.bvh')).status).toBe(403);
  });
});
