import { expect, test } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { signIn } from './support/sign-in.ts';

test('a trainee calling planner-only and admin-only API routes gets 403 with a JSON error', async ({ page }) => {
  await signIn(page, DEMO_BY_ROLE.trainee.email);
  // The page's session cookie rides along with page.request.
  const me = await page.request.get('/api/me');
  expect(me.status()).toBe(200);
  expect((await me.json()).user.role).toBe('trainee');

  // Uploads are for planners (and admins); the team list is for admins.
  for (const route of ['/api/uploads', '/api/team/users']) {
    const res = await page.request.get(route);
    expect(res.status(), route).toBe(403);
    const body = await res.json();
    expect(body.error.code, route).toEqual(expect.any(String));
    expect(body.error.message, route).toEqual(expect.any(String));
  }
});

test('a planner may call the planner-only route the trainee was refused', async ({ page }) => {
  await signIn(page, DEMO_BY_ROLE.planner.email);
  const res = await page.request.get('/api/uploads');
  expect(res.status()).toBe(200);
});
