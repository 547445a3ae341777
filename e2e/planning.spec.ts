import { expect, test } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { signIn } from './support/sign-in.ts';

/** Degrees out of a figure such as "0.42°" or "1.3°". */
function degrees(text: string): number {
  const m = text.match(/(-?\d+(?:\.\d+)?)°/);
  if (!m) throw new Error(`no degrees in "${text}"`);
  return Number(m[1]);
}

test('a planner asks for suggested steps, finds them again after a reload, uses the best and verifies it within tolerance', async ({ browser, baseURL }) => {
  // The planner and the verification run on the server: room for both on two cores.
  test.setTimeout(300_000);
  const ctx = await browser.newContext({ baseURL, viewport: { width: 1280, height: 900 } });
  const page = await ctx.newPage();
  await signIn(page, DEMO_BY_ROLE.planner.email);

  // A new maneuver with a target and no steps, for a demo crew member with a profile.
  const toleranceDeg = 2;
  const { members } = (await (await page.request.get('/api/crew')).json()) as { members: { id: string; name: string; currentVersion: number | null }[] };
  const member = members.find((m) => m.name === 'Tamsin Reed' && m.currentVersion != null) ?? members.find((m) => m.currentVersion != null);
  expect(member, 'a crew member with a profile').toBeTruthy();
  // A cookie-authenticated change from outside the page names our origin, as a browser would.
  const created = await page.request.post('/api/sequences', {
    headers: { Origin: baseURL! },
    data: { crewMemberId: member!.id, name: `Suggested quarter turn ${Date.now()}`, target: { mode: 'ypr', yprDeg: { yaw: 90, pitch: 0, roll: 0 }, toleranceDeg } },
  });
  expect(created.status()).toBe(201);
  const sequence = (await created.json()) as { id: string };

  await page.goto(`/maneuvers/${sequence.id}`);
  await expect(page.getByText('No steps yet')).toBeVisible();
  const panel = page.getByTestId('suggest-steps');
  await panel.getByRole('button', { name: 'Suggest steps' }).click();

  // Ranked candidates, each with its error to target, 95th-percentile errors (with feedback and open-loop) and robustness level.
  const best = panel.getByTestId('plan-candidate-1');
  await expect(best).toBeVisible({ timeout: 180_000 });
  await expect(panel.getByRole('list', { name: 'Suggested step lists' })).toContainText('best first');
  await expect(best).toContainText('Error to target');
  await expect(best).toContainText('95th pct, with feedback');
  await expect(best).toContainText(/\d°/);

  // A reload keeps the plan: the panel finds the sequence's latest plan again.
  await page.reload();
  await expect(page.getByText('No steps yet')).toBeVisible();
  await expect(best).toBeVisible({ timeout: 30_000 });
  await expect(best).toContainText('Error to target');
  await expect(best).toContainText('95th pct, with feedback');
  await expect(panel.getByRole('button', { name: 'Suggest again' })).toBeVisible();

  // The cues the suggestion lists ("1. cue") become the composer's steps.
  const cueLines = await best.getByText(/^\d+\. /).allTextContents();
  expect(cueLines.length).toBeGreaterThan(0);
  await best.getByRole('button', { name: 'Use these steps' }).click();
  await expect(page.getByText('No steps yet')).toHaveCount(0);
  const steps = page.getByRole('list', { name: 'Steps' }).getByRole('listitem');
  await expect(steps).toHaveCount(cueLines.length);
  for (const [i, line] of cueLines.entries()) {
    await expect(steps.nth(i)).toContainText(line.replace(/^\d+\.\s*/, ''));
  }

  // Saved and verified on the crew member's profile: the report's error to target is within tolerance.
  await page.getByTestId('save-verify').click();
  const reportError = page.getByTestId('verification-report').getByTestId('stat-target-error');
  await expect(reportError).toBeVisible({ timeout: 120_000 });
  await expect(reportError).toContainText(`tolerance ${toleranceDeg.toFixed(1)}°`);
  const shown = (await reportError.textContent()) ?? '';
  expect(degrees(shown.replace(/tolerance.*$/, ''))).toBeLessThanOrEqual(toleranceDeg);
  await ctx.close();
});

test('the planner says which limit a target misses (a 10 s time budget for a half turn), on a phone and a wide screen', async ({ browser, baseURL }) => {
  test.setTimeout(300_000);
  for (const viewport of [{ width: 375, height: 812 }, { width: 1280, height: 800 }]) {
    const ctx = await browser.newContext({ baseURL, viewport });
    const page = await ctx.newPage();
    await signIn(page, DEMO_BY_ROLE.planner.email);
    const { members } = (await (await page.request.get('/api/crew')).json()) as { members: { id: string; name: string; currentVersion: number | null }[] };
    const member = members.find((m) => m.currentVersion != null);
    const created = await page.request.post('/api/sequences', {
      headers: { Origin: baseURL! },
      data: { crewMemberId: member!.id, name: `Half turn in 10 s ${viewport.width} ${Date.now()}`, target: { mode: 'ypr', yprDeg: { yaw: 180, pitch: 0, roll: 0 }, toleranceDeg: 2, timeBudgetS: 10 } },
    });
    expect(created.status()).toBe(201);
    const sequence = (await created.json()) as { id: string };
    await page.goto(`/maneuvers/${sequence.id}`);
    const panel = page.getByTestId('suggest-steps');
    await panel.getByRole('button', { name: 'Suggest steps' }).click();
    // The notes name the limit (the time budget) beside the candidates, none of which is within limits.
    const notes = panel.getByTestId('planner-notes-remarks');
    await expect(notes).toBeVisible({ timeout: 180_000 });
    await expect(notes).toContainText('over the 10 s time budget');
    await expect(panel.getByText('Misses a limit').first()).toBeVisible();
    await notes.scrollIntoViewIfNeeded();
    await page.screenshot({ path: test.info().outputPath(`planner-notes-${viewport.width}.png`) });
    await ctx.close();
  }
});
