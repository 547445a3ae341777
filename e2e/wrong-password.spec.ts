import { expect, test } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';

test('a wrong password shows a clear message and keeps the e-mail typed', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(DEMO_BY_ROLE.planner.email);
  await page.getByLabel('Password').fill('not-the-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toContainText('E-mail or password is not right.');
  await expect(page.getByLabel('E-mail')).toHaveValue(DEMO_BY_ROLE.planner.email);
  await expect(page).toHaveURL(/\/sign-in/);
});

test('an e-mail that is not an address is named beside the field without calling the server', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('ada.quill');
  await page.getByLabel('Password').fill('whatever-it-is');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByText('Enter a valid e-mail address.')).toBeVisible();
});
