import { expect, test } from '@playwright/test';

import { apiErrorOf } from './support/response-json.ts';

// The served product answers: the web app's HTML, the JSON API errors and the dev mailbox.
test('serves the web app, the API and the development mailbox', async ({ page, request }) => {
  const health = await request.get('/healthz');
  expect(await health.json()).toEqual({ ok: true });
  const api = await request.get('/api/me');
  expect(api.status()).toBe(401);
  expect((await apiErrorOf(api)).code).toBe('unauthorized');
  await page.goto('/dev/mail');
  await expect(page.getByRole('heading', { name: 'Development mailbox' })).toBeVisible();
  await page.goto('/');
  await expect(page).toHaveTitle(/Holonaut/i);
});

// The product's own icon (assets/, named in app.json) ships with the web build: favicon and the sign-in mark.
test('the web build ships the favicon and the app icon', async ({ page, request }) => {
  const favicon = await request.get('/favicon.ico');
  expect(favicon.status()).toBe(200);
  expect((await favicon.body()).length).toBeGreaterThan(1000);
  await page.goto('/sign-in');
  const icon = page.getByRole('img', { name: 'Holonaut' }).locator('img').first();
  await expect(icon).toHaveAttribute('src', /icon/);
  const src = (await icon.getAttribute('src')) ?? '';
  const res = await request.get(src);
  expect(res.status()).toBe(200);
  expect(res.headers()['content-type']).toContain('image/png');
});
