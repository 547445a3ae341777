/**
 * Property-based fuzzing of every JSON route and every upload route (fast-check, fixed seed,
 * bounded counts): each route gets malformed requests built from a valid example. Routes whose only
 * input is their path (the cancel, stop and retry routes of background work) get malformed path
 * parameters. Properties:
 * no response is 5xx, and after every rejected request every table's row count and content
 * checksum are unchanged (nothing half-written). The one deliberate write of a rejection — a
 * refused upload is recorded (uploads row `rejected` + its audit event) — is checked to be
 * exactly that.
 */
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';

import { and, eq } from 'drizzle-orm';
import * as fc from 'fast-check';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { sequences, sequenceVersions, users } from '../../db/schema/index.ts';
import type { SuitView } from '../../shared/contracts/crew.ts';
import type { VersionDetail } from '../../shared/contracts/maneuver.ts';
import type { RecordingView } from '../../shared/contracts/recording.ts';
import { as, createSequence, crewOf, PEOPLE, saveVersion, THREE_STEPS } from '../maneuvers/maneuver-api.ts';
import { writeBvh } from '../recordings/bvh-writer.ts';
import { bodyOf, errorCode } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { appTables, changedTables, type DbSnapshot, rowCount, snapshot } from './db-snapshot.ts';
import { malformedBodies, malformedPathParams, malformedQueries, type Payload, pctSegment } from './malformed.ts';
import { brokenCsv, malformedUploads, type RawUpload } from './multipart.ts';

// Response bodies as the web client reads them.
type SuitsBody = { suits: SuitView[] };
type SuitBody = { suit: SuitView };
type RecordingBody = { recording: RecordingView };

/** Fixed seed: the same requests every run (change it to explore, then keep a failing one as a test). */
const SEED = 20_261_202;
/** Generated requests per route; a route must see at least MIN_REJECTED of them refused. */
const PER_ROUTE = 18;
const MIN_REJECTED = 10;
const MIN_TOTAL = 300;

interface JsonRoute { kind: 'json'; method: 'post' | 'put' | 'patch'; path: string; as: string | null; valid: Record<string, unknown> }
/** GET routes with query parameters: extra coverage beyond the JSON and upload routes. */
interface QueryRoute { kind: 'query'; path: string; as: string; valid: Record<string, string> }
interface UploadRoute { kind: 'upload'; path: string; as: string; inputs: fc.Arbitrary<RawUpload> }
/** A POST whose input is its path: `path` names its parameters (`:id`), `valid` gives a valid value of each. */
interface ParamsRoute { kind: 'params'; path: string; as: string; valid: Record<string, string> }
type Route = JsonRoute | QueryRoute | UploadRoute | ParamsRoute;

/** The route's path with these parameter values, percent-encoded. */
function fillPath(template: string, params: Record<string, string>): string {
  return template.replace(/:(\w+)/g, (_, name: string) => pctSegment(params[name]));
}

const t = testAppForFile();
let tables: string[];
const routes: Route[] = [];

beforeAll(async () => {
  tables = await appTables(t.pool);
  const crew = await crewOf(t, PEOPLE.trainee);
  const member = (await as(t, PEOPLE.planner).get(`/crew/${crew}`)).body as { member: { currentVersion: number } };
  const suits = bodyOf<SuitsBody>(await as(t, PEOPLE.planner).get('/suits')).suits as { id: string }[];
  const suit = bodyOf<SuitBody>(await as(t, PEOPLE.planner).get(`/suits/${suits[0].id}`));
  const seqId = await createSequence(t, crew, 'Fuzz target');
  const draft = bodyOf<VersionDetail>(await saveVersion(t, seqId, 0)).id;
  // A well-formed plan id no plan has (queuing a real plan would change tables during the fuzzing).
  const plan = randomUUID();
  // A version under review, for the reviewer's routes.
  const reviewSeq = await createSequence(t, crew, 'Fuzz review');
  const review = bodyOf<VersionDetail>(await saveVersion(t, reviewSeq, 0)).id;
  expect((await as(t, PEOPLE.planner).post(`/sequences/versions/${review}/submit`, { acknowledgeFailures: true, note: 'fuzz' })).status).toBe(200);
  const [cleared] = await t.ctx.db.select({ id: sequenceVersions.id }).from(sequenceVersions).innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .where(and(eq(sequences.crewMemberId, crew), eq(sequenceVersions.status, 'cleared')));
  const [bystander] = await t.ctx.db.select({ id: users.id }).from(users).where(eq(users.email, PEOPLE.otherTrainee));
  const target = { mode: 'ypr', yprDeg: { yaw: 30, pitch: 0, roll: 0 }, toleranceDeg: 2 };
  const body = JSON.parse(readFileSync('tests/fixtures/bodies/arm-on-trunk.json', 'utf8')) as Record<string, unknown>;
  const sequence: unknown = JSON.parse(readFileSync('tests/fixtures/sequences/arm-cone.json', 'utf8'));
  const measurementsCsv = 'name,call_sign,sex,stature_m,mass_kg,suit,thigh_m\nFuzz Person,FZ,female,1.64,58.2,cabin-clothing,\nFuzz Other,,male,1.79,80.5,,0.45\n';
  const recordingCsv = 'time_s,r_sh_flex,r_sh_abd\n0,0,0\n0.1,2,1\n0.2,4,2\n0.3,6,3\n';
  const segmentCsv = 'segment,mass_kg,com_x_m,com_y_m,com_z_m,ixx_kgm2,iyy_kgm2,izz_kgm2\nhead_neck,4.6,0,0,0.12,0.024,0.026,0.017\nl_hand,0.4,0,0,-0.07,0.0006,0.0005,0.0002\n';
  // A BVH recording, for its mapping route.
  const bvhText = writeBvh(Array.from({ length: 8 }, (_, k) => ({ LeftArm: [0, -(20 + 10 * Math.sin(k / 2)), 0] as [number, number, number] })), 1 / 30);
  const bvhUpload = await request(t.app).post('/api/uploads/bvh').set('Authorization', `Bearer ${await t.tokenForEmail(PEOPLE.planner)}`).attach('file', Buffer.from(bvhText), 'fuzz.bvh');
  expect(bvhUpload.status, JSON.stringify(bvhUpload.body)).toBe(201);
  const bvhRecording = bodyOf<RecordingBody>(bvhUpload).recording as { id: string; mapping: Record<string, unknown> };
  const json = (method: JsonRoute['method'], path: string, who: string | null, valid: Record<string, unknown>): JsonRoute => ({ kind: 'json', method, path, as: who, valid });
  routes.push(
    json('post', '/api/auth/sign-in', null, { email: PEOPLE.planner, password: 'not-the-password' }),
    json('post', '/api/me/password', PEOPLE.otherPlanner, { currentPassword: 'not-the-password', newPassword: 'a much longer pass phrase 42' }),
    json('post', '/api/invitations/not-a-real-token-0123456789/accept', null, { password: 'a much longer pass phrase 42' }),
    json('post', '/api/team/invitations', PEOPLE.admin, { email: 'fuzz.person@lumen.example.test', name: 'Fuzz Person', role: 'trainee', crewMemberId: null }),
    json('patch', `/api/team/users/${bystander.id}`, PEOPLE.admin, { role: 'trainee', disabled: false, crewMemberId: null }),
    json('post', '/api/crew', PEOPLE.planner, { name: 'Fuzz Member', callSign: 'FZ', notes: 'fuzz' }),
    json('post', `/api/crew/${crew}/versions`, PEOPLE.planner, { baseVersion: member.member.currentVersion, note: 'fuzz', inputs: { sex: 'female', stature: 1.65, mass: 60, lengths: {}, suitId: null, gear: [] } }),
    json('put', `/api/suits/${suits[0].id}`, PEOPLE.planner, { ...suit.suit }),
    json('post', '/api/rehearsals', PEOPLE.trainee, { sequenceVersionId: cleared.id, playbackSpeed: 1, completedSteps: 1, selfRating: 4, notes: 'fuzz' }),
    json('post', `/api/reviews/${review}/decision`, PEOPLE.reviewer, { decision: 'send_back', comment: 'fuzz' }),
    json('post', `/api/reviews/${review}/comments`, PEOPLE.reviewer, { comment: 'fuzz comment' }),
    json('post', '/api/sequences', PEOPLE.planner, { crewMemberId: crew, name: 'Fuzz sequence', target }),
    json('post', '/api/sequences/compile', PEOPLE.planner, { primitives: THREE_STEPS, crewMemberId: crew }),
    json('post', `/api/sequences/versions/${draft}/submit`, PEOPLE.planner, { note: 'fuzz', acknowledgeFailures: true }),
    json('patch', `/api/sequences/${seqId}`, PEOPLE.planner, { name: 'Fuzz target renamed', target }),
    json('post', `/api/sequences/${seqId}/versions`, PEOPLE.planner, { primitives: THREE_STEPS, baseVersion: 1, note: 'fuzz', target }),
    json('post', `/api/sequences/${seqId}/plans`, PEOPLE.planner, { samples: 10, seed: 1, maxCandidates: 1, spreads: { massPct: 5, lengthPct: 3, amplitudePct: 10, periodPct: 10, phaseDeg: 10 } }),
    json('post', '/api/simulate', PEOPLE.planner, { body, sequence, options: { rateHz: 10, rtol: 1e-8 } }),
    json('post', `/api/sequences/versions/${draft}/robustness`, PEOPLE.planner, { samples: 20, seed: 1 }),
    json('post', `/api/rehearsals/${cleared.id}/recording/sign-off`, PEOPLE.reviewer, { note: 'fuzz sign-off' }),
    json('put', `/api/recordings/${bvhRecording.id}/mapping`, PEOPLE.planner, { mapping: bvhRecording.mapping, rateHz: 30 }),
    // Cancel, stop and retry of background work: their only input is the path.
    { kind: 'params', path: '/api/sequences/versions/:versionId/robustness/cancel', as: PEOPLE.planner, valid: { versionId: draft } },
    { kind: 'params', path: '/api/sequences/:sequenceId/plans/:planId/cancel', as: PEOPLE.planner, valid: { sequenceId: seqId, planId: plan } },
    { kind: 'params', path: '/api/crew/:id/reverifications/cancel', as: PEOPLE.planner, valid: { id: crew } },
    { kind: 'params', path: '/api/jobs/:kind/:id/retry', as: PEOPLE.admin, valid: { kind: 'plan', id: plan } },
    { kind: 'params', path: '/api/jobs/:kind/:id/cancel', as: PEOPLE.admin, valid: { kind: 'robustness', id: draft } },
    { kind: 'query', path: '/api/crew', as: PEOPLE.planner, valid: { q: 'Tamsin' } },
    { kind: 'query', path: '/api/audit', as: PEOPLE.admin, valid: { action: 'crew.create', objectType: 'crew_member', since: '2026-01-01T00:00:00Z' } },
    { kind: 'query', path: `/api/motion/${cleared.id}`, as: PEOPLE.trainee, valid: { rateHz: '30' } },
    {
      kind: 'upload', path: '/api/uploads/measurements', as: PEOPLE.planner,
      inputs: malformedUploads({ fields: {}, fileName: 'crew.csv', validFile: measurementsCsv, brokenFiles: brokenCsv(measurementsCsv) }),
    },
    {
      kind: 'upload', path: `/api/rehearsals/${cleared.id}/recording`, as: PEOPLE.trainee,
      inputs: malformedUploads({ fields: {}, fileName: 'run.csv', validFile: recordingCsv, brokenFiles: brokenCsv(recordingCsv) }),
    },
    {
      kind: 'upload', path: '/api/uploads/joint-angles', as: PEOPLE.planner,
      inputs: malformedUploads({ fields: { name: 'fuzz sweep' }, fileName: 'sweep.csv', validFile: recordingCsv, brokenFiles: brokenCsv(recordingCsv) }),
    },
    {
      kind: 'upload', path: '/api/uploads/bvh', as: PEOPLE.planner,
      inputs: malformedUploads({ fields: { name: 'fuzz capture' }, fileName: 'capture.bvh', validFile: bvhText, brokenFiles: brokenCsv(bvhText) }),
    },
    {
      kind: 'upload', path: '/api/uploads/segment-table', as: PEOPLE.planner,
      inputs: malformedUploads({
        fields: { crewMemberId: crew, baseVersion: String(member.member.currentVersion), note: 'fuzz' }, fileName: 'scan.csv', validFile: segmentCsv,
        brokenFiles: fc.oneof(brokenCsv(segmentCsv), malformedBodies(body).map((p: Payload) => ({ text: Buffer.from('json' in p ? JSON.stringify(p.json) ?? '' : p.raw), what: 'body JSON as .csv' }))),
      }),
    },
  );
  // Sign everyone in now: a sign-in writes an audit event, which must not count against a route.
  for (const who of Object.values(PEOPLE)) await t.tokenForEmail(who);
}, 180_000);


/** Sends one generated request; returns status and error code. */
async function send(route: Route, input: Payload | string | RawUpload | Record<string, string>): Promise<{ status: number; code?: string }> {
  const auth = route.as ? `Bearer ${await t.tokenForEmail(route.as)}` : '';
  let req;
  if (route.kind === 'json') {
    const p = input as Payload;
    req = request(t.app)[route.method](route.path).set('Content-Type', 'application/json').send('json' in p ? JSON.stringify(p.json) : p.raw);
  } else if (route.kind === 'query') {
    req = request(t.app).get(`${route.path}?${input as string}`);
  } else if (route.kind === 'params') {
    req = request(t.app).post(fillPath(route.path, input as Record<string, string>));
  } else {
    const u = input as RawUpload;
    req = request(t.app).post(route.path).set('Content-Type', u.contentType).send(u.body);
  }
  if (auth) req = req.set('Authorization', auth);
  const res = await req;
  return { status: res.status, code: errorCode(res) };
}

/** Snapshots every 200 ms until two in a row agree (at most 5 s): the state background work leaves. */
async function settled(first: DbSnapshot): Promise<DbSnapshot> {
  let last = first;
  for (let i = 0; i < 25; i++) {
    await new Promise((r) => setTimeout(r, 200));
    const next = await snapshot(t.pool, tables);
    if (changedTables(last, next).length === 0) return next;
    last = next;
  }
  return last;
}

describe('fuzzing every JSON and upload route', () => {
  it(`no 5xx and no partial write over ≥ ${MIN_TOTAL} malformed requests (≥ ${MIN_REJECTED} refused per route)`, async () => {
    const failures: string[] = [];
    const refusedPerRoute: Record<string, number> = {};
    let before: DbSnapshot = await snapshot(t.pool, tables);
    let total = 0;
    const started = Date.now();
    for (const [i, route] of routes.entries()) {
      const arb = route.kind === 'json' ? malformedBodies(route.valid) : route.kind === 'query' ? malformedQueries(route.valid)
        : route.kind === 'params' ? malformedPathParams(route.valid) : route.inputs;
      const inputs = fc.sample<Payload | string | RawUpload | Record<string, string>>(arb, { seed: SEED + i, numRuns: PER_ROUTE });
      const label = `${route.kind === 'json' ? route.method.toUpperCase() : route.kind === 'query' ? 'GET' : 'POST'} ${route.path}`;
      // Query-string routes are extra coverage (a search for odd text may rightly succeed): only 5xx and writes are checked there.
      if (route.kind !== 'query') refusedPerRoute[label] = 0;
      for (const input of inputs) {
        total++;
        const { status, code } = await send(route, input);
        const shown = typeof input === 'string' ? input : route.kind === 'params' ? JSON.stringify(input).slice(0, 160)
          : 'what' in input ? input.what : JSON.stringify('json' in input ? input.json : input.raw)?.slice(0, 160);
        if (status >= 500) failures.push(`${label} → ${status} ${code ?? ''} for ${shown}`);
        const after = await snapshot(t.pool, tables);
        if (status >= 400) {
          if (label in refusedPerRoute) refusedPerRoute[label]++;
          const changed = changedTables(before, after);
          // A refused upload is recorded on purpose: one `rejected` uploads row and its audit event, nothing else.
          const recordedRejection = route.kind === 'upload' && changed.every((x) => x === 'uploads' || x === 'audit_events')
            && rowCount(after, 'uploads') === rowCount(before, 'uploads') + 1 && rowCount(after, 'audit_events') === rowCount(before, 'audit_events') + 1
            && (await t.pool.query<{ status: string }>(`SELECT status FROM uploads ORDER BY created_at DESC LIMIT 1`)).rows[0]?.status === 'rejected';
          if (changed.length && !recordedRejection) failures.push(`${label} → ${status} ${code ?? ''} changed ${changed.join(', ')} for ${shown}`);
        }
        // An accepted request may start background work (the invitation outbox sends its mail): wait until the tables settle.
        before = status < 400 ? await settled(after) : after;
      }
    }
    const elapsedS = (Date.now() - started) / 1000;
    const refused = Object.values(refusedPerRoute).reduce((a, b) => a + b, 0);
    console.info(`[fuzz] ${routes.length} routes, ${total} generated requests, ${refused} refused (4xx) on the JSON and upload routes, ${failures.length} failures, ${elapsedS.toFixed(1)} s`);
    console.info(`[fuzz] refused per route: ${Object.entries(refusedPerRoute).map(([r, n]) => `${r} ${n}/${PER_ROUTE}`).join('; ')}`);
    expect(failures).toEqual([]);
    for (const [label, n] of Object.entries(refusedPerRoute)) expect({ route: label, refused: n >= MIN_REJECTED }).toEqual({ route: label, refused: true });
    expect(refused).toBeGreaterThanOrEqual(MIN_TOTAL);
  }, 600_000);
});
