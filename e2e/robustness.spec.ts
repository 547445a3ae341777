import { expect, type Page, test, type TestInfo } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { newManeuver, saveOnePauseVersion } from './support/maneuvers.ts';
import { PHONE, signedInPage, WIDE } from './support/sign-in.ts';

/**
 * Robustness of every saved version (issue 12): a planner saves a version and watches its run arrive
 * with progress, then its histogram and level; a reviewer sees the robustness before the decision
 * buttons on a phone and on a wide screen (screenshots kept in test-results).
 */
async function keep(page: Page, testInfo: TestInfo, name: string, fullPage = false): Promise<void> {
  const path = testInfo.outputPath(`${name}.png`);
  await page.screenshot({ path, fullPage });
  await testInfo.attach(name, { path, contentType: 'image/png' });
}

test('a planner saves a version and sees its robustness arrive with progress', async ({ browser, baseURL }, testInfo) => {
  test.setTimeout(240_000);
  // Composed on a phone (the step editor is a sheet there), then read on a wide screen.
  const page = await signedInPage(browser, baseURL, PHONE, DEMO_BY_ROLE.planner.email);
  const sequenceId = await newManeuver(page, baseURL!, `Robustness on save ${Date.now()}`);
  await saveOnePauseVersion(page, sequenceId, 1, 90_000);
  await page.setViewportSize(WIDE);

  // The save queued the run: the API reports its state and progress while the worker computes it.
  const version = (await (await page.request.get(`/api/sequences/${sequenceId}`)).json()) as { versions: { id: string }[] };
  const versionId = version.versions[0].id;
  const seen: { state: string; progress: number }[] = [];
  const panel = page.getByTestId('robustness-panel').first();
  await expect(panel.getByText(/^(Queued|Running|Computed)$/).first()).toBeVisible({ timeout: 30_000 });
  for (let i = 0; i < 600; i++) {
    const run = (await (await page.request.get(`/api/sequences/versions/${versionId}`)).json()) as { report: { robustness: { state: string; progress: number } | null } };
    const r = run.report.robustness!;
    seen.push({ state: r.state, progress: r.progress });
    if (r.state === 'done') break;
    await page.waitForTimeout(150);
  }
  expect(seen[0].state).toMatch(/^(queued|running|done)$/);
  expect(seen.at(-1)).toEqual({ state: 'done', progress: 1 });
  // Progress never goes backwards.
  for (let i = 1; i < seen.length; i++) expect(seen[i].progress).toBeGreaterThanOrEqual(seen[i - 1].progress);

  // The panel follows (it polls): figures, histogram with the tolerance, model and seed, and the level.
  await expect(panel.getByText('Computed')).toBeVisible({ timeout: 60_000 });
  await expect(panel.getByTestId('robustness-histogram')).toBeVisible();
  // The e2e server runs ROBUSTNESS_SAMPLES=200 (playwright.config.ts) to keep the suite short.
  await expect(panel.getByTestId('robustness-model')).toHaveText(/\b200 samples · seed 1/);
  await expect(panel.getByText(/^(Robust|Caution, marginal|Caution, not robust):/)).toBeVisible();
  await expect(page.getByTestId('report-robustness-caution')).toHaveText(/(Robust|Caution, marginal|Caution, not robust): with feedback/);
  await expect(page.getByTestId('step-rotations')).toBeVisible();
  await panel.scrollIntoViewIfNeeded();
  await keep(page, testInfo, 'robustness-after-save-wide');
  await page.context().close();
});

for (const size of [{ name: 'phone', width: 375, height: 812 }, { name: 'wide', width: 1280, height: 800 }] as const) {
  test(`the reviewer sees the robustness before deciding (${size.name})`, async ({ browser, baseURL }, testInfo) => {
    test.setTimeout(120_000);
    const page = await signedInPage(browser, baseURL, { width: size.width, height: size.height }, DEMO_BY_ROLE.reviewer.email);
    await expect(page).toHaveURL(/\/reviews$/);
    // Every queue row carries the version's level.
    const row = page.getByTestId('review-queue-row').first();
    await expect(row.getByText(/^(Robust|Marginal|Not robust)$/)).toBeVisible();
    await row.click();
    const summary = page.getByTestId('robustness-summary');
    await expect(summary.getByTestId('review-robustness-caution')).toHaveText(/(Robust|Caution, marginal|Caution, not robust): with feedback/, { timeout: 30_000 });
    await expect(summary.getByText('95th pct. with feedback')).toBeVisible();
    // Before the decision buttons, in reading order and on the page.
    const clear = page.getByTestId('review-clear');
    await expect(clear).toBeVisible();
    const s = (await summary.boundingBox())!;
    const c = (await clear.boundingBox())!;
    expect(s.y + s.height).toBeLessThanOrEqual(c.y);
    await summary.scrollIntoViewIfNeeded();
    await keep(page, testInfo, `review-robustness-${size.name}`);
    // The report's own run, with its histogram and the tolerance marked.
    const hist = page.getByTestId('robustness-histogram').first();
    await hist.scrollIntoViewIfNeeded();
    await expect(hist.locator('svg text', { hasText: /^tolerance / })).toHaveCount(1);
    await keep(page, testInfo, `report-robustness-${size.name}`);
    await page.getByTestId('step-rotations').scrollIntoViewIfNeeded();
    await keep(page, testInfo, `report-step-rotations-${size.name}`);
    await page.context().close();
  });
}
