import { expect, type Page, test } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { newManeuver } from './support/maneuvers.ts';
import { PHONE, signedInPage, WIDE } from './support/sign-in.ts';

/** A fresh maneuver made through the API (so that this spec leaves the demo maneuvers alone), with one saved draft. */
async function draftManeuver(page: Page, baseURL: string, name: string): Promise<string> {
  const id = await newManeuver(page, baseURL, name, { yaw: 10, pitch: 0, roll: 0 });
  const saved = await page.request.post(`/api/sequences/${id}/versions`, { headers: { Origin: baseURL }, data: { primitives: [{ kind: 'pause', durationS: 1 }], baseVersion: 0 } });
  expect(saved.status()).toBe(201);
  return id;
}

test('a planner deletes a draft maneuver, and archives and restores another, at phone size', async ({ browser, baseURL }) => {
  test.setTimeout(120_000);
  const page = await signedInPage(browser, baseURL, PHONE, DEMO_BY_ROLE.planner.email);
  const stamp = Date.now();

  // Delete: only offered while nothing went to review; asks first; leaves for the list.
  const doomed = await draftManeuver(page, baseURL!, `Scratch draft ${stamp}`);
  await page.goto(`/maneuvers/${doomed}`);
  await page.getByRole('button', { name: `Delete Scratch draft ${stamp}` }).click();
  await expect(page.getByText(`Delete “Scratch draft ${stamp}” for good?`)).toBeVisible();
  await page.getByRole('button', { name: 'Delete', exact: true }).click();
  await expect(page).toHaveURL(/\/maneuvers$/);
  expect((await page.request.get(`/api/sequences/${doomed}`)).status()).toBe(404);

  // Archive: out of the list in use, into the archived one, read-only there; Restore brings it back.
  const name = `Shelved turn ${stamp}`;
  const kept = await draftManeuver(page, baseURL!, name);
  await page.goto(`/maneuvers/${kept}`);
  await page.getByRole('button', { name: `Archive ${name}` }).click();
  await page.getByRole('button', { name: 'Archive', exact: true }).click();
  await expect(page.getByTestId('archived-notice')).toBeVisible();
  await expect(page.getByTestId('save-verify')).toHaveCount(0);
  await page.screenshot({ path: test.info().outputPath('archived-maneuver-375.png'), fullPage: false });

  await page.goto('/maneuvers');
  await expect(page.getByRole('list', { name: 'Maneuvers' })).toBeVisible();
  await expect(page.getByText(name)).toHaveCount(0);
  await page.getByRole('radio', { name: 'Archived' }).click();
  await expect(page.getByText(name)).toBeVisible();
  await page.getByText(name).click();
  await page.getByRole('button', { name: 'Restore' }).click();
  await expect(page.getByTestId('archived-notice')).toHaveCount(0);
  await expect(page.getByRole('button', { name: `Archive ${name}` })).toBeVisible();
  await page.context().close();
});

test('a planner archives and restores a crew member on a wide screen', async ({ browser, baseURL }) => {
  test.setTimeout(90_000);
  const page = await signedInPage(browser, baseURL, WIDE, DEMO_BY_ROLE.planner.email);
  const name = `Rill Archway ${Date.now()}`;
  const created = await page.request.post('/api/crew', { headers: { Origin: baseURL! }, data: { name, callSign: 'ARCH' } });
  expect(created.status()).toBe(201);
  const { member } = (await created.json()) as { member: { id: string } };

  await page.goto(`/crew?member=${member.id}`);
  await page.getByRole('button', { name: `Archive ${name}` }).click();
  await page.getByRole('button', { name: 'Archive', exact: true }).click();
  await expect(page.getByTestId('archived-notice')).toBeVisible();
  await expect(page.getByRole('radio', { name: /Create profile|Edit/ })).toHaveCount(0);
  const list = page.getByRole('list', { name: 'Crew members' });
  await expect(list.getByText(name)).toHaveCount(0);
  await page.getByRole('radio', { name: 'Archived' }).click();
  await expect(list.getByText(name)).toBeVisible();
  await page.screenshot({ path: test.info().outputPath('archived-crew-1280.png'), fullPage: false });
  await page.getByRole('button', { name: 'Restore' }).click();
  await expect(page.getByTestId('archived-notice')).toHaveCount(0);
  await expect(page.getByRole('radio', { name: 'Create profile' })).toBeVisible();
  await page.context().close();
});
