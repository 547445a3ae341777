import { expect, type Page } from '@playwright/test';

import type { CrewMemberView } from '../../shared/contracts/crew.ts';
import type { SequenceSummary } from '../../shared/contracts/maneuver.ts';
import { jsonOf } from './response-json.ts';

/**
 * A new maneuver without versions, made through the API as the signed-in page's user for the first
 * crew member with a saved profile (so a spec leaves the demo maneuvers alone); returns its id.
 */
export async function newManeuver(page: Page, baseURL: string, name: string, yprDeg = { yaw: 0, pitch: 0, roll: 0 }): Promise<string> {
  const { members } = await jsonOf<{ members: CrewMemberView[] }>(await page.request.get('/api/crew'));
  const member = members.find((m) => m.currentVersion != null);
  expect(member, 'a crew member with a profile').toBeTruthy();
  // A cookie-authenticated change from outside the page names our origin, as a browser would.
  const created = await page.request.post('/api/sequences', {
    headers: { Origin: new URL(baseURL).origin },
    data: { crewMemberId: member!.id, name, target: { mode: 'ypr', yprDeg } },
  });
  expect(created.status(), await created.text()).toBe(201);
  return (await jsonOf<SequenceSummary>(created)).id;
}

/**
 * In the composer of a maneuver without steps: adds one pause of `durationS` through the step sheet,
 * saves, and waits for the verification report of the new version (the engine runs on the server).
 */
export async function saveOnePauseVersion(page: Page, sequenceId: string, durationS: number, timeout: number): Promise<void> {
  await page.goto(`/maneuvers/${sequenceId}`);
  await page.getByRole('button', { name: 'Add step' }).first().click();
  const sheet = page.getByRole('dialog', { name: 'New step 1' });
  await sheet.getByLabel('Step 1 kind').selectOption('pause');
  await sheet.getByRole('textbox', { name: 'Duration', exact: true }).fill(String(durationS));
  await sheet.getByRole('button', { name: 'Add step' }).click();
  await page.getByTestId('save-verify').click();
  await expect(page.getByTestId('verification-report')).toBeVisible({ timeout });
}
