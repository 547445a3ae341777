import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';

import { expect, type Page, test, type TestInfo } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { signIn } from './support/sign-in.ts';

/**
 * The screens a trainee, planner, reviewer and admin see, at a phone (375×812) and a wide screen
 * (1280×800), kept as artifacts in test-results (one PNG per screen and size) for people to look at:
 * player with both cameras and its cue card, report preview, Crew profile, CSV errors, audit log.
 * Each screen is also checked for what it must show.
 */
const SIZES = [
  { name: 'phone', width: 375, height: 812 },
  { name: 'wide', width: 1280, height: 800 },
] as const;

const BAD_CSV = ['name,call_sign,sex,stature_m,mass_kg,suit,thigh_m', 'Dax Pell,,other,2.9,25,moon-suit,-0.4', 'Ona Fisk,,female,1.6,58,,'].join('\n') + '\n';

async function keep(page: Page, testInfo: TestInfo, name: string, fullPage = false): Promise<void> {
  const path = testInfo.outputPath(`${name}.png`);
  await page.screenshot({ path, fullPage });
  await testInfo.attach(name, { path, contentType: 'image/png' });
}

for (const size of SIZES) {
  test.describe(`screens at ${size.width}×${size.height}`, () => {
    test.use({ viewport: { width: size.width, height: size.height } });

    test(`player, both cameras, with its cue card (${size.name})`, async ({ page }, testInfo) => {
      test.setTimeout(90_000);
      await signIn(page, DEMO_BY_ROLE.trainee.email);
      await page.goto('/rehearse');
      await page.getByRole('listitem', { name: /^Cabin yaw with hip swirls, version \d+$/ }).first().click();
      const player = page.getByTestId('rehearsal-player');
      await expect(player.locator('canvas')).toBeVisible({ timeout: 30_000 });
      await expect(player.getByTestId('cue-step')).toHaveText(/^Step 1 of \d+$/);
      await player.getByRole('button', { name: 'Play', exact: true }).click();
      await page.waitForTimeout(2500);
      await keep(page, testInfo, `player-observer-${size.name}`);
      await player.getByRole('radio', { name: 'Body-fixed' }).click();
      await page.waitForTimeout(1200);
      await keep(page, testInfo, `player-body-camera-${size.name}`);
      await player.getByRole('button', { name: 'Pause', exact: true }).click();
      await keep(page, testInfo, `cue-card-${size.name}`);
    });

    test(`report with its 3D preview (${size.name})`, async ({ page }, testInfo) => {
      test.setTimeout(90_000);
      await signIn(page, DEMO_BY_ROLE.reviewer.email);
      await expect(page).toHaveURL(/\/reviews$/);
      await page.getByTestId('review-queue-row').first().click();
      await page.getByRole('button', { name: 'Show 3D preview' }).click();
      const preview = page.getByTestId('preview-3d');
      await expect(preview.locator('canvas')).toBeVisible({ timeout: 30_000 });
      await preview.scrollIntoViewIfNeeded();
      await page.waitForTimeout(1000);
      const box = await preview.locator('canvas').boundingBox();
      // the preview gets the width it is given and a height a person can see a body in
      expect(box!.height).toBeGreaterThan(300);
      await keep(page, testInfo, `report-preview-${size.name}`);
    });

    test(`Crew profile and every CSV error at once (${size.name})`, async ({ page }, testInfo) => {
      await signIn(page, DEMO_BY_ROLE.planner.email);
      await page.goto('/crew');
      await page.getByRole('button', { name: /^Tamsin Reed/ }).click();
      await expect(page.getByRole('table', { name: 'Derived segment table' })).toBeVisible();
      await expect(page.getByText(/spread over the segments in proportion/)).toBeVisible();
      await keep(page, testInfo, `crew-profile-${size.name}`);
      await page.getByRole('table', { name: 'Derived segment table' }).scrollIntoViewIfNeeded();
      await keep(page, testInfo, `crew-segment-table-${size.name}`);

      await page.goto('/crew/upload');
      await page.getByLabel('Measurements file').setInputFiles({ name: 'week-13.csv', mimeType: 'text/csv', buffer: Buffer.from(BAD_CSV) });
      await page.getByRole('button', { name: 'Upload and import' }).click();
      const errors = page.getByRole('table', { name: 'Upload errors' });
      await expect(errors).toBeVisible();
      // one row with five problems: all listed at once
      await expect(errors.getByRole('row')).toHaveCount(6);
      await errors.scrollIntoViewIfNeeded();
      await keep(page, testInfo, `csv-errors-${size.name}`);
    });

    test(`audit log (${size.name})`, async ({ page }, testInfo) => {
      await signIn(page, DEMO_BY_ROLE.admin.email);
      await page.goto('/team');
      await page.getByRole('radio', { name: 'Audit log' }).click();
      await expect(page.getByRole('list', { name: 'Audit events' }).getByRole('button').first()).toBeVisible();
      await keep(page, testInfo, `audit-log-${size.name}`);
    });
  });
}

test('printed cue card with step pictograms and attitude plot (one A4 page whatever the screen)', async ({ page }, testInfo) => {
  await signIn(page, DEMO_BY_ROLE.trainee.email);
  const { sequences } = (await (await page.request.get('/api/sequences')).json()) as { sequences: { name: string; cleared: { id: string } | null }[] };
  const cleared = sequences.find((q) => q.name === 'Cabin yaw with hip swirls')?.cleared;
  expect(cleared, 'the demo trainee has a cleared maneuver').toBeTruthy();
  const res = await page.request.get(`/api/sequences/versions/${cleared!.id}/cue-card.pdf`);
  expect(res.status()).toBe(200);
  const pdfPath = testInfo.outputPath('printed-cue-card.pdf');
  writeFileSync(pdfPath, await res.body());
  // The first page as a picture, by poppler's pdftoppm (Debian poppler-utils).
  execFileSync('pdftoppm', ['-png', '-r', '80', '-f', '1', '-l', '1', '-singlefile', pdfPath, testInfo.outputPath('printed-cue-card')]);
  await testInfo.attach('printed-cue-card', { path: testInfo.outputPath('printed-cue-card.png'), contentType: 'image/png' });
  const text = execFileSync('pdftotext', ['-layout', pdfPath, '-']).toString('utf8');
  expect(text).toContain('POSE');
  expect(text).toContain('Attitude during the verified run');
});
