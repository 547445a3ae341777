import { expect, test } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { signIn } from './support/sign-in.ts';

test.describe('background work', () => {
  // A robustness run is real work for the product's worker process.
  test.setTimeout(180_000);

  test('a planner computes a version\'s robustness and watches it arrive; an admin finds the run under Team → Jobs', async ({ browser, baseURL }) => {
    const plannerCtx = await browser.newContext({ baseURL, viewport: { width: 375, height: 812 } });
    const planner = await plannerCtx.newPage();
    await signIn(planner, DEMO_BY_ROLE.planner.email);
    const list = (await (await planner.request.get('/api/sequences')).json()) as { sequences?: { id: string; name: string }[] } | { id: string; name: string }[];
    const sequences = Array.isArray(list) ? list : list.sequences ?? [];
    expect(sequences.length).toBeGreaterThan(0);
    const sequence = sequences[0];
    await planner.goto(`/maneuvers/${sequence.id}`);

    const panel = planner.getByTestId('robustness-panel').first();
    await panel.scrollIntoViewIfNeeded();
    await panel.getByRole('button', { name: /Compute robustness|Run again/ }).click();
    // Progress while the worker process runs the chunks, then the figures.
    await expect(panel.getByText(/Queued|Running|Computed/).first()).toBeVisible();
    await expect(panel.getByText('Computed')).toBeVisible({ timeout: 150_000 });
    await expect(panel.getByText('95th pct. with feedback')).toBeVisible();
    await expect(panel.getByText(/^(Robust|Caution, marginal|Caution, not robust):/)).toBeVisible();
    await plannerCtx.close();

    const adminCtx = await browser.newContext({ baseURL, viewport: { width: 1280, height: 800 } });
    const admin = await adminCtx.newPage();
    await signIn(admin, DEMO_BY_ROLE.admin.email);
    await admin.getByRole('tab', { name: 'Team' }).click();
    await admin.getByRole('radio', { name: 'Jobs' }).click();
    await admin.getByRole('radio', { name: 'Done' }).click();
    const work = admin.getByRole('list', { name: 'Background work' });
    await expect(work.getByText(new RegExp(`^Robustness of ${sequence.name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')} v\\d+`)).first()).toBeVisible();
    await expect(admin.getByText(/Robustness chunks: \d+ waiting, \d+ running, \d+ failed/)).toBeVisible();
    await adminCtx.close();
  });
});
