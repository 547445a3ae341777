import { type APIRequestContext,expect, test } from '@playwright/test';

import type { SignInResponse } from '../shared/contracts/auth.ts';
import type { CrewMemberView } from '../shared/contracts/crew.ts';
import type { SequenceSummary, VersionDetail } from '../shared/contracts/maneuver.ts';
import type { MotionResponse } from '../shared/contracts/motion.ts';
import type { Rehearsal } from '../shared/contracts/rehearsal.ts';
import { DEMO_BY_ROLE, DEMO_PASSWORD } from './support/demo-accounts.ts';
import { jsonOf } from './support/response-json.ts';
import { signIn } from './support/sign-in.ts';

const TRAINEE = 'tamsin.reed@lumen.example.test';
/** The recording lags the plan by this much (seconds): the screen must report it. */
const LAG_S = 0.1;
const RATE_HZ = 50;

async function bearer(request: APIRequestContext, email: string): Promise<Record<string, string>> {
  const res = await request.post('/api/auth/sign-in', { data: { email, password: DEMO_PASSWORD }, headers: { Origin: `http://127.0.0.1:${process.env.E2E_PORT}` } });
  expect(res.status()).toBe(200);
  return { Authorization: `Bearer ${(await jsonOf<SignInResponse>(res)).token}` };
}

/**
 * Through the API: a planner composes a maneuver for Tamsin Reed, a reviewer clears it, Tamsin logs a
 * rehearsal of it; then her "recording" is written from the plan's own joint angles, LAG_S late (the
 * plan's samples shifted by whole samples at RATE_HZ). Returns the ids and the CSV.
 */
async function rehearsalWithRecording(request: APIRequestContext): Promise<{ sequenceId: string; versionId: string; rehearsalId: string; csv: string }> {
  const planner = await bearer(request, DEMO_BY_ROLE.planner.email);
  const reviewer = await bearer(request, DEMO_BY_ROLE.reviewer.email);
  const trainee = await bearer(request, TRAINEE);
  const crew = await jsonOf<{ members: CrewMemberView[] }>(await request.get('/api/crew', { headers: planner }));
  const reed = crew.members.find((m) => m.name === 'Tamsin Reed');
  if (!reed) throw new Error('the demo crew has no Tamsin Reed');
  const seq = await request.post('/api/sequences', {
    headers: planner,
    data: { crewMemberId: reed.id, name: `E2E captured arm orbit ${Date.now()}`, target: { mode: 'ypr', yprDeg: { yaw: 0, pitch: -8, roll: 0 } } },
  });
  expect(seq.status()).toBe(201);
  const sequenceId = (await jsonOf<SequenceSummary>(seq)).id;
  const version = await request.post(`/api/sequences/${sequenceId}/versions`, {
    headers: planner,
    data: { baseVersion: 0, primitives: [{ kind: 'arm_orbit', arms: 'both', centre: 'forward', halfAngleDeg: 25, travel: 'outward', cycles: 3, periodS: 1.5 }, { kind: 'pause', durationS: 1 }] },
  });
  expect(version.status(), await version.text()).toBe(201);
  const versionId = (await jsonOf<VersionDetail>(version)).id;
  expect((await request.post(`/api/sequences/versions/${versionId}/submit`, { headers: planner, data: { acknowledgeFailures: true, note: 'E2E capture' } })).status()).toBeLessThan(300);
  expect((await request.post(`/api/reviews/${versionId}/decision`, { headers: reviewer, data: { decision: 'clear' } })).status()).toBeLessThan(300);
  const logged = await request.post('/api/rehearsals', {
    headers: trainee, data: { sequenceVersionId: versionId, playbackSpeed: 1, completedSteps: 2, selfRating: 3, notes: 'Wore the sleeve sensors.' },
  });
  expect(logged.status(), await logged.text()).toBe(201);
  const rehearsalId = (await jsonOf<{ rehearsal: Rehearsal }>(logged)).rehearsal.id;

  const motion = await jsonOf<MotionResponse>(await request.get(`/api/motion/${versionId}?rate=${RATE_HZ}`, { headers: trainee }));
  const { dofs, frames } = motion.samples;
  const moving = dofs.map((d, j) => ({ d, j })).filter(({ j }) => {
    const v = frames.map((f) => f.jointsDeg[j]);
    return Math.max(...v) - Math.min(...v) > 1;
  });
  const shift = Math.round(LAG_S * RATE_HZ);
  const lines = [`time_s,${moving.map((m) => m.d).join(',')}`];
  frames.forEach((f, k) => {
    const src = frames[Math.max(0, k - shift)];
    lines.push([f.t.toFixed(4), ...moving.map((m) => src.jointsDeg[m.j].toFixed(5))].join(','));
  });
  return { sequenceId, versionId, rehearsalId, csv: lines.join('\n') };
}

test('a trainee attaches a recording to a rehearsal and sees the predicted attitude, the timing figures and the overlay', async ({ page, request }, testInfo) => {
  test.setTimeout(150_000);
  const { sequenceId, versionId, rehearsalId, csv } = await rehearsalWithRecording(request);

  // On the phone: the session opens into the player; closing it shows the log form and the history.
  await page.setViewportSize({ width: 375, height: 812 });
  await signIn(page, TRAINEE);
  await page.goto(`/rehearse/${versionId}`);
  await page.getByRole('button', { name: 'Close player' }).click({ timeout: 30_000 });
  await expect(page.getByTestId('rehearsal-player')).toBeHidden();
  const history = page.getByRole('list', { name: 'Rehearsal history' });
  await expect(history).toContainText('Wore the sleeve sensors.');
  await history.getByTestId(`capture-open-${rehearsalId}`).click();
  const attach = page.getByTestId('capture-attach');
  await attach.getByLabel('Attach a recording (joint-angle CSV or BVH)').setInputFiles({ name: 'sleeve-sensors.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
  await attach.getByRole('button', { name: 'Attach and simulate' }).click();

  const view = page.getByTestId('capture-view');
  await expect(view).toBeVisible({ timeout: 60_000 });
  // The predicted attitude on the plan's profile, against the target and the plan's own result.
  const outcome = view.getByTestId('capture-outcome-plan');
  await expect(outcome).toContainText(/yaw -?\d+\.\d°, pitch -?\d+\.\d°, roll -?\d+\.\d°/);
  await expect(outcome).toContainText(/from the target .* from the plan's own result/);
  // The timing figures of the sweep step: late by the lag written into the recording, same period and amplitude.
  const step = view.getByTestId('capture-step-1');
  // Numbered and worded as the composer and the player list it: step 1 is the orbit, not the pause.
  await expect(step).toContainText(/^Step 1, Both arms forward, medium circles outward, 3 times, 1.5 s each: late/);
  await expect(step).toContainText(`late ${LAG_S.toFixed(2)} s`);
  await expect(step).toContainText('period ×1.00');
  await expect(step).toContainText('amplitude ×1.00');
  // The overlay: planned (dashed) and executed turn, and joint angles.
  await expect(view.getByTestId('capture-overlay-turn')).toBeVisible();
  await expect(view.getByRole('img', { name: /planned and executed/ }).first()).toBeVisible();
  await expect(view).toContainText('Not signed off yet.');
  await view.scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('rehearsal-capture-375.png') });
  // The trend of the recorded figures across rehearsals lists this one.
  const trend = page.getByTestId('capture-trend');
  await expect(trend.getByRole('table', { name: 'Recorded figures per rehearsal' })).toContainText(`${LAG_S.toFixed(2)} s`);
  await trend.scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('rehearsal-trend-375.png') });

  // Wide: the same rehearsal shows its stored capture again.
  await page.setViewportSize({ width: 1280, height: 800 });
  await page.reload();
  await page.getByRole('button', { name: 'Close player' }).click({ timeout: 30_000 });
  await page.getByTestId(`capture-open-${rehearsalId}`).click();
  await expect(page.getByTestId('capture-step-1')).toContainText(`late ${LAG_S.toFixed(2)} s`);
  await page.screenshot({ path: testInfo.outputPath('rehearsal-capture-1280.png') });

  // A reviewer opens the maneuver, reads the recording under the version's rehearsals and signs it off.
  await page.context().clearCookies();
  await signIn(page, DEMO_BY_ROLE.reviewer.email);
  await page.goto(`/maneuvers/${sequenceId}?version=${versionId}&panel=report`);
  const rehearsals = page.getByTestId('version-rehearsals');
  await expect(rehearsals).toContainText('Tamsin Reed', { timeout: 30_000 });
  await rehearsals.getByTestId(`capture-open-${rehearsalId}`).click();
  await expect(rehearsals.getByTestId('capture-step-1')).toContainText(`late ${LAG_S.toFixed(2)} s`);
  await rehearsals.getByRole('button', { name: 'Sign off' }).click();
  await expect(rehearsals.getByTestId('capture-signed-off')).toContainText(`Signed off by ${DEMO_BY_ROLE.reviewer.name}`);
  await rehearsals.scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('rehearsal-sign-off-1280.png') });
});
