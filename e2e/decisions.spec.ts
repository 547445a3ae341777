import { type APIRequestContext, type Browser, expect as baseExpect, type Page, test, type TestInfo } from '@playwright/test';

import type { SignInResponse } from '../shared/contracts/auth.ts';
import type { CrewMemberView } from '../shared/contracts/crew.ts';
import type { ReviewQueueItem, SequenceSummary, VersionDetail } from '../shared/contracts/maneuver.ts';
import type { Primitive } from '../shared/primitives/primitive-schemas.ts';
import { DEMO_BY_ROLE, DEMO_PASSWORD } from './support/demo-accounts.ts';
import { jsonOf } from './support/response-json.ts';
import { signIn } from './support/sign-in.ts';

/**
 * Decisions made on the whole truth (issue 12): suggestions compared side by side and previewed in
 * 3D before use, with Undo; a failing version goes to review only with a note; a profile change
 * sends a re-check to the reviewer, whose re-clearance lets the trainee rehearse again.
 * Screenshots of the comparison at 375×812 and 1280×800 are kept in test-results.
 */

// Screens here wait on background work (planner, robustness, re-verification) on a shared two-core machine.
const expect = baseExpect.configure({ timeout: 30_000 });

const PHONE = { width: 375, height: 812 };
const WIDE = { width: 1280, height: 800 };
const PAUSE: Primitive[] = [{ kind: 'pause', durationS: 1 }];

async function keep(page: Page, testInfo: TestInfo, name: string): Promise<void> {
  const path = testInfo.outputPath(`${name}.png`);
  await page.screenshot({ path });
  await testInfo.attach(name, { path, contentType: 'image/png' });
}

/** A bearer token for a demo person (API set-up beside the browser's own session). */
async function bearer(request: APIRequestContext, email: string): Promise<{ Authorization: string }> {
  const res = await request.post('/api/auth/sign-in', { data: { email, password: DEMO_PASSWORD }, headers: { Origin: `http://127.0.0.1:${process.env.E2E_PORT}` } });
  expect(res.status()).toBe(200);
  return { Authorization: `Bearer ${(await jsonOf<SignInResponse>(res)).token}` };
}

/** The planner makes a maneuver for a demo crew member and saves version 1 with `steps`; returns the ids. */
async function maneuverWithVersion(request: APIRequestContext, crewName: string, name: string, yprDeg: { yaw: number; pitch: number; roll: number }, steps: Primitive[]) {
  const planner = await bearer(request, DEMO_BY_ROLE.planner.email);
  const crew = await jsonOf<{ members: CrewMemberView[] }>(await request.get('/api/crew', { headers: planner }));
  const member = crew.members.find((m) => m.name === crewName);
  if (!member) throw new Error(`the demo crew has no ${crewName}`);
  const seq = await request.post('/api/sequences', { headers: planner, data: { crewMemberId: member.id, name, target: { mode: 'ypr', yprDeg, toleranceDeg: 2 } } });
  expect(seq.status()).toBe(201);
  const sequenceId = (await jsonOf<SequenceSummary>(seq)).id;
  const saved = await request.post(`/api/sequences/${sequenceId}/versions`, { headers: planner, data: { baseVersion: 0, primitives: steps } });
  expect(saved.status(), await saved.text()).toBe(201);
  return { sequenceId, versionId: (await jsonOf<VersionDetail>(saved)).id, memberId: member.id, planner };
}

async function newPage(browser: Browser, baseURL: string | undefined, viewport: { width: number; height: number }, email: string): Promise<Page> {
  const ctx = await browser.newContext({ baseURL, viewport });
  const page = await ctx.newPage();
  await signIn(page, email);
  return page;
}

test('a planner asks for suggestions, compares two side by side, previews one in 3D, uses its steps and undoes', async ({ browser, baseURL, request }, testInfo) => {
  // The planner runs on the server (about a minute on two busy cores), then the 3D preview simulates one suggestion.
  test.setTimeout(600_000);
  const { sequenceId } = await maneuverWithVersion(request, 'Tamsin Reed', `Compared quarter turn ${Date.now()}`, { yaw: 90, pitch: 0, roll: 0 }, PAUSE);
  const page = await newPage(browser, baseURL, PHONE, DEMO_BY_ROLE.planner.email);
  await page.goto(`/maneuvers/${sequenceId}`);
  await page.getByRole('radio', { name: /^Steps/ }).click();
  const steps = page.getByRole('list', { name: 'Steps' }).getByRole('listitem');
  await expect(steps).toHaveCount(1);
  const before = await steps.first().textContent();

  const panel = page.getByTestId('suggest-steps');
  await panel.getByRole('button', { name: 'Suggest steps' }).click();
  await expect(panel.getByTestId('plan-candidate-2')).toBeVisible({ timeout: 300_000 });

  // One view: the table of every figure, the first two suggestions ticked and overlaid per axis.
  await panel.getByTestId('compare-suggestions').click();
  const view = page.getByRole('dialog', { name: 'Compare suggestions' });
  await expect(view).toBeVisible();
  const table = view.getByRole('table', { name: 'Suggestions compared' });
  for (const header of ['Duration (s)', 'Error (°)', 'Path (°)', 'Peak rate (°/s)', 'Open-loop p95 (°)', 'Feedback p95 (°)', 'Level']) {
    await expect(table.getByRole('columnheader', { name: header })).toBeAttached();
  }
  const rows = table.getByRole('row');
  expect(await rows.count()).toBeGreaterThanOrEqual(3);
  await expect(view.getByRole('checkbox', { name: 'Compare suggestion 1' })).toHaveAttribute('aria-checked', 'true');
  await expect(view.getByRole('checkbox', { name: 'Compare suggestion 2' })).toHaveAttribute('aria-checked', 'true');
  // On a phone the table scrolls sideways and says so.
  await expect(view.getByTestId('compare-table-scroll-hint')).toContainText('More columns');
  // Each axis plot draws one line per ticked suggestion and the dashed target.
  const yaw = view.getByRole('img', { name: /^Yaw vs time\./ });
  await expect(yaw).toBeVisible();
  await expect(yaw).toHaveAttribute('aria-label', /suggestion 1 ends at .*suggestion 2 ends at .*target 90\.0°/);
  await expect(yaw.locator('path')).toHaveCount(3);
  // Unticking one takes its line out; ticking it again brings it back.
  await view.getByRole('checkbox', { name: 'Compare suggestion 2' }).click();
  await expect(yaw.locator('path')).toHaveCount(2);
  await view.getByRole('checkbox', { name: 'Compare suggestion 2' }).click();
  await expect(yaw.locator('path')).toHaveCount(3);
  await keep(page, testInfo, 'compare-suggestions-375');

  // A 3D preview of suggestion 2 before using it: the player plays its steps on the crew member's body.
  await view.getByRole('button', { name: 'Preview suggestion 2 in 3D' }).click();
  const preview = view.getByTestId('candidate-preview');
  await expect(preview.getByRole('heading', { name: 'Suggestion 2 in 3D' })).toBeVisible();
  const cues = await preview.getByText(/^\d+\. /).allTextContents();
  expect(cues.length).toBeGreaterThan(0);
  const player = preview.getByTestId('rehearsal-player');
  await expect(player.locator('canvas')).toBeVisible({ timeout: 90_000 });
  await expect(player.getByTestId('cue-step')).toHaveText(`Step 1 of ${cues.length}`);
  await player.getByRole('button', { name: 'Next step' }).click();
  if (cues.length > 1) await expect(player.getByTestId('cue-step')).toHaveText(`Step 2 of ${cues.length}`);
  await preview.scrollIntoViewIfNeeded();
  await keep(page, testInfo, 'compare-preview-375');

  // The same view on a wide screen: the table fits, the three plots sit side by side.
  await page.setViewportSize(WIDE);
  await table.scrollIntoViewIfNeeded();
  await expect(view.getByTestId('compare-plots')).toBeVisible();
  await keep(page, testInfo, 'compare-suggestions-1280');
  await preview.scrollIntoViewIfNeeded();
  await keep(page, testInfo, 'compare-preview-1280');
  await page.setViewportSize(PHONE);

  // Use these steps: the composer lists suggestion 2's steps, and says how to go back.
  await preview.getByRole('button', { name: 'Use the steps of suggestion 2' }).click();
  await expect(view).toBeHidden();
  await expect(steps).toHaveCount(cues.length);
  for (const [i, line] of cues.entries()) await expect(steps.nth(i)).toContainText(line.replace(/^\d+\.\s*/, ''));
  const banner = page.getByTestId('steps-replaced');
  await expect(banner).toContainText('Steps of suggestion 2 in use');
  await expect(page.getByTestId('steps-replaced-snackbar')).toBeVisible();
  await keep(page, testInfo, 'suggestion-used-undo-375');

  // Undo restores the steps from before: the one pause, nothing unsaved.
  await banner.getByRole('button', { name: 'Undo using suggestion 2' }).click();
  await expect(steps).toHaveCount(1);
  await expect(steps.first()).toHaveText(before ?? '');
  await expect(banner).toBeHidden();
  await expect(page.getByTestId('steps-replaced-snackbar')).toBeHidden();
  await expect(page.getByText(/unsaved changes/)).toHaveCount(0);
  await page.context().close();
});

test('a failing version cannot be submitted without a note; with one, the reviewer reads the note and the failures first', async ({ browser, baseURL, request }) => {
  test.setTimeout(240_000);
  const name = `Half-hearted quarter turn ${Date.now()}`;
  // A one-second pause cannot turn the body 90°: the version misses its target.
  const { versionId, sequenceId, planner } = await maneuverWithVersion(request, 'Tamsin Reed', name, { yaw: 90, pitch: 0, roll: 0 }, PAUSE);

  // Through the API without the acknowledgement: refused, naming what fails.
  const refused = await request.post(`/api/sequences/versions/${versionId}/submit`, { headers: planner, data: { note: 'try' } });
  expect(refused.status()).toBe(409);
  expect(await refused.text()).toMatch(/checks_failed/);

  const page = await newPage(browser, baseURL, WIDE, DEMO_BY_ROLE.planner.email);
  await page.goto(`/maneuvers/${sequenceId}`);
  // The banner over the draft says what fails.
  await expect(page.getByTestId('version-status-notice').getByTestId('check-failures')).toContainText(/target/i);
  await page.getByTestId('submit-review').click();
  const sheet = page.getByRole('dialog', { name: 'Submit version 1 for review?' });
  await expect(sheet.getByTestId('check-failures')).toContainText(/target/i);
  // No note: not sent, and the field says why.
  await sheet.getByTestId('submit-confirm').click();
  await expect(sheet.getByText('Tell the reviewer why this version should be reviewed although it fails these checks.')).toBeVisible();
  await expect(sheet).toBeVisible();
  const still = await jsonOf<VersionDetail>(await request.get(`/api/sequences/versions/${versionId}`, { headers: planner }));
  expect(still.status).toBe('drafting');

  const note = 'A placeholder to test the review queue; do not clear.';
  await sheet.getByTestId('submit-note').fill(note);
  await sheet.getByTestId('submit-confirm').click();
  await expect(sheet).toBeHidden();
  await expect(page.getByText('Under review', { exact: true }).filter({ visible: true }).first()).toBeVisible();
  const sent = await jsonOf<VersionDetail>(await request.get(`/api/sequences/versions/${versionId}`, { headers: planner }));
  expect(sent.status).toBe('under_review');
  expect(sent.submitNote).toBe(note);
  expect(sent.acknowledgedFailures?.map((f) => f.check)).toContain('target');

  // The reviewer's queue row says it fails checks and came with a note; the review page shows the note and failures.
  const reviewer = await newPage(browser, baseURL, PHONE, DEMO_BY_ROLE.reviewer.email);
  await reviewer.goto('/reviews');
  const row = reviewer.getByRole('button', { name: `Review ${name} version 1` });
  await expect(row.getByTestId('queue-acknowledged')).toContainText('with a note');
  await row.click();
  const detail = reviewer.getByTestId('review-detail');
  await expect(detail.getByTestId('version-status-notice')).toContainText(note);
  await expect(detail.getByTestId('version-status-notice').getByTestId('check-failures')).toContainText(/target/i);
  await reviewer.context().close();
  await page.context().close();
});

test('a profile change sends a re-check to the reviewer, who re-clears it, and the trainee rehearses again', async ({ browser, baseURL, request }) => {
  test.setTimeout(420_000);
  const trainee = 'bram.kettle@lumen.example.test';
  const name = `Re-check drill ${Date.now()}`;
  // A cleared maneuver for Bram Kettle (set up through the API).
  const { versionId, memberId, planner } = await maneuverWithVersion(request, 'Bram Kettle', name, { yaw: 0, pitch: 0, roll: 0 }, PAUSE);
  const reviewerApi = await bearer(request, DEMO_BY_ROLE.reviewer.email);
  expect((await request.post(`/api/sequences/versions/${versionId}/submit`, { headers: planner, data: { acknowledgeFailures: true, note: 're-check e2e' } })).status()).toBe(200);
  expect((await request.post(`/api/reviews/${versionId}/decision`, { headers: reviewerApi, data: { decision: 'clear' } })).status()).toBe(200);

  // The planner changes Bram's body mass by 0.7 kg and is told at once which cleared maneuvers went stale.
  const page = await newPage(browser, baseURL, WIDE, DEMO_BY_ROLE.planner.email);
  await page.goto(`/crew?member=${memberId}`);
  await page.getByRole('radio', { name: 'Edit' }).click();
  const mass = page.getByLabel('Body mass');
  const was = Number(await mass.inputValue());
  expect(was).toBeGreaterThan(0);
  await mass.fill((was + 0.7).toFixed(1));
  await page.getByLabel('Note').fill('Mass after the fitting (e2e)');
  await page.getByRole('button', { name: /^Save version \d+$/ }).click();
  const stale = page.getByTestId('stale-after-save');
  await expect(stale).toContainText(`${name} v1 (cleared)`);
  await expect(stale).toContainText('goes to the reviewer as a re-check');

  // The trainee cannot rehearse it meanwhile and reads why.
  const bram = await newPage(browser, baseURL, PHONE, trainee);
  await bram.goto('/rehearse');
  const waiting = bram.getByRole('listitem', { name: `${name}, version 1, needs a re-check` });
  await expect(waiting.getByTestId('recheck-message')).toContainText(/profile change|re-verified/);

  // The re-verification saves version 2 for the reviewer (the worker runs it in the background).
  await expect.poll(async () => {
    const queue = await jsonOf<{ items: ReviewQueueItem[] }>(await request.get('/api/reviews/queue', { headers: reviewerApi }));
    return queue.items.find((i) => i.version.recheckOfId === versionId)?.version.version ?? null;
  }, { timeout: 180_000, intervals: [1000] }).toBe(2);
  // What the trainee reads is true now: it waits for the reviewer.
  await bram.reload();
  await expect(waiting.getByTestId('recheck-message')).toContainText('Waiting for your reviewer after a profile change');

  // The reviewer sees it as a re-check with what changed, and re-clears it with one decision.
  const reviewer = await newPage(browser, baseURL, PHONE, DEMO_BY_ROLE.reviewer.email);
  await reviewer.goto('/reviews');
  const row = reviewer.getByRole('button', { name: `Review ${name} version 2` });
  await expect(row.getByTestId('queue-recheck')).toBeVisible();
  await row.click();
  const detail = reviewer.getByTestId('review-detail');
  await expect(detail.getByTestId('recheck-changes')).toBeVisible();
  await expect(detail.getByTestId('recheck-shift')).toContainText('°');
  await detail.getByRole('button', { name: 'Re-clear version' }).click();
  const confirm = reviewer.getByRole('dialog', { name: 'Re-clear version 2?' });
  await confirm.getByTestId('review-clear-confirm').click();
  await expect(confirm).toBeHidden();
  await expect(detail.getByText('Cleared', { exact: true }).filter({ visible: true }).first()).toBeVisible();

  // The trainee rehearses version 2: listed without a re-check, and the player opens.
  await bram.reload();
  const ready = bram.getByRole('listitem', { name: `${name}, version 2` });
  await expect(ready).toBeVisible();
  await expect(ready.getByTestId('recheck-message')).toHaveCount(0);
  await ready.click();
  await expect(bram.getByTestId('rehearsal-player').locator('canvas')).toBeVisible({ timeout: 60_000 });
  await bram.context().close();
  await reviewer.context().close();
  await page.context().close();
});
