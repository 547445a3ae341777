import { type Browser, expect, type Page } from '@playwright/test';

import { DEMO_PASSWORD } from './demo-accounts.ts';

/**
 * Signs in through the sign-in page and waits for the signed-in shell (the account chip shows the
 * user's name). The session cookie then rides along with `page.request` too.
 */
export async function signIn(page: Page, email: string, password: string = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('button', { name: /^Account menu for / })).toBeVisible();
}

/** The names of the tabs the signed-in shell shows, in order (hidden tabs are not in the list). */
export async function visibleTabNames(page: Page): Promise<string[]> {
  const tabs = page.getByRole('tablist').getByRole('tab');
  await expect(tabs.first()).toBeVisible();
  return (await tabs.evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''))).filter(Boolean);
}

/** The two screen sizes the product is checked at: a phone, and a laptop. */
export const PHONE = { width: 375, height: 812 };
export const WIDE = { width: 1280, height: 800 };

/** A browser context of its own at `viewport`, signed in as `email`; close it with `page.context().close()`. */
export async function signedInPage(browser: Browser, baseURL: string | undefined, viewport: { width: number; height: number }, email: string): Promise<Page> {
  const page = await (await browser.newContext({ baseURL, viewport })).newPage();
  await signIn(page, email);
  return page;
}
