import request from 'supertest';
import { describe, expect, it } from 'vitest';

import { ACCESS_POLICY } from '../../server/auth/access-policy.ts';
import { API_AREAS } from '../../server/routes/api-routes.ts';
import { ROLES } from '../../shared/contracts/roles.ts';
import { apiError } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

const t = testAppForFile();

describe('the API guard', () => {
  it.each(API_AREAS.map((a) => a.path))('rejects %s without a token (401)', async (mount) => {
    const res = await request(t.app).get(`/api${mount}`);
    expect(res.status).toBe(401);
    expect(apiError(res).code).toBe('unauthorized');
  });

  it.each(API_AREAS.map((a) => a.path))('rejects %s with a garbage token (401)', async (mount) => {
    const res = await request(t.app).post(`/api${mount}`).set('Authorization', 'Bearer not.a.jwt').send({});
    expect(res.status).toBe(401);
  });

  it('answers 403 to every role outside an area\'s policy, on every area', async () => {
    for (const { area, path } of API_AREAS) {
      for (const role of ROLES) {
        if ((ACCESS_POLICY[area] as readonly string[]).includes(role)) continue;
        const res = await request(t.app).get(`/api${path}`).set('Authorization', `Bearer ${await t.tokenFor(role)}`);
        expect({ path, role, status: res.status }).toEqual({ path, role, status: 403 });
      }
    }
  });

  it('a trainee gets 403 from the admin-only team route', async () => {
    const res = await request(t.app).get('/api/team/users').set('Authorization', `Bearer ${await t.tokenFor('trainee')}`);
    expect(res.status).toBe(403);
    expect(apiError(res).code).toBe('forbidden');
  });

  it('an unknown API path is a JSON 404', async () => {
    const res = await request(t.app).get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(apiError(res).code).toBe('not_found');
  });
});
