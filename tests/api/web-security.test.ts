/**
 * Web security: the Origin check on cookie-authenticated changes, the development mailbox switch,
 * explicit proxy trust, sign-in limits per address and per account, password strength (zxcvbn-ts)
 * and profile access when compiling.
 */
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../db/seed/demo-people.ts';
import { contextGuesses } from '../../server/auth/password-strength.ts';
import { loadConfig } from '../../server/config.ts';
import type { SignInResponse } from '../../shared/contracts/auth.ts';
import { crewOf, PEOPLE, THREE_STEPS } from '../maneuvers/maneuver-api.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { startTestApp, type TestApp,testAppForFile } from '../support/test-app.ts';

const t = testAppForFile();
let cookie: string;
let bearer: string;
// The test app's PUBLIC_URL; its origin is one of ours.
const OWN = 'http://127.0.0.1:9';
const EVIL = 'https://holonaut-prizes.example';

beforeAll(async () => {
  const signIn = await request(t.app).post('/api/auth/sign-in').send({ email: PEOPLE.planner, password: DEMO_PASSWORD });
  cookie = String(signIn.headers['set-cookie']).split(';')[0];
  bearer = `Bearer ${bodyOf<SignInResponse>(signIn).token}`;
});

const baseEnv: NodeJS.ProcessEnv = { NODE_ENV: 'test', DATABASE_URL: 'postgres://x/y', JWT_SECRET: 'x'.repeat(32) };

describe('cross-site request forgery', () => {
  it('refuses a cookie-authenticated change from another origin or with no origin at all (403 cross_origin)', async () => {
    const foreign = await request(t.app).post('/api/sequences/compile').set('Cookie', cookie).set('Origin', EVIL).send({ primitives: THREE_STEPS });
    expect(foreign.status).toBe(403);
    expect(apiError(foreign).code).toBe('cross_origin');
    const viaReferer = await request(t.app).post('/api/sequences/compile').set('Cookie', cookie).set('Referer', `${EVIL}/win`).send({ primitives: THREE_STEPS });
    expect(viaReferer.status).toBe(403);
    const bare = await request(t.app).post('/api/sequences/compile').set('Cookie', cookie).send({ primitives: THREE_STEPS });
    expect(bare.status).toBe(403);
    // A cross-site multipart upload (a plain HTML form can send one) is refused before it is read.
    const upload = await request(t.app).post('/api/uploads/measurements').set('Cookie', cookie).set('Origin', EVIL)
      .attach('file', Buffer.from('name,sex,stature_m,mass_kg\nX,female,1.6,60\n'), 'crew.csv');
    expect(upload.status).toBe(403);
  });

  it('accepts the same change from our own origin (PUBLIC_URL or the server\'s own host)', async () => {
    const own = await request(t.app).post('/api/sequences/compile').set('Cookie', cookie).set('Origin', OWN).send({ primitives: THREE_STEPS });
    expect(own.status).toBe(200);
    const sameHost = await request(t.app).post('/api/sequences/compile').set('Cookie', cookie).set('Host', 'holonaut.lan:8080').set('Origin', 'http://holonaut.lan:8080').send({ primitives: THREE_STEPS });
    expect(sameHost.status).toBe(200);
    // Reads are never blocked.
    expect((await request(t.app).get('/api/me').set('Cookie', cookie).set('Origin', EVIL)).status).toBe(200);
  });

  it('exempts bearer-token requests (a foreign page cannot set that header)', async () => {
    const res = await request(t.app).post('/api/sequences/compile').set('Authorization', bearer).set('Origin', EVIL).send({ primitives: THREE_STEPS });
    expect(res.status).toBe(200);
  });

  it('a cross-site sign-out with the cookie is refused and the session survives', async () => {
    const signIn = await request(t.app).post('/api/auth/sign-in').send({ email: PEOPLE.reviewer, password: DEMO_PASSWORD });
    const c = String(signIn.headers['set-cookie']).split(';')[0];
    expect((await request(t.app).post('/api/me/sign-out').set('Cookie', c).set('Origin', EVIL)).status).toBe(403);
    expect((await request(t.app).get('/api/me').set('Cookie', c)).status).toBe(200);
    expect((await request(t.app).post('/api/me/sign-out').set('Cookie', c).set('Origin', OWN)).status).toBe(204);
    expect((await request(t.app).get('/api/me').set('Cookie', c)).status).toBe(401);
  });
});

describe('development mailbox', () => {
  it('is not served unless DEV_MAILBOX is set', async () => {
    expect((await request(t.app).get('/dev/mail.json')).status).toBe(404);
    expect((await request(t.app).get('/dev/mail')).status).toBe(404);
  });

  it('is served with DEV_MAILBOX=1 in development', async () => {
    const dev = await startTestApp({ seed: false, env: { DEV_MAILBOX: '1' } });
    try {
      const res = await request(dev.app).get('/dev/mail.json');
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ messages: [] });
    } finally {
      await dev.close();
    }
  });

  it('is refused at start with NODE_ENV=production', () => {
    expect(() => loadConfig({ ...baseEnv, NODE_ENV: 'production', DEV_MAILBOX: '1' })).toThrow(/DEV_MAILBOX/);
    expect(loadConfig({ ...baseEnv, NODE_ENV: 'production' }).DEV_MAILBOX).toBe(false);
  });
});

describe('proxy trust', () => {
  it('is off by default and parsed explicitly', () => {
    expect(loadConfig({ ...baseEnv, NODE_ENV: 'development' }).TRUST_PROXY).toBe(false);
    expect(loadConfig({ ...baseEnv, TRUST_PROXY: '1' }).TRUST_PROXY).toBe(1);
    expect(loadConfig({ ...baseEnv, TRUST_PROXY: 'loopback, 10.0.0.0/8' }).TRUST_PROXY).toEqual(['loopback', '10.0.0.0/8']);
    expect(() => loadConfig({ ...baseEnv, TRUST_PROXY: 'everyone' })).toThrow(/TRUST_PROXY/);
  });
});

describe('sign-in limits', () => {
  const fail = (app: TestApp['app'], email: string, forwardedFor?: string) => {
    const r = request(app).post('/api/auth/sign-in');
    if (forwardedFor) r.set('X-Forwarded-For', forwardedFor);
    return r.send({ email, password: 'not-the-password' }).then((res) => res.status);
  };

  it('per address: failures spread over many e-mails are limited, and a forged X-Forwarded-For does not reset the count', async () => {
    const app = await startTestApp({ seed: false, env: { SIGNIN_RATE_LIMIT: '3', SIGNIN_ACCOUNT_RATE_LIMIT: '100' } });
    try {
      const statuses = [];
      for (let i = 0; i < 5; i++) statuses.push(await fail(app.app, `person${i}@lumen.example.test`, `203.0.113.${i}`));
      expect(statuses).toEqual([401, 401, 401, 429, 429]);
    } finally {
      await app.close();
    }
  });

  it('per account: failures for one e-mail from many addresses are limited (behind a trusted proxy)', async () => {
    const app = await startTestApp({ env: { SIGNIN_RATE_LIMIT: '100', SIGNIN_ACCOUNT_RATE_LIMIT: '3', TRUST_PROXY: 'loopback' } });
    try {
      const email = DEMO_PEOPLE[0].email;
      const statuses = [];
      for (let i = 0; i < 4; i++) statuses.push(await fail(app.app, email, `198.51.100.${i}`));
      expect(statuses).toEqual([401, 401, 401, 429]);
      const locked = await request(app.app).post('/api/auth/sign-in').set('X-Forwarded-For', '198.51.100.99').send({ email, password: DEMO_PASSWORD });
      expect(locked.status).toBe(429);
      expect(locked.headers['retry-after']).toMatch(/^\d+$/);
      // Another account from the same addresses is unaffected.
      const other = await request(app.app).post('/api/auth/sign-in').set('X-Forwarded-For', '198.51.100.1').send({ email: DEMO_PEOPLE[1].email, password: DEMO_PASSWORD });
      expect(other.status).toBe(200);
    } finally {
      await app.close();
    }
  });

  it('successful sign-ins do not count', async () => {
    const app = await startTestApp({ env: { SIGNIN_RATE_LIMIT: '2', SIGNIN_ACCOUNT_RATE_LIMIT: '2' } });
    try {
      for (let i = 0; i < 4; i++) {
        expect((await request(app.app).post('/api/auth/sign-in').send({ email: DEMO_PEOPLE[0].email, password: DEMO_PASSWORD })).status).toBe(200);
      }
    } finally {
      await app.close();
    }
  });
});

describe('password strength (zxcvbn-ts)', () => {
  const invite = async (email: string, name: string) => {
    const admin = `Bearer ${await t.tokenFor('admin')}`;
    const waiting = t.mail.waitFor(email);
    expect((await request(t.app).post('/api/team/invitations').set('Authorization', admin).send({ email, name, role: 'trainee' })).status).toBe(201);
    return /\/invite\/([A-Za-z0-9_-]+)/.exec((await waiting).text)![1];
  };

  it('refuses common, repetitive and personal passwords for a new account with a clear message, then accepts a strong one', async () => {
    const token = await invite('quill.marrow@lumen.example.test', 'Quill Marrow');
    for (const weak of ['aaaaaaaaaaaa', 'password1234', 'qwertyuiop12', 'quill.marrow@lumen.example.test', 'QuillMarrow2026', 'holonaut-holonaut']) {
      const res = await request(t.app).post(`/api/invitations/${token}/accept`).send({ password: weak });
      expect(res.status, weak).toBe(400);
      expect(apiError(res)).toMatchObject({ code: 'weak_password', field: 'password' });
      expect(apiError(res).message).toMatch(/^This password is too easy to guess\./);
    }
    const ok = await request(t.app).post(`/api/invitations/${token}/accept`).send({ password: 'Tidal-Quorum-Lichen-58' });
    expect(ok.status).toBe(201);
  });

  it('checks a changed password against the person\'s own name and e-mail', async () => {
    const trainee = DEMO_PEOPLE.filter((p) => p.role === 'trainee')[2];
    const token = `Bearer ${await t.tokenForEmail(trainee.email)}`;
    const [first] = trainee.name.split(' ');
    const weak = await request(t.app).post('/api/me/password').set('Authorization', token).send({ currentPassword: DEMO_PASSWORD, newPassword: `${first}${first}1234` });
    expect(weak.status).toBe(400);
    expect(apiError(weak)).toMatchObject({ code: 'weak_password', field: 'newPassword' });
    // The demo password still signs in (demo accounts are seeded, not set through this check).
    expect((await request(t.app).post('/api/auth/sign-in').send({ email: trainee.email, password: DEMO_PASSWORD })).status).toBe(200);
  });

  it('context guesses include the e-mail, its parts and the name', () => {
    expect(contextGuesses({ email: 'Nova.Tern@lumen.example.test', name: 'Nova Tern' })).toEqual(
      expect.arrayContaining(['nova.tern@lumen.example.test', 'nova', 'tern', 'lumen', 'nova tern', 'holonaut']),
    );
  });
});

describe('compiling against a profile', () => {
  it('a trainee compiles against their own profile only (another member\'s answers 404, like an unknown one)', async () => {
    const own = await crewOf(t, PEOPLE.trainee);
    const other = await crewOf(t, PEOPLE.otherTrainee);
    const token = `Bearer ${await t.tokenForEmail(PEOPLE.trainee)}`;
    expect((await request(t.app).post('/api/sequences/compile').set('Authorization', token).send({ primitives: THREE_STEPS, crewMemberId: own })).status).toBe(200);
    const foreign = await request(t.app).post('/api/sequences/compile').set('Authorization', token).send({ primitives: THREE_STEPS, crewMemberId: other });
    expect(foreign.status).toBe(404);
    // Staff read every profile and compile against it.
    expect((await request(t.app).post('/api/sequences/compile').set('Authorization', bearer).send({ primitives: THREE_STEPS, crewMemberId: other })).status).toBe(200);
  });
});
