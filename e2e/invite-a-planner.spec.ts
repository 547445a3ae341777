import { expect, test } from '@playwright/test';

import { choosePassword, followInvitation, freshInvitee, openInviteForm } from './support/invitations.ts';
import { signIn, visibleTabNames } from './support/sign-in.ts';

test('an admin invites a planner; the invitee follows the e-mailed link, sets a password and is signed in', async ({ page, browser }) => {
  const { name, email, password } = freshInvitee('Wren Halloway', 'orbit-lattice-42');
  const form = await openInviteForm(page, { name, email, role: 'Planner' });
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByText(`Invitation sent to ${email}.`)).toBeVisible();
  await expect(page.getByText(`${email} — valid until`, { exact: false })).toBeVisible();
  // The e-mail leaves through the outbox; the list follows its delivery.
  const row = page.getByRole('listitem', { name: `Invitation for ${email}` });
  await expect(row.getByText('E-mail sent', { exact: true })).toBeVisible({ timeout: 15_000 });
  await expect(row.getByRole('button', { name: `Resend the invitation to ${email}` })).toBeVisible();

  // The invitee, in a browser of their own, follows the link from the mail fake.
  const { invitee, path } = await followInvitation(browser, page.request, email);
  await expect(invitee.getByRole('heading', { name: `Welcome, ${name}` })).toBeVisible();
  await expect(invitee.getByTestId('invitation-email')).toHaveText(email);
  await expect(invitee.getByText('Flight planner')).toBeVisible();

  // A mismatched confirmation is caught beside the field, and the typed password stays.
  await choosePassword(invitee, password, `${password}x`);
  await expect(invitee.getByText('The two passwords differ.', { exact: false })).toBeVisible();
  await expect(invitee.getByLabel('Choose a password')).toHaveValue(password);

  await choosePassword(invitee, password);
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
