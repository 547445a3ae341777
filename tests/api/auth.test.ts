import request from 'supertest';
import { describe, expect, it } from 'vitest';

import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../db/seed/demo-people.ts';
import type { ApiErrorBody } from '../../shared/contracts/api-error.ts';
import type { SessionUser, SignInResponse } from '../../shared/contracts/auth.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { startTestApp, testAppForFile } from '../support/test-app.ts';

// Response bodies as the web client reads them.
type UserBody = { user: SessionUser };

const t = testAppForFile();

const planner = DEMO_PEOPLE.find((p) => p.role === 'planner')!;

describe('sign-in', () => {
  it('returns the user, a bearer token and an httpOnly SameSite=Strict cookie', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: planner.email, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(bodyOf<UserBody>(res).user).toMatchObject({ email: planner.email, role: 'planner', name: planner.name });
    expect(bodyOf<UserBody>(res).user).not.toHaveProperty('passwordHash');
    expect(typeof bodyOf<SignInResponse>(res).token).toBe('string');
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/holonaut_session=/);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Strict/);
  });

  it('accepts the e-mail in any case and with surrounding spaces', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: `  ${planner.email.toUpperCase()} `, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
  });

  it('refuses a wrong password with 401 and a clear message', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: planner.email, password: 'wrong-password' });
    expect(res.status).toBe(401);
    expect(bodyOf<ApiErrorBody>(res).error).toEqual({ code: 'unauthorized', message: 'E-mail or password is not right.' });
  });

  it('refuses an unknown e-mail with the same message as a wrong password', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: 'nobody@lumen.example.test', password: 'whatever' });
    expect(res.status).toBe(401);
    expect(apiError(res).message).toBe('E-mail or password is not right.');
  });

  it('names the field of a malformed body (400)', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: 'not-an-email', password: 'x' });
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('email');
  });

  it('answers invalid JSON with 400 malformed_json', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').set('content-type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(apiError(res).code).toBe('malformed_json');
  });
});

describe('sessions', () => {
  it('accepts the cookie as well as the bearer header', async () => {
    const signIn = await request(t.app).post('/api/auth/sign-in').send({ email: planner.email, password: DEMO_PASSWORD });
    const cookie = String(signIn.headers['set-cookie']).split(';')[0];
    const res = await request(t.app).get('/api/me').set('Cookie', cookie);
    expect(res.status).toBe(200);
    expect(bodyOf<UserBody>(res).user.email).toBe(planner.email);
  });

  it('rejects a tampered token with 401', async () => {
    const token = await t.tokenFor('planner');
    const res = await request(t.app).get('/api/me').set('Authorization', `Bearer ${token.slice(0, -2)}xx`);
    expect(res.status).toBe(401);
  });

  it('sign-out revokes every token issued before it', async () => {
    const trainee = DEMO_PEOPLE.find((p) => p.role === 'trainee')!;
    const first = bodyOf<SignInResponse>(await request(t.app).post('/api/auth/sign-in').send({ email: trainee.email, password: DEMO_PASSWORD })).token;
    const second = bodyOf<SignInResponse>(await request(t.app).post('/api/auth/sign-in').send({ email: trainee.email, password: DEMO_PASSWORD })).token;
    expect((await request(t.app).post('/api/me/sign-out').set('Authorization', `Bearer ${first}`)).status).toBe(204);
    expect((await request(t.app).get('/api/me').set('Authorization', `Bearer ${second}`)).status).toBe(401);
  });

  it('a password change revokes old tokens and the new password works', async () => {
    const other = DEMO_PEOPLE.filter((p) => p.role === 'trainee')[1];
    const token = bodyOf<SignInResponse>(await request(t.app).post('/api/auth/sign-in').send({ email: other.email, password: DEMO_PASSWORD })).token;
    const wrong = await request(t.app).post('/api/me/password').set('Authorization', `Bearer ${token}`).send({ currentPassword: 'nope', newPassword: 'a-new-password-1' });
    expect(wrong.status).toBe(400);
    expect(apiError(wrong).field).toBe('currentPassword');
    const ok = await request(t.app).post('/api/me/password').set('Authorization', `Bearer ${token}`).send({ currentPassword: DEMO_PASSWORD, newPassword: 'a-new-password-1' });
    expect(ok.status).toBe(204);
    expect((await request(t.app).get('/api/me').set('Authorization', `Bearer ${token}`)).status).toBe(401);
    const again = await request(t.app).post('/api/auth/sign-in').send({ email: other.email, password: 'a-new-password-1' });
    expect(again.status).toBe(200);
  });
});

describe('sign-in rate limit', () => {
  it('answers 429 after the configured number of attempts for one e-mail', async () => {
    const limited = await startTestApp({ env: { SIGNIN_RATE_LIMIT: '3' }, seed: false });
    try {
      const body = { email: 'someone@lumen.example.test', password: 'x' };
      const statuses = [];
      for (let i = 0; i < 4; i++) statuses.push((await request(limited.app).post('/api/auth/sign-in').send(body)).status);
      expect(statuses).toEqual([401, 401, 401, 429]);
    } finally {
      await limited.close();
    }
  });
});
