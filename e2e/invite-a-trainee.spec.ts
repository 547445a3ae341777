import { expect, test } from '@playwright/test';

import { choosePassword, followInvitation, freshInvitee, openInviteForm } from './support/invitations.ts';

test('an admin invites a trainee linked to a crew member; the invitee sees that crew member; the admin relinks them', async ({ page, browser }) => {
  const { name, email, password } = freshInvitee('Sable Orrery', 'tether-lattice-77');
  const form = await openInviteForm(page, { name, email, role: 'Trainee' });

  // A trainee without a crew member is refused beside the picker; nothing is sent.
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(form.getByText("Choose the trainee's crew member.")).toBeVisible();

  // The picker lists the crew (GET /api/crew); pick the demo's Bram Kettle.
  const picker = form.getByLabel('Crew member');
  const label = (await picker.locator('option').allTextContents()).find((o) => o.startsWith('Bram Kettle'));
  expect(label).toBeTruthy();
  await picker.selectOption({ label: label! });
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByText(`Invitation sent to ${email}.`)).toBeVisible();

  const { invitee } = await followInvitation(browser, page.request, email);
  await choosePassword(invitee, password);
  await expect(invitee.getByRole('button', { name: `Account menu for ${name}` })).toBeVisible();

  // The new trainee reads exactly their own crew member.
  const res = await invitee.request.get('/api/crew');
  const { members } = (await res.json()) as { members: { name: string }[] };
  expect(members.map((m) => m.name)).toEqual(['Bram Kettle']);
  await invitee.getByRole('tab', { name: 'Crew' }).click();
  await expect(invitee.getByRole('heading', { name: 'Bram Kettle' }).first()).toBeVisible();

  // The admin links the trainee to another crew member from the People list; it applies at once.
  // (A reload: the People list was fetched moments ago, before the invitee joined, and is still fresh.)
  await page.reload();
  await page.getByRole('radio', { name: 'People' }).click();
  await page.getByText(name, { exact: true }).click();
  const relink = page.getByLabel('Crew member', { exact: true });
  const ilse = (await relink.locator('option').allTextContents()).find((o) => o.startsWith('Ilse Moss'));
  await relink.selectOption({ label: ilse! });
  await page.getByRole('button', { name: 'Save crew member' }).click();
  await expect(page.getByText(`${name} now sees Ilse Moss.`)).toBeVisible();
  const after = (await (await invitee.request.get('/api/crew')).json()) as { members: { name: string }[] };
  expect(after.members.map((m) => m.name)).toEqual(['Ilse Moss']);
});
