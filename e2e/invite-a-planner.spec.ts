import { expect, test } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { invitationPathFor } from './support/mailbox.ts';
import { signIn, visibleTabNames } from './support/sign-in.ts';

test('an admin invites a planner; the invitee follows the e-mailed link, sets a password and is signed in', async ({ page, browser }) => {
  const email = `wren.halloway.${Date.now()}@lumen.example.test`;
  const name = 'Wren Halloway';
  const password = 'orbit-lattice-42';

  await signIn(page, DEMO_BY_ROLE.admin.email);
  await page.getByRole('tab', { name: 'Team' }).click();
  await page.getByRole('button', { name: 'Invite', exact: true }).click();
  const form = page.getByRole('form', { name: 'Invite someone' });
  await form.getByLabel('Name').fill(name);
  await form.getByLabel('E-mail').fill(email);
  await form.getByRole('radio', { name: 'Planner' }).click();
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByText(`Invitation sent to ${email}.`)).toBeVisible();
  await expect(page.getByText(`${email} — valid until`, { exact: false })).toBeVisible();
  // The e-mail leaves through the outbox; the list follows its delivery.
  const row = page.getByRole('listitem', { name: `Invitation for ${email}` });
  await expect(row.getByText('E-mail sent', { exact: true })).toBeVisible({ timeout: 15_000 });
  await expect(row.getByRole('button', { name: `Resend the invitation to ${email}` })).toBeVisible();

  // The invitee, in a browser of their own, follows the link from the mail fake.
  const path = await invitationPathFor(page.request, email);
  const invitee = await (await browser.newContext()).newPage();
  await invitee.goto(path);
  await expect(invitee.getByRole('heading', { name: `Welcome, ${name}` })).toBeVisible();
  await expect(invitee.getByTestId('invitation-email')).toHaveText(email);
  await expect(invitee.getByText('Flight planner')).toBeVisible();

  // A mismatched confirmation is caught beside the field, and the typed password stays.
  await invitee.getByLabel('Choose a password').fill(password);
  await invitee.getByLabel('Repeat the password').fill(`${password}x`);
  await invitee.getByRole('button', { name: 'Set password and sign in' }).click();
  await expect(invitee.getByText('The two passwords differ.', { exact: false })).toBeVisible();
  await expect(invitee.getByLabel('Choose a password')).toHaveValue(password);

  await invitee.getByLabel('Repeat the password').fill(password);
  await invitee.getByRole('button', { name: 'Set password and sign in' }).click();
  await expect(invitee.getByRole('button', { name: `Account menu for ${name}` })).toBeVisible();
  expect(await visibleTabNames(invitee)).toEqual(['Crew', 'Maneuvers']);

  // The link works once.
  await invitee.goto(path);
  await expect(invitee.getByText('This invitation link is not valid', { exact: false })).toBeVisible();

  // The new planner signs in again with the chosen password.
  const again = await (await browser.newContext()).newPage();
  await signIn(again, email, password);
  await expect(again.getByRole('button', { name: `Account menu for ${name}` })).toBeVisible();
});
