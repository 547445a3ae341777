import { mkdirSync } from 'node:fs';
import path from 'node:path';

import { expect, type Page, test } from '@playwright/test';

import { DEMO_PEOPLE } from '../db/seed/demo-people.ts';
import { envVar } from '../server/config.ts';
import type { CrewMemberView } from '../shared/contracts/crew.ts';
import type { ProfileVersionHeader } from '../shared/contracts/profile-version.ts';
import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { jsonOf } from './support/response-json.ts';
import { PHONE, signIn, WIDE } from './support/sign-in.ts';

// Screenshots for people to look at, only when CREW_SCREENS_DIR names a folder (not part of the check).
const SCREENS = envVar('CREW_SCREENS_DIR');
async function shot(page: Page, name: string) {
  if (!SCREENS) return;
  mkdirSync(SCREENS, { recursive: true });
  await page.screenshot({ path: path.join(SCREENS, `${name}.png`), fullPage: true });
}

/** Sets the screen size, signs in (the demo planner unless `email` says otherwise) and opens the Crew area. */
async function openCrew(page: Page, viewport: { width: number; height: number }, email: string = DEMO_BY_ROLE.planner.email) {
  await page.setViewportSize(viewport);
  await signIn(page, email);
  await page.goto('/crew');
}

const HEADER = 'name,call_sign,sex,stature_m,mass_kg,suit,thigh_m';
const FIXED = [HEADER, 'Elio Marsh,PIKE,male,1.77,76.4,cabin-clothing,', 'Saga Thorn,,female,1.62,55.9,,0.41', 'Ravi Ostrand,GULL,male,1.85,88,pressurised-suit,'].join('\n') + '\n';
const ONE_BAD = FIXED.replace('Saga Thorn,,female,1.62,55.9', 'Saga Thorn,,female,1.62,fifty');


test('a planner creates a crew member, saves and edits a profile, compares versions, exports, and imports a CSV all-or-nothing', async ({ page }) => {
  await openCrew(page, WIDE);
  await expect(page.getByRole('button', { name: /^Tamsin Reed/ })).toBeVisible();
  await shot(page, 'crew-list-wide');

  // A new crew member and the first profile version.
  await page.getByRole('button', { name: 'New crew member' }).click();
  await page.getByLabel('Full name').fill('Wynn Halloway');
  await page.getByLabel('Call sign (optional)').fill('OSPREY');
  await page.getByRole('button', { name: 'Add crew member' }).click();
  await expect(page.getByRole('heading', { name: 'Wynn Halloway' })).toBeVisible();
  await page.getByRole('radio', { name: 'Male', exact: true }).click();
  await page.getByLabel('Stature').fill('1.74');
  await page.getByLabel('Body mass').fill('3000');
  await page.getByRole('button', { name: 'Save version 1' }).click();
  await expect(page.getByText('mass must be at most 200 kg')).toBeVisible();
  await page.getByLabel('Body mass').fill('71.5');
  await page.getByLabel('Note').fill('Baseline');
  await shot(page, 'crew-editor-wide');
  await page.getByRole('button', { name: 'Save version 1' }).click();
  await expect(page.getByRole('heading', { name: 'Version 1 (current)' })).toBeVisible();
  await expect(page.getByRole('table', { name: 'Derived segment table' })).toContainText('Left thigh');
  await shot(page, 'crew-profile-wide');
  await page.getByRole('table', { name: 'Derived segment table' }).scrollIntoViewIfNeeded();
  await shot(page, 'crew-segments-wide');

  // Editing makes version 2.
  await page.getByRole('radio', { name: 'Edit' }).click();
  await expect(page.getByLabel('Body mass')).toHaveValue('71.5');
  await page.getByLabel('Body mass').fill('69.8');
  await page.getByLabel('Note').fill('Mass check after two weeks');
  await page.getByRole('button', { name: 'Save version 2' }).click();
  await expect(page.getByRole('heading', { name: 'Version 2 (current)' })).toBeVisible();

  // The history lists both; the comparison highlights the changed mass.
  await page.getByRole('radio', { name: 'History' }).click();
  await expect(page.getByRole('button', { name: 'Version 2, current' })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Version 1', exact: true })).toBeVisible();
  const inputs = page.getByRole('table', { name: 'Inputs: version 1 and version 2' });
  const massRow = inputs.getByRole('row').filter({ hasText: 'Body mass (kg)' });
  await expect(massRow).toContainText('71.5');
  await expect(massRow).toContainText('69.8');
  await expect(massRow).toContainText('Changed');
  await expect(inputs.getByRole('row').filter({ hasText: 'Stature' })).toHaveCount(0);
  await inputs.scrollIntoViewIfNeeded();
  await shot(page, 'crew-history-wide');

  // Export of the derived body as contract JSON.
  await page.getByRole('radio', { name: 'Profile' }).click();
  const downloading = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Export body JSON' }).click();
  const download = await downloading;
  expect(download.suggestedFilename()).toBe('wynn-halloway-profile-v2-body.json');

  // A CSV with one bad row imports nothing and names the row; the fixed file imports three members.
  await page.getByRole('button', { name: 'Upload', exact: true }).click();
  await expect(page.getByRole('heading', { name: 'Upload measurements' })).toBeVisible();
  await page.getByLabel('Measurements file').setInputFiles({ name: 'crew-week-12.csv', mimeType: 'text/csv', buffer: Buffer.from(ONE_BAD) });
  await page.getByRole('button', { name: 'Upload and import' }).click();
  await expect(page.getByText('Nothing was imported', { exact: true })).toBeVisible();
  const errorRow = page.getByRole('table', { name: 'Upload errors' }).getByRole('row').nth(1);
  await expect(errorRow).toContainText('3');
  await expect(errorRow).toContainText('mass_kg');
  await expect(errorRow).toContainText('"fifty" is not a number');
  await shot(page, 'crew-upload-rejected-wide');
  const none = await jsonOf<{ members: CrewMemberView[] }>(await page.request.get('/api/crew?q=Elio'));
  expect(none.members).toEqual([]);

  await page.getByLabel('Measurements file').setInputFiles({ name: 'crew-week-12.csv', mimeType: 'text/csv', buffer: Buffer.from(FIXED) });
  await page.getByRole('button', { name: 'Upload and import' }).click();
  await expect(page.getByText('Imported 3 rows from crew-week-12.csv.')).toBeVisible();
  await shot(page, 'crew-upload-imported-wide');
  await page.getByRole('button', { name: 'Back to crew' }).click();
  for (const name of ['Elio Marsh', 'Saga Thorn', 'Ravi Ostrand']) {
    await expect(page.getByRole('button', { name: new RegExp(`^${name}, profile version 1`) })).toBeVisible();
  }
});

test('a stale save shows the conflict and saves nothing', async ({ page, baseURL }) => {
  await openCrew(page, WIDE);
  await page.getByRole('button', { name: /^Ilse Moss/ }).click();
  await page.getByRole('radio', { name: 'Edit' }).click();
  await expect(page.getByLabel('Body mass')).toHaveValue('54');
  // Someone else saves version 2 meanwhile (through the API, as another tab would).
  const id = new URL(page.url()).searchParams.get('member')!;
  const other = await page.request.post(`/api/crew/${id}/versions`, { headers: { Origin: baseURL! }, data: { baseVersion: 1, note: 'other tab', inputs: { sex: 'female', stature: 1.61, mass: 53.2, suitId: null } } });
  expect(other.status()).toBe(201);
  await page.getByLabel('Body mass').fill('55');
  await page.getByRole('button', { name: 'Save version 2' }).click();
  await expect(page.getByText('Someone saved a newer version')).toBeVisible();
  await expect(page.getByText(/you started from version 1, but version 2 was saved by Orrin Vale/)).toBeVisible();
  await shot(page, 'crew-conflict-wide');
  const versions = await jsonOf<{ versions: ProfileVersionHeader[] }>(await page.request.get(`/api/crew/${id}/versions`));
  expect(versions.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
  await page.getByRole('button', { name: /Load the newest version/ }).click();
  await expect(page.getByRole('button', { name: 'Save version 3' })).toBeVisible();
  await expect(page.getByLabel('Body mass')).toHaveValue('53.2');
});

test('a trainee sees only their own profile, read-only', async ({ page }) => {
  const trainee = DEMO_PEOPLE.find((p) => p.crewKey === 'reed')!;
  await openCrew(page, PHONE, trainee.email);
  await expect(page.getByRole('heading', { name: 'Tamsin Reed' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Version 2 (current)' })).toBeVisible();
  await expect(page.getByRole('radio', { name: 'Edit' })).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'New crew member' })).toHaveCount(0);
  await shot(page, 'crew-trainee-phone');
  await page.getByRole('button', { name: 'Back to the list' }).click();
  const rows = page.getByRole('list', { name: 'Crew members' }).getByRole('button');
  await expect(rows).toHaveCount(1);
  await expect(rows.first()).toHaveAccessibleName(/^Tamsin Reed/);
  const listed = await jsonOf<{ members: CrewMemberView[] }>(await page.request.get('/api/crew'));
  expect(listed.members.map((m: { name: string }) => m.name)).toEqual(['Tamsin Reed']);
});

test('on a phone the planner goes from the list to a member, its history and back', async ({ page }) => {
  await openCrew(page, PHONE);
  await expect(page.getByRole('button', { name: /^Tamsin Reed/ })).toBeVisible();
  await shot(page, 'crew-list-phone');
  await page.getByRole('button', { name: /^Tamsin Reed/ }).click();
  await expect(page.getByRole('heading', { name: 'Version 2 (current)' })).toBeVisible();
  await shot(page, 'crew-profile-phone');
  await page.getByRole('radio', { name: 'History' }).click();
  const compared = page.getByRole('table', { name: 'Inputs: version 1 and version 2' });
  await expect(compared).toContainText('Body mass (kg)');
  await compared.scrollIntoViewIfNeeded();
  await shot(page, 'crew-history-phone');
  await page.getByRole('radio', { name: 'Edit' }).click();
  await expect(page.getByLabel('Body mass')).toHaveValue('59.1');
  await shot(page, 'crew-editor-phone');
  await page.goto('/crew/upload');
  await expect(page.getByRole('heading', { name: 'Upload measurements' })).toBeVisible();
  await shot(page, 'crew-upload-phone');
});

test('a planner edits a suit configuration; a bad value is named before anything is sent', async ({ page }) => {
  await openCrew(page, WIDE);
  await page.getByRole('button', { name: 'Suit configurations' }).click();
  await expect(page.getByRole('heading', { name: 'Pressurised suit' })).toBeVisible();
  const card = page.getByRole('table', { name: 'In-cabin clothing: added mass' });
  await expect(card).toContainText('Upper trunk');
  await page.getByRole('button', { name: 'Edit as JSON' }).first().click();
  const editor = page.getByRole('textbox', { name: /configuration JSON/ });
  const json = JSON.parse(await editor.inputValue()) as { segments: Record<string, unknown> };
  await editor.fill(JSON.stringify({ ...json, segments: { ...json.segments, upper_trunk: { mass: -2 } } }, null, 2));
  await page.getByRole('button', { name: 'Save suit' }).click();
  await expect(page.getByText('segments.upper_trunk.mass: added mass must not be negative')).toBeVisible();
  await editor.fill(JSON.stringify({ ...json, note: 'Checked against the garment list (demo).' }, null, 2));
  await page.getByRole('button', { name: 'Save suit' }).click();
  await expect(page.getByText('Checked against the garment list (demo).')).toBeVisible();
  await shot(page, 'crew-suits-wide');
});
