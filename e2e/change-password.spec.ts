import { expect, request as playwrightRequest, test } from '@playwright/test';

import { DEMO_BY_ROLE, DEMO_PASSWORD } from './support/demo-accounts.ts';
import { invitationPathFor } from './support/mailbox.ts';
import { signIn } from './support/sign-in.ts';

test('a person changes their password from the account menu, is signed out, and signs in with the new one', async ({ page, baseURL }) => {
  // A fresh reviewer of this test's own (invited through the API), so no demo account changes.
  const email = `sol.marrow.${Date.now()}@lumen.example.test`;
  const first = 'first-password-77';
  const second = 'second-password-88';
  // Cookie-authenticated changes must name our origin (the server refuses cross-site ones).
  const admin = await playwrightRequest.newContext({ baseURL, extraHTTPHeaders: { Origin: baseURL! } });
  expect((await admin.post('/api/auth/sign-in', { data: { email: DEMO_BY_ROLE.admin.email, password: DEMO_PASSWORD } })).status()).toBe(200);
  expect((await admin.post('/api/team/invitations', { data: { email, name: 'Sol Marrow', role: 'reviewer' } })).status()).toBe(201);
  const token = (await invitationPathFor(admin, email)).split('/').pop();
  expect((await admin.post(`/api/invitations/${token}/accept`, { data: { password: first } })).status()).toBe(201);
  await admin.dispose();

  await signIn(page, email, first);
  await page.getByRole('button', { name: /^Account menu for / }).click();
  await page.getByRole('menuitem', { name: 'Change password' }).click();
  const dialog = page.getByRole('dialog', { name: 'Change password' });

  // A wrong current password is named beside its field; what was typed stays.
  await dialog.getByLabel('Current password').fill('not-my-password');
  await dialog.getByLabel('New password', { exact: true }).fill(second);
  await dialog.getByLabel('Repeat new password').fill(second);
  await dialog.getByRole('button', { name: 'Change password' }).click();
  await expect(dialog.getByText('The current password is not right.')).toBeVisible();
  await expect(dialog.getByLabel('New password', { exact: true })).toHaveValue(second);

  await dialog.getByLabel('Current password').fill(first);
  await dialog.getByRole('button', { name: 'Change password' }).click();
  await expect(page.getByText('Password changed. Sign in with your new password.')).toBeVisible();

  await signIn(page, email, second);
  await expect(page.getByRole('button', { name: 'Account menu for Sol Marrow' })).toBeVisible();
});
