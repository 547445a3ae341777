import { expect, test } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { signIn } from './support/sign-in.ts';

test('on a phone the header folds away while a crew profile scrolls down and comes back on the way up; the caution stays', async ({ browser, baseURL }) => {
  test.setTimeout(90_000);
  const ctx = await browser.newContext({ baseURL, viewport: { width: 375, height: 812 } });
  const page = await ctx.newPage();
  await signIn(page, DEMO_BY_ROLE.planner.email);
  const { members } = (await (await page.request.get('/api/crew')).json()) as { members: { id: string; currentVersion: number | null }[] };
  const member = members.find((m) => m.currentVersion != null)!;
  await page.goto(`/crew?member=${member.id}`);

  const region = page.getByRole('region', { name: 'Crew member' });
  await expect(region.getByText('Segment table', { exact: false }).first()).toBeVisible({ timeout: 20_000 });
  const banner = page.getByRole('banner');
  const caution = page.getByRole('note', { name: 'Caution' });
  const title = page.getByRole('heading', { level: 1, name: 'Crew' });
  await expect(title).toBeVisible();
  const before = (await region.boundingBox())!.height;

  await region.hover();
  for (let i = 0; i < 4; i++) await page.mouse.wheel(0, 150);
  await expect(title).toHaveCount(0);
  await expect(banner.getByRole('button', { name: /Account menu for/ })).toHaveCount(0);
  await expect(caution).toBeVisible();
  const after = (await region.boundingBox())!.height;
  // The profile gets most of the screen once the header is folded.
  expect(after).toBeGreaterThan(before + 80);
  expect(after).toBeGreaterThan(600);
  await page.screenshot({ path: test.info().outputPath('crew-profile-folded-375.png') });

  for (let i = 0; i < 8; i++) await page.mouse.wheel(0, -150);
  await expect(title).toBeVisible();
  await expect(banner.getByRole('button', { name: /Account menu for/ })).toBeVisible();
  await ctx.close();
});
