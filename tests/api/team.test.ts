import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { DEMO_PEOPLE } from '../../db/seed/demo-people.ts';
import type { SessionUser, SignInResponse } from '../../shared/contracts/auth.ts';
import type { CrewMemberView } from '../../shared/contracts/crew.ts';
import type { AuditEvent, TeamMember } from '../../shared/contracts/team.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

// Response bodies as the web client reads them.
type UserBody = { user: SessionUser };
type TeamMemberBody = { user: TeamMember };
type UsersBody = { users: TeamMember[] };
type MembersBody = { members: CrewMemberView[] };
type EventsBody = { events: AuditEvent[] };

const t = testAppForFile();
let admin: string;
beforeAll(async () => {
  admin = `Bearer ${await t.tokenFor('admin')}`;
});

const linkIn = (text: string) => /\/invite\/([A-Za-z0-9_-]+)/.exec(text)?.[1];

describe('invitations', () => {
  it('invites by e-mail; the invitee previews, sets a password and is signed in', async () => {
    const email = 'nova.tern@lumen.example.test';
    const waiting = t.mail.waitFor(email);
    const inv = await request(t.app).post('/api/team/invitations').set('Authorization', admin).send({ email, name: 'Nova Tern', role: 'planner' });
    expect(inv.status).toBe(201);
    const mail = await waiting;
    expect(mail.subject).toBe('Your Holonaut invitation');
    const token = linkIn(mail.text);
    expect(token).toBeTruthy();

    const preview = await request(t.app).get(`/api/invitations/${token}`);
    expect(preview.body).toEqual({ email, name: 'Nova Tern', role: 'planner' });

    const short = await request(t.app).post(`/api/invitations/${token}/accept`).send({ password: 'short' });
    expect(short.status).toBe(400);
    expect(apiError(short).field).toBe('password');

    const accepted = await request(t.app).post(`/api/invitations/${token}/accept`).send({ password: 'correct-horse-battery' });
    expect(accepted.status).toBe(201);
    expect(bodyOf<UserBody>(accepted).user).toMatchObject({ email, role: 'planner' });
    const me = await request(t.app).get('/api/me').set('Authorization', `Bearer ${bodyOf<SignInResponse>(accepted).token}`);
    expect(bodyOf<UserBody>(me).user.email).toBe(email);

    const reused = await request(t.app).post(`/api/invitations/${token}/accept`).send({ password: 'correct-horse-battery' });
    expect(reused.status).toBe(404);
    expect(apiError(reused).code).toBe('invitation_invalid');
  });

  it('refuses to invite an e-mail that already has an account (409)', async () => {
    const res = await request(t.app).post('/api/team/invitations').set('Authorization', admin).send({ email: DEMO_PEOPLE[1].email, name: 'X', role: 'planner' });
    expect(res.status).toBe(409);
  });

  it('names the bad field of an invitation (400)', async () => {
    const res = await request(t.app).post('/api/team/invitations').set('Authorization', admin).send({ email: 'a@b.test', name: 'X', role: 'captain' });
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('role');
  });
});

describe('user administration', () => {
  it('changes a role and disables a user; the disabled user\'s token stops working', async () => {
    const users = bodyOf<UsersBody>(await request(t.app).get('/api/team/users').set('Authorization', admin)).users as { id: string; email: string }[];
    const trainee = DEMO_PEOPLE.filter((p) => p.role === 'trainee')[2];
    const target = users.find((u) => u.email === trainee.email)!;
    const token = await t.tokenForEmail(trainee.email);

    const role = await request(t.app).patch(`/api/team/users/${target.id}`).set('Authorization', admin).send({ role: 'reviewer' });
    expect(bodyOf<TeamMemberBody>(role).user.role).toBe('reviewer');
    const off = await request(t.app).patch(`/api/team/users/${target.id}`).set('Authorization', admin).send({ disabled: true });
    expect(bodyOf<TeamMemberBody>(off).user.disabled).toBe(true);
    expect((await request(t.app).get('/api/me').set('Authorization', `Bearer ${token}`)).status).toBe(401);
    const signIn = await request(t.app).post('/api/auth/sign-in').send({ email: trainee.email, password: 'lumen-ring-demo' });
    expect(signIn.status).toBe(401);
    expect(apiError(signIn).message).toMatch(/disabled/);
  });

  it('every action is in the audit log, filterable by action', async () => {
    const res = await request(t.app).get('/api/audit?action=team.update_user').set('Authorization', admin);
    expect(res.status).toBe(200);
    expect(bodyOf<EventsBody>(res).events.length).toBe(2);
    expect(bodyOf<EventsBody>(res).events.every((e: { action: string }) => e.action === 'team.update_user')).toBe(true);
    // names for a readable log: who did it and to whom, not only ids
    const admin1 = DEMO_PEOPLE.find((p) => p.role === 'admin')!;
    const trainee = DEMO_PEOPLE.filter((p) => p.role === 'trainee')[2];
    expect(bodyOf<EventsBody>(res).events[0]).toMatchObject({ actorName: admin1.name, objectType: 'user', objectLabel: trainee.name });
  });

  it('links a trainee to another crew member without signing them out; an unknown crew member is named (400)', async () => {
    const users = bodyOf<UsersBody>(await request(t.app).get('/api/team/users').set('Authorization', admin)).users as { id: string; email: string; crewMemberId: string | null }[];
    const trainee = DEMO_PEOPLE.filter((p) => p.role === 'trainee')[1];
    const target = users.find((u) => u.email === trainee.email)!;
    const token = `Bearer ${await t.tokenForEmail(trainee.email)}`;
    const members = bodyOf<MembersBody>(await request(t.app).get('/api/crew').set('Authorization', admin)).members as { id: string; name: string }[];
    const other = members.find((m) => m.id !== target.crewMemberId)!;

    const linked = await request(t.app).patch(`/api/team/users/${target.id}`).set('Authorization', admin).send({ crewMemberId: other.id });
    expect(linked.status).toBe(200);
    expect(bodyOf<TeamMemberBody>(linked).user.crewMemberId).toBe(other.id);
    // The same token still works and now reads exactly the newly linked member.
    const seen = await request(t.app).get('/api/crew').set('Authorization', token);
    expect(seen.status).toBe(200);
    expect(bodyOf<MembersBody>(seen).members.map((m: { id: string }) => m.id)).toEqual([other.id]);

    const unknown = await request(t.app).patch(`/api/team/users/${target.id}`).set('Authorization', admin).send({ crewMemberId: '00000000-0000-4000-8000-000000000000' });
    expect(unknown.status).toBe(400);
    expect(apiError(unknown).field).toBe('crewMemberId');
  });

  it('the audit log refuses UPDATE and DELETE at the database', async () => {
    await expect(t.pool.query("UPDATE audit_events SET action = 'x'")).rejects.toThrow(/append-only: UPDATE refused/);
    await expect(t.pool.query('DELETE FROM audit_events')).rejects.toThrow(/append-only: DELETE refused/);
  });
});
