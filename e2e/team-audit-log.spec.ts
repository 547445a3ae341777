import { expect, test } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { signIn } from './support/sign-in.ts';

test('an admin filters the audit log by action and opens an event', async ({ page }) => {
  await signIn(page, DEMO_BY_ROLE.admin.email);
  await page.getByRole('tab', { name: 'Team' }).click();
  await page.getByRole('radio', { name: 'Audit log' }).click();
  const events = page.getByRole('list', { name: 'Audit events' });
  await expect(events.getByRole('button').first()).toBeVisible();

  await page.getByLabel('Action').selectOption('auth.sign_in');
  await page.getByRole('button', { name: 'Apply filters' }).click();
  await expect(events.getByRole('button', { name: /^auth\.sign_in by / }).first()).toBeVisible();
  await expect(events.getByRole('button', { name: /^(?!auth\.sign_in by )/ })).toHaveCount(0);

  // A malformed date is named beside its field and nothing is sent.
  await page.getByLabel('From (UTC day)').fill('yesterday');
  await page.getByRole('button', { name: 'Apply filters' }).click();
  await expect(page.getByText('Use a date like 2025-03-14.')).toBeVisible();

  await events.getByRole('button', { name: new RegExp(`^auth\\.sign_in by ${DEMO_BY_ROLE.admin.email}`) }).first().click();
  await expect(page.getByRole('heading', { name: 'Signed in' })).toBeVisible();
  await expect(page.getByText(`${DEMO_BY_ROLE.admin.name} signed in`).first()).toBeVisible();
  await expect(page.getByText(DEMO_BY_ROLE.admin.email).last()).toBeVisible();
});
