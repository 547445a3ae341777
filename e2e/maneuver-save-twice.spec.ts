import { expect, test } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { newManeuver, saveOnePauseVersion } from './support/maneuvers.ts';
import { PHONE, signedInPage } from './support/sign-in.ts';

test('a planner saves a new maneuver, edits it at once and saves again: version 2, no false conflict', async ({ browser, baseURL }) => {
  test.setTimeout(120_000);
  const page = await signedInPage(browser, baseURL, PHONE, DEMO_BY_ROLE.planner.email);
  const sequenceId = await newManeuver(page, baseURL!, `Save twice ${Date.now()}`);
  await saveOnePauseVersion(page, sequenceId, 1, 60_000);

  // Straight away (the sequence's version list may still be refetching), change the step and save.
  await page.getByRole('radio', { name: /^Steps/ }).click();
  await page.getByRole('button', { name: 'Edit step 1' }).click();
  const sheet = page.getByRole('dialog', { name: 'Edit step 1' });
  await sheet.getByRole('textbox', { name: 'Duration', exact: true }).fill('2');
  await sheet.getByRole('button', { name: 'Apply step' }).click();
  await page.getByTestId('save-verify').click();
  await expect(page.getByText(/^Showing version 2 of 2/)).toBeVisible({ timeout: 60_000 });
  await expect(page.getByText('Someone saved a newer version')).toHaveCount(0);
  await page.context().close();
});
