import { expect, test } from '@playwright/test';

// The served product answers: the web app's HTML, the JSON API errors and the dev mailbox.
test('serves the web app, the API and the development mailbox', async ({ page, request }) => {
  const health = await request.get('/healthz');
  expect(await health.json()).toEqual({ ok: true });
  const api = await request.get('/api/me');
  expect(api.status()).toBe(401);
  expect((await api.json()).error.code).toBe('unauthorized');
  await page.goto('/dev/mail');
  await expect(page.getByRole('heading', { name: 'Development mailbox' })).toBeVisible();
  await page.goto('/');
  await expect(page).toHaveTitle(/Holonaut/i);
});
