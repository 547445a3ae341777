import { expect, test } from '@playwright/test';

import type { SessionUser } from '../shared/contracts/auth.ts';
import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { apiErrorOf, jsonOf } from './support/response-json.ts';
import { signIn } from './support/sign-in.ts';

test('a trainee calling planner-only and admin-only API routes gets 403 with a JSON error', async ({ page }) => {
  await signIn(page, DEMO_BY_ROLE.trainee.email);
  // The page's session cookie rides along with page.request.
  const me = await page.request.get('/api/me');
  expect(me.status()).toBe(200);
  expect((await jsonOf<{ user: SessionUser }>(me)).user.role).toBe('trainee');

  // Uploads are for planners (and admins); the team list is for admins.
  for (const route of ['/api/uploads', '/api/team/users']) {
    const res = await page.request.get(route);
    expect(res.status(), route).toBe(403);
    // The body is an API error: a code and a message for people (the contract parse checks both are strings).
    const error = await apiErrorOf(res);
    expect(error.code, route).toEqual(expect.any(String));
    expect(error.message, route).toEqual(expect.any(String));
  }
});

test('a planner may call the planner-only route the trainee was refused', async ({ page }) => {
  await signIn(page, DEMO_BY_ROLE.planner.email);
  const res = await page.request.get('/api/uploads');
  expect(res.status()).toBe(200);
});
