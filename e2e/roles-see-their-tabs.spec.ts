import { expect, test } from '@playwright/test';

import { DEMO_BY_ROLE } from './support/demo-accounts.ts';
import { signIn, visibleTabNames } from './support/sign-in.ts';

// The tab split of issue 2: each role sees exactly these tabs, in this order.
const EXPECTED_TABS = {
  admin: ['Crew', 'Maneuvers', 'Reviews', 'Team'],
  planner: ['Crew', 'Maneuvers'],
  reviewer: ['Crew', 'Maneuvers', 'Reviews'],
  trainee: ['Rehearse', 'Crew'],
} as const;

for (const [role, tabs] of Object.entries(EXPECTED_TABS) as [keyof typeof EXPECTED_TABS, readonly string[]][]) {
  test(`${role} signs in and sees exactly the tabs ${tabs.join(', ')}`, async ({ page }) => {
    const person = DEMO_BY_ROLE[role];
    await signIn(page, person.email);
    expect(await visibleTabNames(page)).toEqual([...tabs]);
    await expect(page.getByRole('button', { name: `Account menu for ${person.name}` })).toBeVisible();
    await expect(page.getByText('Planning and training aid only', { exact: false })).toBeVisible();
  });
}

test('a reviewer lands on the review queue after signing in', async ({ page }) => {
  await signIn(page, DEMO_BY_ROLE.reviewer.email);
  await expect(page).toHaveURL(/\/reviews$/);
  await expect(page.getByRole('tab', { name: 'Reviews' })).toHaveAttribute('aria-selected', 'true');
});

test('a planner who types the Team address lands on their own first tab', async ({ page }) => {
  await signIn(page, DEMO_BY_ROLE.planner.email);
  await page.goto('/team');
  await expect(page).toHaveURL(/\/crew$/);
  await expect(page.getByRole('tab', { name: 'Crew' })).toHaveAttribute('aria-selected', 'true');
  expect(await visibleTabNames(page)).toEqual(['Crew', 'Maneuvers']);
});

test('signing out returns to the sign-in page and the shell is closed', async ({ page }) => {
  await signIn(page, DEMO_BY_ROLE.reviewer.email);
  await page.getByRole('button', { name: /^Account menu for / }).click();
  await page.getByRole('menuitem', { name: 'Sign out' }).click();
  await expect(page.getByText('You are signed out.')).toBeVisible();
  await page.goto('/reviews');
  await expect(page).toHaveURL(/\/sign-in/);
});
