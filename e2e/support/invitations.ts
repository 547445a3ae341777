import { type APIRequestContext, type Browser, type Locator, type Page } from '@playwright/test';

import { DEMO_BY_ROLE } from './demo-accounts.ts';
import { invitationPathFor } from './mailbox.ts';
import { signIn } from './sign-in.ts';

/** Someone to invite: a name, an e-mail made from it that no earlier run used, and the password they will choose. */
export function freshInvitee(name: string, password: string): { name: string; email: string; password: string } {
  return { name, email: `${name.toLowerCase().replace(/\s+/g, '.')}.${Date.now()}@lumen.example.test`, password };
}

/**
 * As the demo admin: opens Team → Invite and fills in the invitee's name, e-mail and role (the role's
 * radio label, e.g. "Planner"); returns the form, not yet sent.
 */
export async function openInviteForm(page: Page, invitee: { name: string; email: string; role: string }): Promise<Locator> {
  await signIn(page, DEMO_BY_ROLE.admin.email);
  await page.getByRole('tab', { name: 'Team' }).click();
  await page.getByRole('button', { name: 'Invite', exact: true }).click();
  const form = page.getByRole('form', { name: 'Invite someone' });
  await form.getByLabel('Name').fill(invitee.name);
  await form.getByLabel('E-mail').fill(invitee.email);
  await form.getByRole('radio', { name: invitee.role }).click();
  return form;
}

/** The invitee, in a browser of their own, follows the link the mail fake received for `email`. */
export async function followInvitation(browser: Browser, request: APIRequestContext, email: string): Promise<{ invitee: Page; path: string }> {
  const path = await invitationPathFor(request, email);
  const invitee = await (await browser.newContext()).newPage();
  await invitee.goto(path);
  return { invitee, path };
}

/** On the invitation page: types the password and its repetition, and sends them. */
export async function choosePassword(invitee: Page, password: string, repeat: string = password): Promise<void> {
  await invitee.getByLabel('Choose a password').fill(password);
  await invitee.getByLabel('Repeat the password').fill(repeat);
  await invitee.getByRole('button', { name: 'Set password and sign in' }).click();
}
