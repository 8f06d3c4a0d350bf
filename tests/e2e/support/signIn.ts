import { expect, type Browser, type Page } from '@playwright/test';
import { DEMO_PASSWORD } from '../../../server/demo/demoPeople';

/** A phone (the config's Pixel 7) signed in as a demo person, with the shell cached so it can reload offline. */
export async function signedInPhone(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  // Checking the password is a bcrypt hash at cost 12: seconds on a busy 2-core machine.
  await expect(page.getByTestId('signed-in-name')).toBeVisible({ timeout: 15_000 });
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
  return page;
}

/** Signs a demo person in on this page (another person may have been signed in before). */
export async function signInHere(page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByTestId('signed-in-name')).toBeVisible();
}
