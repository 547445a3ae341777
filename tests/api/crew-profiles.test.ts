import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { DEMO_PEOPLE } from '../../db/seed/demo-people.ts';
import { bodySchema } from '../../shared/contracts/body.ts';
import type { CrewMemberView, SuitView } from '../../shared/contracts/crew.ts';
import type { ProfileComparison, ProfileVersionHeader, ProfileVersionView } from '../../shared/contracts/profile-version.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

// Response bodies as the web client reads them (components/api/use-crew.ts, use-suits.ts).
type MembersBody = { members: CrewMemberView[] };
type MemberBody = { member: CrewMemberView };
type CurrentBody = { member: CrewMemberView; current: ProfileVersionView };
type VersionsBody = { versions: ProfileVersionHeader[] };
type VersionBody = { version: ProfileVersionView };
type ComparisonBody = { comparison: ProfileComparison };
type SuitsBody = { suits: SuitView[] };
type SuitBody = { suit: SuitView };

const t = testAppForFile();
let planner: string;
let planner2: string;
let reviewer: string;
let reed: string; // trainee Tamsin Reed
beforeAll(async () => {
  planner = `Bearer ${await t.tokenFor('planner')}`;
  planner2 = `Bearer ${await t.tokenForEmail('pim.sorrel@lumen.example.test')}`;
  reviewer = `Bearer ${await t.tokenFor('reviewer')}`;
  reed = `Bearer ${await t.tokenForEmail(DEMO_PEOPLE.find((p) => p.crewKey === 'reed')!.email)}`;
});

const api = () => request(t.app);
// The raw pg pool behind Drizzle, to try writes the API never makes.
const pool = () => (t.ctx.db as unknown as { $client: { query: (text: string, values?: unknown[]) => Promise<unknown> } }).$client;
const baseInputs = { sex: 'female', stature: 1.7, mass: 62, suitId: null };

async function createMember(name: string) {
  const res = await api().post('/api/crew').set('Authorization', planner).send({ name, callSign: 'TEST' });
  expect(res.status).toBe(201);
  return bodyOf<MemberBody>(res).member.id;
}

describe('crew members and profile versions', () => {
  it('lists the seeded demo crew with their current versions, and searches by name or call sign', async () => {
    const all = await api().get('/api/crew').set('Authorization', reviewer);
    expect(all.status).toBe(200);
    const byName = Object.fromEntries(bodyOf<MembersBody>(all).members.map((m) => [m.name, m.currentVersion]));
    expect(byName).toMatchObject({ 'Tamsin Reed': 2, 'Bram Kettle': 1, 'Ilse Moss': 1 });
    const found = await api().get('/api/crew?q=badg').set('Authorization', reviewer);
    expect(bodyOf<MembersBody>(found).members.map((m: { name: string }) => m.name)).toEqual(['Bram Kettle']);
  });

  it('saves version 1 from inputs: derived body, summary, engine version, author, note; without a suit the mass is the input mass within the table rounding', async () => {
    const id = await createMember('Vera Lindqvist-Test');
    const saved = await api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 0, note: 'first', inputs: baseInputs });
    expect(saved.status).toBe(201);
    const v = bodyOf<VersionBody>(saved).version;
    expect(v).toMatchObject({ version: 1, current: true, note: 'first', source: 'regression', authorName: 'Orrin Vale' });
    expect(v.engineVersion).toMatch(/^\d+\.\d+\.\d+\+[0-9a-f]{12}$/);
    expect(v.body.segments).toHaveLength(15);
    // Segment masses are de Leva's (1996, Table 4) fractions of body mass; the published fractions
    // sum to 1 only within their rounding (0.01 % per entry, a few entries), so allow 0.05 %.
    expect(Math.abs(v.summary.mass - 62)).toBeLessThan(62 * 5e-4);
    expect(v.summary.segments.reduce((s: number, x: { mass: number }) => s + x.mass, 0)).toBeCloseTo(v.summary.mass, 9);
    // Standing, the long-axis moment is the smallest (Santschi, DuBois & Omoto 1963, AMRL-TDR-63-36).
    const [i1, i2, i3] = v.summary.principalMoments;
    expect(i1).toBeLessThan(i2);
    expect(i2).toBeLessThanOrEqual(i3);
  });

  it('a suit snapshot adds exactly the suit\'s mass and stays with the version', async () => {
    const suits = bodyOf<SuitsBody>(await api().get('/api/suits').set('Authorization', planner)).suits as { id: string; config: { id: string; segments: Record<string, { mass: number }> } }[];
    expect(suits.map((s) => s.config.id).sort()).toEqual(['cabin-clothing', 'pressurised-suit']);
    const suit = suits.find((s) => s.config.id === 'pressurised-suit')!;
    const added = Object.values(suit.config.segments).reduce((s, x) => s + x.mass, 0);
    const id = await createMember('Suited Test Person');
    const bare = bodyOf<VersionBody>(await api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 0, inputs: baseInputs })).version;
    const v = bodyOf<VersionBody>(await api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 1, inputs: { ...baseInputs, suitId: suit.id } })).version;
    expect(added).toBeGreaterThan(0);
    expect(v.summary.mass - bare.summary.mass).toBeCloseTo(added, 9);
    expect(v.inputs.suit?.id).toBe('pressurised-suit');
  });

  it('names the bad field of the inputs (400)', async () => {
    const id = await createMember('Bad Input Person');
    const res = await api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 0, inputs: { ...baseInputs, stature: 3.1 } });
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('inputs.stature');
    expect(apiError(res).message).toMatch(/at most 2.3 m/);
  });

  it('editing makes version N+1; old versions stay as they were and the database refuses to change them', async () => {
    const id = await createMember('Immutable Test');
    const v1 = bodyOf<VersionBody>(await api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 0, inputs: baseInputs })).version;
    const v2 = bodyOf<VersionBody>(await api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 1, note: 'mass drift', inputs: { ...baseInputs, mass: 60 } })).version;
    expect(v2.version).toBe(2);
    const again = bodyOf<VersionBody>(await api().get(`/api/crew/${id}/versions/1`).set('Authorization', planner)).version;
    expect(again.summary).toEqual(v1.summary);
    expect(again.current).toBe(false);
    const list = bodyOf<VersionsBody>(await api().get(`/api/crew/${id}/versions`).set('Authorization', planner)).versions;
    expect(list.map((x: { version: number; current: boolean }) => [x.version, x.current])).toEqual([[2, true], [1, false]]);
    await expect(pool().query('UPDATE profile_versions SET note = $1 WHERE id = $2', ['x', v1.id])).rejects.toThrow(/append-only: UPDATE refused/);
    await expect(pool().query('DELETE FROM profile_versions WHERE id = $1', [v1.id])).rejects.toThrow(/append-only: DELETE refused/);
  });

  it('a save on top of a version that is no longer the latest gets 409 and saves nothing', async () => {
    const id = await createMember('Concurrent Test');
    await api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 0, inputs: baseInputs });
    // Two planners open version 1; the first saves, the second's save is stale.
    const first = await api().post(`/api/crew/${id}/versions`).set('Authorization', planner2).send({ baseVersion: 1, inputs: { ...baseInputs, mass: 63 } });
    expect(first.status).toBe(201);
    const stale = await api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 1, inputs: { ...baseInputs, mass: 64 } });
    expect(stale.status).toBe(409);
    expect(apiError(stale).code).toBe('stale_version');
    expect(apiError(stale).message).toMatch(/started from version 1, but version 2 was saved by Pim Sorrel/);
    const list = bodyOf<VersionsBody>(await api().get(`/api/crew/${id}/versions`).set('Authorization', planner)).versions;
    expect(list).toHaveLength(2);
    expect(list[0].mass).toBeCloseTo(63, 1);
  });

  it('concurrent saves on the same base: exactly one wins, the other gets 409 (row lock, no lost update)', async () => {
    const id = await createMember('Race Test');
    await api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 0, inputs: baseInputs });
    const results = await Promise.all(
      [61, 62.5, 64, 65].map((mass) => api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 1, inputs: { ...baseInputs, mass } })),
    );
    expect(results.map((r) => r.status).sort()).toEqual([201, 409, 409, 409]);
    const list = bodyOf<VersionsBody>(await api().get(`/api/crew/${id}/versions`).set('Authorization', planner)).versions;
    expect(list.map((x: { version: number }) => x.version)).toEqual([2, 1]);
  });

  it('compares two versions side by side, flagging the changed input and derived values', async () => {
    const members = bodyOf<MembersBody>(await api().get('/api/crew?q=Tamsin').set('Authorization', planner)).members;
    const res = await api().get(`/api/crew/${members[0].id}/compare?a=1&b=2`).set('Authorization', planner);
    expect(res.status).toBe(200);
    const c = bodyOf<ComparisonBody>(res).comparison;
    const changed = (rows: { key: string; changed: boolean }[]) => rows.filter((r) => r.changed).map((r) => r.key);
    expect(changed(c.inputs)).toEqual(['inputs.mass']);
    expect(c.inputs.find((r: { key: string }) => r.key === 'inputs.mass')).toMatchObject({ a: 60.5, b: 59.1, unit: 'kg' });
    expect(changed(c.wholeBody)).toContain('whole.mass');
    expect(c.inputs.find((r) => r.key === 'inputs.stature')?.changed).toBe(false);
  });

  it('float noise around an exact zero is not a change: a mirror-symmetric body\'s lateral CoM stays "same"', async () => {
    const id = await createMember('Symmetry Test');
    await api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 0, inputs: { ...baseInputs, sex: 'male', stature: 1.74, mass: 71.5 } });
    await api().post(`/api/crew/${id}/versions`).set('Authorization', planner).send({ baseVersion: 1, inputs: { ...baseInputs, sex: 'male', stature: 1.74, mass: 69.8 } });
    const c = bodyOf<ComparisonBody>(await api().get(`/api/crew/${id}/compare?a=1&b=2`).set('Authorization', planner)).comparison;
    const comY = c.wholeBody.find((r) => r.key === 'whole.com.y')!;
    expect(Math.abs(comY.a as number)).toBeLessThan(1e-12);
    expect(Math.abs(comY.b as number)).toBeLessThan(1e-12);
    expect(comY.changed).toBe(false);
    expect(c.wholeBody.find((r) => r.key === 'whole.mass')?.changed).toBe(true);
  });

  it('exports the derived body as contract JSON, as a download', async () => {
    const members = bodyOf<MembersBody>(await api().get('/api/crew?q=Moss').set('Authorization', reviewer)).members;
    const res = await api().get(`/api/crew/${members[0].id}/versions/1/body.json`).set('Authorization', reviewer);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?ilse-moss-profile-v1-body\.json"?$/);
    const body = bodySchema.parse(JSON.parse(res.text));
    expect(body.segments[0]).toMatchObject({ name: 'upper_trunk' });
    expect(body.segments.find((s) => s.name === 'r_upper_arm')?.joint?.dofs.map((d) => d.name)).toEqual(['r_sh_flex', 'r_sh_abd', 'r_sh_rot']);
  });
});

describe('who may do what', () => {
  it('reviewers read but do not edit (403)', async () => {
    expect((await api().post('/api/crew').set('Authorization', reviewer).send({ name: 'X' })).status).toBe(403);
    const members = bodyOf<MembersBody>(await api().get('/api/crew').set('Authorization', reviewer)).members;
    const res = await api().post(`/api/crew/${members[0].id}/versions`).set('Authorization', reviewer).send({ baseVersion: 1, inputs: baseInputs });
    expect(res.status).toBe(403);
  });

  it('a trainee lists and reads only their own crew member; another member is 404, editing is 403', async () => {
    const mine = bodyOf<MembersBody>(await api().get('/api/crew').set('Authorization', reed)).members;
    expect(mine.map((m: { name: string }) => m.name)).toEqual(['Tamsin Reed']);
    expect(bodyOf<CurrentBody>(await api().get(`/api/crew/${mine[0].id}`).set('Authorization', reed)).current.version).toBe(2);
    const others = bodyOf<MembersBody>(await api().get('/api/crew').set('Authorization', planner)).members.filter((m: { name: string }) => m.name !== 'Tamsin Reed');
    for (const path of ['', '/versions', '/versions/1', '/versions/1/body.json', '/compare?a=1&b=1']) {
      const res = await api().get(`/api/crew/${others[0].id}${path}`).set('Authorization', reed);
      expect([path, res.status]).toEqual([path, 404]);
    }
    expect((await api().post(`/api/crew/${mine[0].id}/versions`).set('Authorization', reed).send({ baseVersion: 2, inputs: baseInputs })).status).toBe(403);
    expect((await api().post('/api/uploads/measurements').set('Authorization', reed).attach('file', Buffer.from('name\n'), 'a.csv')).status).toBe(403);
  });

  it('planners edit a suit configuration; its id stays fixed; reviewers may not edit', async () => {
    const suits = bodyOf<SuitsBody>(await api().get('/api/suits').set('Authorization', planner)).suits;
    const cabin = suits.find((s) => s.config.id === 'cabin-clothing')!;
    expect(cabin.version).toBe(1);
    const edited = { ...cabin.config, note: 'Edited in a test.', baseVersion: 1 };
    expect((await api().put(`/api/suits/${cabin.id}`).set('Authorization', reviewer).send(edited)).status).toBe(403);
    const ok = await api().put(`/api/suits/${cabin.id}`).set('Authorization', planner).send(edited);
    expect(ok.status).toBe(200);
    expect(bodyOf<SuitBody>(ok).suit.config.note).toBe('Edited in a test.');
    expect(bodyOf<SuitBody>(ok).suit.version).toBe(2);
    const renamed = await api().put(`/api/suits/${cabin.id}`).set('Authorization', planner).send({ ...edited, baseVersion: 2, id: 'other-id' });
    expect(renamed.status).toBe(400);
    expect(apiError(renamed).field).toBe('id');
    const noBase = await api().put(`/api/suits/${cabin.id}`).set('Authorization', planner).send(cabin.config);
    expect(noBase.status).toBe(400);
    expect(apiError(noBase).field).toBe('baseVersion');
  });

  it('two planners saving a suit from the same read: exactly one succeeds, the other gets 409 stale_version and nothing of theirs is stored', async () => {
    const suits = bodyOf<SuitsBody>(await api().get('/api/suits').set('Authorization', planner)).suits;
    const suit = suits.find((s) => s.config.id === 'pressurised-suit')!;
    const otherPlanner = `Bearer ${await t.tokenForEmail(DEMO_PEOPLE.filter((p) => p.role === 'planner')[1].email)}`;
    const [a, b] = await Promise.all([
      api().put(`/api/suits/${suit.id}`).set('Authorization', planner).send({ ...suit.config, note: 'first', baseVersion: suit.version }),
      api().put(`/api/suits/${suit.id}`).set('Authorization', otherPlanner).send({ ...suit.config, note: 'second', baseVersion: suit.version }),
    ]);
    const statuses = [a.status, b.status].sort();
    expect(statuses).toEqual([200, 409]);
    const loser = a.status === 409 ? a : b;
    const winner = a.status === 200 ? a : b;
    expect(apiError(loser).code).toBe('stale_version');
    expect(apiError(loser).message).toMatch(/Nothing was saved/);
    const after = bodyOf<SuitBody>(await api().get(`/api/suits/${suit.id}`).set('Authorization', planner)).suit;
    expect(after.version).toBe(suit.version + 1);
    expect(after.config.note).toBe(bodyOf<SuitBody>(winner).suit.config.note);
    // A later save from the old read is refused too.
    const late = await api().put(`/api/suits/${suit.id}`).set('Authorization', planner).send({ ...suit.config, note: 'late', baseVersion: suit.version });
    expect(late.status).toBe(409);
    expect(apiError(late).code).toBe('stale_version');
  });
});
