/** Helpers for the maneuvers API tests: sign in as demo people and drive the endpoints. */
import { eq } from 'drizzle-orm';
import request from 'supertest';

import { users } from '../../db/schema/index.ts';
import type { SequenceSummary, VersionDetail } from '../../shared/contracts/maneuver.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';
import { bodyOf } from '../support/response-body.ts';
import type { TestApp } from '../support/test-app.ts';

/** Demo people by their part in the tests. */
export const PEOPLE = {
  admin: 'ada.quill@lumen.example.test',
  planner: 'orrin.vale@lumen.example.test',
  otherPlanner: 'pim.sorrel@lumen.example.test',
  reviewer: 'juno.brack@lumen.example.test',
  trainee: 'tamsin.reed@lumen.example.test',
  otherTrainee: 'bram.kettle@lumen.example.test',
} as const;

/** A short three-step maneuver (invented): arms to the front, small outward circles, pause. */
export const THREE_STEPS: Primitive[] = [
  { kind: 'pose_shift', posture: 'arms_forward', durationS: 1 },
  { kind: 'arm_orbit', arms: 'both', centre: 'forward', halfAngleDeg: 15, travel: 'outward', cycles: 2, periodS: 1.5 },
  { kind: 'pause', durationS: 0.5 },
];

/** Signed-in client for one person. */
export function as(t: TestApp, email: string) {
  const auth = async () => `Bearer ${await t.tokenForEmail(email)}`;
  return {
    get: async (path: string) => request(t.app).get(`/api${path}`).set('Authorization', await auth()),
    post: async (path: string, body: object = {}) => request(t.app).post(`/api${path}`).set('Authorization', await auth()).send(body),
    patch: async (path: string, body: object = {}) => request(t.app).patch(`/api${path}`).set('Authorization', await auth()).send(body),
    delete: async (path: string) => request(t.app).delete(`/api${path}`).set('Authorization', await auth()),
  };
}

/** The crew member a demo trainee is linked to. */
export async function crewOf(t: TestApp, email: string): Promise<string> {
  const [u] = await t.ctx.db.select({ c: users.crewMemberId }).from(users).where(eq(users.email, email));
  if (!u?.c) throw new Error(`${email} has no crew member`);
  return u.c;
}

/** Creates a sequence as the planner; returns its id. */
export async function createSequence(t: TestApp, crewMemberId: string, name = 'Pitch trim', by: string = PEOPLE.planner): Promise<string> {
  const res = await as(t, by).post('/sequences', { crewMemberId, name, target: { mode: 'ypr', yprDeg: { yaw: 0, pitch: 5, roll: 0 }, toleranceDeg: 3 } });
  if (res.status !== 201) throw new Error(`create sequence: ${res.status} ${JSON.stringify(res.body)}`);
  return bodyOf<SequenceSummary>(res).id;
}

/** Saves a version; returns the response. */
export async function saveVersion(t: TestApp, sequenceId: string, baseVersion: number, by: string = PEOPLE.planner, primitives: Primitive[] = THREE_STEPS) {
  return as(t, by).post(`/sequences/${sequenceId}/versions`, { primitives, baseVersion });
}

/** Creates a sequence and saves its first version (drafting); returns the version's id. */
export async function draftedVersion(t: TestApp, crewMemberId: string, name: string): Promise<string> {
  const sequenceId = await createSequence(t, crewMemberId, name);
  const saved = await saveVersion(t, sequenceId, 0);
  if (saved.status !== 201) throw new Error(`save version: ${saved.status} ${JSON.stringify(saved.body)}`);
  return bodyOf<VersionDetail>(saved).id;
}

/**
 * Creates a sequence, saves one version, submits it (acknowledging any failed checks: these tests are
 * about what happens to a cleared version, not the checks) and has the reviewer clear it; returns its id.
 */
export async function clearedVersion(t: TestApp, crewMemberId: string, name: string): Promise<string> {
  const v = await draftedVersion(t, crewMemberId, name);
  const submitted = await as(t, PEOPLE.planner).post(`/sequences/versions/${v}/submit`, { acknowledgeFailures: true, note: `${name}: checks acknowledged` });
  if (submitted.status !== 200) throw new Error(`submit: ${submitted.status}`);
  const cleared = await as(t, PEOPLE.reviewer).post(`/reviews/${v}/decision`, { decision: 'clear', comment: '' });
  if (cleared.status !== 200) throw new Error(`clear: ${cleared.status}`);
  return v;
}
