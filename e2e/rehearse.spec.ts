import { mkdirSync } from 'node:fs';
import path from 'node:path';

import { type APIRequestContext, expect, type Page, test } from '@playwright/test';

import { envVar } from '../server/config.ts';
import type { SignInResponse } from '../shared/contracts/auth.ts';
import type { CrewMemberView } from '../shared/contracts/crew.ts';
import type { SequenceSummary, VersionDetail } from '../shared/contracts/maneuver.ts';
import { DEMO_BY_ROLE, DEMO_PASSWORD } from './support/demo-accounts.ts';
import { jsonOf } from './support/response-json.ts';
import { signIn } from './support/sign-in.ts';

const TRAINEE = 'tamsin.reed@lumen.example.test';
// Screenshots for people to look at, only when REHEARSE_SCREENS_DIR names a folder (not part of the check).
const SCREENS = envVar('REHEARSE_SCREENS_DIR');

async function token(request: APIRequestContext, email: string): Promise<string> {
  // the context may already hold a session cookie from an earlier sign-in: say where the request comes from
  const res = await request.post('/api/auth/sign-in', { data: { email, password: DEMO_PASSWORD }, headers: { Origin: `http://127.0.0.1:${process.env.E2E_PORT}` } });
  expect(res.status()).toBe(200);
  return (await jsonOf<SignInResponse>(res)).token;
}

/** A planner composes a maneuver for Tamsin Reed through the API and a reviewer clears it; returns the version id. */
async function clearedManeuver(request: APIRequestContext): Promise<string> {
  const planner = { Authorization: `Bearer ${await token(request, DEMO_BY_ROLE.planner.email)}` };
  const reviewer = { Authorization: `Bearer ${await token(request, DEMO_BY_ROLE.reviewer.email)}` };
  const crew = await jsonOf<{ members: CrewMemberView[] }>(await request.get('/api/crew', { headers: planner }));
  const reed = crew.members.find((m) => m.name === 'Tamsin Reed');
  if (!reed) throw new Error('the demo crew has no Tamsin Reed');
  const seq = await request.post('/api/sequences', {
    headers: planner,
    data: { crewMemberId: reed.id, name: 'E2E pitch-down arm orbit', target: { mode: 'ypr', yprDeg: { yaw: 0, pitch: -8, roll: 0 } } },
  });
  expect(seq.status()).toBe(201);
  const sequenceId = (await jsonOf<SequenceSummary>(seq)).id;
  const version = await request.post(`/api/sequences/${sequenceId}/versions`, {
    headers: planner,
    data: {
      baseVersion: 0,
      primitives: [
        { kind: 'arm_orbit', arms: 'both', centre: 'forward', halfAngleDeg: 25, travel: 'outward', cycles: 3, periodS: 1.5 },
        { kind: 'pause', durationS: 1 },
      ],
    },
  });
  expect(version.status(), await version.text()).toBe(201);
  const versionId = (await jsonOf<VersionDetail>(version)).id;
  expect((await request.post(`/api/sequences/versions/${versionId}/submit`, { headers: planner, data: { acknowledgeFailures: true, note: 'rehearsal e2e: checks acknowledged' } })).status()).toBeLessThan(300);
  const cleared = await request.post(`/api/reviews/${versionId}/decision`, { headers: reviewer, data: { decision: 'clear' } });
  expect(cleared.status(), await cleared.text()).toBeLessThan(300);
  return versionId;
}

/**
 * Fraction of the pixels of screenshot `png` that differ from a reference by more than `threshold`
 * (the sum of the red, green and blue differences): another screenshot of the same size (1 when the
 * sizes differ), or one colour.
 */
async function differingFraction(page: Page, png: Buffer, reference: Buffer | readonly [number, number, number], threshold: number): Promise<number> {
  const other = Buffer.isBuffer(reference) ? reference.toString('base64') : null;
  const colour = Buffer.isBuffer(reference) ? null : reference;
  return page.evaluate(async ({ a64, b64, rgb, limit }) => {
    const load = async (s: string) => {
      const img = new Image();
      img.src = `data:image/png;base64,${s}`;
      await img.decode();
      const c = document.createElement('canvas');
      c.width = img.width; c.height = img.height;
      const g = c.getContext('2d')!;
      g.drawImage(img, 0, 0);
      return g.getImageData(0, 0, c.width, c.height).data;
    };
    const da = await load(a64);
    const db = b64 ? await load(b64) : null;
    if (db && db.length !== da.length) return 1;
    let n = 0;
    for (let i = 0; i < da.length; i += 4) {
      const [r, g, b] = db ? [db[i], db[i + 1], db[i + 2]] : rgb!;
      if (Math.abs(da[i] - r) + Math.abs(da[i + 1] - g) + Math.abs(da[i + 2] - b) > limit) n++;
    }
    return n / (da.length / 4);
  }, { a64: png.toString('base64'), b64: other, rgb: colour, limit: threshold });
}

/** Fraction of pixels that differ from the scene background (#0B121B) in a canvas screenshot. */
const drawnFraction = (page: Page, png: Buffer) => differingFraction(page, png, [0x0b, 0x12, 0x1b], 40);

/** Fraction of pixels that differ noticeably between two same-sized screenshots. */
const changedFraction = (page: Page, a: Buffer, b: Buffer) => differingFraction(page, a, b, 30);

/** requestAnimationFrame intervals over `ms` in the page: median, 95th percentile and mean, ms. */
async function frameTimes(page: Page, ms: number): Promise<{ median: number; p95: number; mean: number; frames: number }> {
  return page.evaluate((duration) => new Promise((resolve) => {
    const deltas: number[] = [];
    let last = performance.now();
    const start = last;
    const tick = (now: number) => {
      deltas.push(now - last);
      last = now;
      if (now - start < duration) requestAnimationFrame(tick);
      else {
        const s = [...deltas].sort((x, y) => x - y);
        resolve({ median: s[Math.floor(s.length / 2)], p95: s[Math.floor(s.length * 0.95)], mean: deltas.reduce((x, y) => x + y, 0) / deltas.length, frames: deltas.length });
      }
    };
    requestAnimationFrame(tick);
  }), ms);
}

test('a trainee on a phone opens a cleared maneuver, watches it in 3D, switches camera and speed, and logs the rehearsal', async ({ page, request }, testInfo) => {
  test.setTimeout(120_000);
  const versionId = await clearedManeuver(request);

  await page.setViewportSize({ width: 375, height: 812 });
  await signIn(page, TRAINEE);
  await page.goto('/rehearse');
  const item = page.getByRole('listitem', { name: /E2E pitch-down arm orbit/ });
  await expect(item).toBeVisible();
  await expect(item).toContainText('Not rehearsed yet');
  if (SCREENS) { mkdirSync(SCREENS, { recursive: true }); await page.screenshot({ path: path.join(SCREENS, 'rehearse-list-phone.png') }); }
  await item.click();
  await expect(page).toHaveURL(new RegExp(`/rehearse/${versionId}`));

  // The player: the canvas draws the body (software WebGL) and the first cue shows.
  const player = page.getByTestId('rehearsal-player');
  const canvas = player.locator('canvas');
  await expect(canvas).toBeVisible({ timeout: 30_000 });
  // one step list (DECISIONS.md "Steps"): the orbit and the pause, as the composer lists them; the
  // joining move into the orbit is the first step's short lead-in, not a step of its own
  await expect(player.getByTestId('cue-step')).toHaveText('Step 1 of 2');
  await expect(player.getByTestId('cue-lead-in')).toHaveText('Get ready: arms forward');
  await expect(player.getByRole('button', { name: 'Previous step' })).toBeDisabled();
  await expect(player.getByRole('button', { name: 'Next step' })).toBeEnabled();
  await page.waitForTimeout(800);
  const first = await canvas.screenshot();
  const drawn = await drawnFraction(page, first);
  testInfo.annotations.push({ type: 'drawn pixels', description: `${(drawn * 100).toFixed(1)}%` });
  expect(drawn).toBeGreaterThan(0.03);

  // Play: the cue advances to the cyclic step with its cycle count, and the image changes over time.
  await player.getByRole('button', { name: 'Play', exact: true }).click();
  await expect(player.getByTestId('cue-cycle')).toHaveText(/cycle [12] of 3/, { timeout: 15_000 });
  await expect(player.getByTestId('cue-step')).toHaveText('Step 1 of 2');
  // The phone screenshot kept as a test artifact, mid-sweep.
  const phone = await page.screenshot();
  await testInfo.attach('rehearsal-player-phone', { body: phone, contentType: 'image/png' });
  await page.screenshot({ path: testInfo.outputPath('rehearsal-player-phone.png') });
  if (SCREENS) await page.screenshot({ path: path.join(SCREENS, 'rehearse-player-phone.png') });
  const ft = await frameTimes(page, 3000);
  testInfo.annotations.push({ type: 'frame time (rAF, ms)', description: `median ${ft.median.toFixed(1)}, p95 ${ft.p95.toFixed(1)}, mean ${ft.mean.toFixed(1)} over ${ft.frames} frames` });
  console.log(`rehearse e2e frame time (rAF deltas, SwiftShader, 375×812): median ${ft.median.toFixed(1)} ms, p95 ${ft.p95.toFixed(1)} ms, mean ${ft.mean.toFixed(1)} ms, ${ft.frames} frames`);
  const later = await canvas.screenshot();
  const changed = await changedFraction(page, first, later);
  testInfo.annotations.push({ type: 'changed pixels', description: `${(changed * 100).toFixed(1)}%` });
  expect(changed).toBeGreaterThan(0.005);

  // Back to the first step (playback may have moved on), then Next goes to the last step, where Next is disabled.
  const cueStep = player.getByTestId('cue-step');
  for (let i = 0; i < 3 && (await cueStep.textContent()) !== 'Step 1 of 2'; i++) await player.getByRole('button', { name: 'Previous step' }).click();
  await expect(cueStep).toHaveText('Step 1 of 2');
  await player.getByRole('button', { name: 'Next step' }).click();
  await expect(player.getByTestId('cue-step')).toHaveText('Step 2 of 2');
  await expect(player.getByRole('button', { name: 'Next step' })).toBeDisabled();

  // Faster playback.
  await player.getByRole('radio', { name: '2×', exact: true }).click();
  await expect(player.getByRole('radio', { name: '2×', exact: true })).toHaveAttribute('aria-checked', 'true');
  await expect(player).toContainText('· 2×');

  // Body-fixed camera: the view is now carried by the body.
  const beforeCam = await canvas.screenshot();
  await player.getByRole('radio', { name: 'Body-fixed' }).click();
  await expect(player.getByRole('radio', { name: 'Body-fixed' })).toHaveAttribute('aria-checked', 'true');
  await page.waitForTimeout(500);
  expect(await changedFraction(page, beforeCam, await canvas.screenshot())).toBeGreaterThan(0.02);
  if (SCREENS) await page.screenshot({ path: path.join(SCREENS, 'rehearse-player-body-camera-phone.png') });
  await player.getByRole('radio', { name: 'Observer' }).click();
  await player.getByRole('radio', { name: 'Side', exact: true }).click();
  await expect(player.getByRole('radio', { name: 'Side', exact: true })).toHaveAttribute('aria-checked', 'true');
  await player.getByRole('radio', { name: '0.5×' }).click();

  // Log the run: the form is prefilled from the player.
  await player.getByRole('button', { name: 'Log rehearsal' }).click();
  await expect(player).toBeHidden();
  await expect(page.getByRole('radio', { name: '0.5×' })).toHaveAttribute('aria-checked', 'true');
  await page.getByRole('radio', { name: '4', exact: true }).click();
  await page.getByLabel('Notes').fill('Kept the circles even; watch the left elbow.');
  await page.getByRole('button', { name: 'Save rehearsal' }).click();
  await expect(page.getByText('Rehearsal logged.')).toBeVisible();
  const history = page.getByRole('list', { name: 'Rehearsal history' });
  await expect(history).toContainText('Kept the circles even');
  await expect(history).toContainText('0.5×');
  if (SCREENS) await page.screenshot({ path: path.join(SCREENS, 'rehearse-log-phone.png'), fullPage: true });

  // The list shows the last rehearsal.
  await page.goto('/rehearse');
  await expect(page.getByRole('listitem', { name: /E2E pitch-down arm orbit/ })).toContainText('rated 4/5');
});
