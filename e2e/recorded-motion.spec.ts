import { expect, test } from '@playwright/test';

import { writeBvh } from '../tests/recordings/bvh-writer.ts';
import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { signIn } from './support/sign-in.ts';

test.describe('recorded motion', () => {
  test.setTimeout(180_000);

  test('a planner imports a BVH recording, maps it, uses it as a step and verifies', async ({ page }) => {
    // 3 s of a left-arm sweep at 30 Hz, arms hanging at rest (the file is written here, invented).
    const frames = Array.from({ length: 91 }, (_, k) => ({ LeftArm: [0, -(40 + 30 * Math.sin((2 * Math.PI * k) / 45)), 0] as [number, number, number] }));
    const bvh = writeBvh(frames, 1 / 30);
    await page.setViewportSize({ width: 1280, height: 800 });
    await signIn(page, DEMO_BY_ROLE.planner.email);
    await page.goto('/crew/upload');
    const panel = page.getByTestId('recording-upload');
    await panel.getByLabel('Recording file').setInputFiles({ name: `sweep-${Date.now()}.bvh`, mimeType: 'text/plain', buffer: Buffer.from(bvh) });
    await panel.getByTestId('upload-recording').click();
    const detail = panel.getByTestId('recording-detail');
    await expect(detail).toBeVisible({ timeout: 30_000 });
    await expect(detail).toContainText('91 frames at 30 Hz');
    await expect(detail).toContainText('faces +Z');
    // The default mapping: trunk, arms and legs, waist rotation and flexion included.
    const mapping = detail.getByTestId('mapping-table');
    await expect(mapping.getByLabel('l upper arm')).toHaveValue('LeftArm');
    await expect(mapping.getByLabel('lower trunk')).toHaveValue('Hips');

    // A new maneuver with the recording as its step.
    const name = `Recorded sweep drill ${Date.now()}`;
    await page.goto('/maneuvers');
    await page.getByRole('button', { name: 'New maneuver' }).first().click();
    const create = page.getByRole('dialog', { name: 'New maneuver' });
    const crewSelect = create.getByLabel('Crew member');
    // The suited crew member: the suit locks waist flexion, so that channel is left out of the step.
    const suited = crewSelect.locator('option', { hasText: 'Kettle' }).first();
    await expect(suited).toBeAttached();
    await crewSelect.selectOption((await suited.getAttribute('value')));
    await create.getByRole('textbox', { name: 'Name', exact: true }).fill(name);
    await create.getByRole('textbox', { name: 'Tolerance', exact: true }).fill('5');
    await create.getByRole('button', { name: 'Create' }).click();
    await expect(page.getByRole('heading', { name, level: 1 })).toBeVisible();
    await page.getByTestId('add-recorded-sweep').click();
    const picker = page.getByTestId('recorded-sweep-picker');
    const select = picker.getByLabel('Recording');
    await expect(select.locator('option').nth(1)).toBeAttached();
    await select.selectOption({ index: 1 });
    await picker.getByTestId('use-recording').click();
    const editor = page.getByTestId('step-editor').first();
    await expect(editor).toBeVisible();
    // Dropped channels are named; the kept ones are plotted over the suit's ranges with their margins.
    await expect(editor.getByTestId('dropped-channels')).toContainText('waist_flex');
    await expect(editor.getByTestId('dropped-channels')).not.toContainText('waist_rot');
    const margins = editor.getByTestId('range-margins');
    await expect(margins).toContainText('Left shoulder abduction');
    await expect(editor.getByTestId('tightest-margin')).toContainText('Closest to a limit');
    await expect(editor.getByTestId('joint-plots')).toBeVisible();
    await editor.screenshot({ path: 'test-results/recorded-sweep-editor-1280.png' });
    await editor.getByRole('textbox', { name: 'Repeat', exact: true }).fill('2');
    await page.getByRole('button', { name: 'Apply step' }).click();
    const steps = page.getByRole('list', { name: 'Steps' }).getByRole('listitem');
    await expect(steps).toHaveCount(1);
    await expect(steps.first()).toContainText('follow the recorded sweep');
    await page.getByTestId('save-verify').click();
    const report = page.getByTestId('verification-report');
    await expect(report).toBeVisible({ timeout: 60_000 });
    await expect(report.getByTestId('stat-target-error')).toContainText('°');
  });
});
