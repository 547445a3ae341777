import { expect, test } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { signIn } from './support/sign-in.ts';

test('a planner saves a new maneuver, edits it at once and saves again: version 2, no false conflict', async ({ browser, baseURL }) => {
  test.setTimeout(120_000);
  const ctx = await browser.newContext({ baseURL, viewport: { width: 375, height: 812 } });
  const page = await ctx.newPage();
  await signIn(page, DEMO_BY_ROLE.planner.email);

  // A sequence with no version yet, made through the API.
  const { members } = (await (await page.request.get('/api/crew')).json()) as { members: { id: string; currentVersion: number | null }[] };
  const member = members.find((m) => m.currentVersion != null);
  expect(member, 'a crew member with a profile').toBeTruthy();
  // A cookie-authenticated change from outside the page names our origin, as a browser would.
  const created = await page.request.post('/api/sequences', {
    headers: { Origin: baseURL! },
    data: { crewMemberId: member!.id, name: `Save twice ${Date.now()}`, target: { mode: 'ypr', yprDeg: { yaw: 0, pitch: 0, roll: 0 } } },
  });
  expect(created.status()).toBe(201);
  const sequence = (await created.json()) as { id: string };

  await page.goto(`/maneuvers/${sequence.id}`);
  await page.getByRole('button', { name: 'Add step' }).first().click();
  let sheet = page.getByRole('dialog', { name: 'New step 1' });
  await sheet.getByLabel('Step 1 kind').selectOption('pause');
  await sheet.getByRole('textbox', { name: 'Duration', exact: true }).fill('1');
  await sheet.getByRole('button', { name: 'Add step' }).click();
  await page.getByTestId('save-verify').click();
  await expect(page.getByTestId('verification-report')).toBeVisible({ timeout: 60_000 });

  // Straight away (the sequence's version list may still be refetching), change the step and save.
  await page.getByRole('radio', { name: /^Steps/ }).click();
  await page.getByRole('button', { name: 'Edit step 1' }).click();
  sheet = page.getByRole('dialog', { name: 'Edit step 1' });
  await sheet.getByRole('textbox', { name: 'Duration', exact: true }).fill('2');
  await sheet.getByRole('button', { name: 'Apply step' }).click();
  await page.getByTestId('save-verify').click();
  await expect(page.getByText(/^Showing version 2 of 2/)).toBeVisible({ timeout: 60_000 });
  await expect(page.getByText('Someone saved a newer version')).toHaveCount(0);
  await ctx.close();
});
