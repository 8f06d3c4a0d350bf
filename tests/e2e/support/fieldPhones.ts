import { devices, expect, type APIRequestContext, type Browser, type Page } from '@playwright/test';
import { DEMO_PASSWORD } from '../../../server/demo/demoPeople';
import { apiPhone, token } from './apiPhone';

/** A demo person signed in on a phone of their own (a new browser context), with the app installed. */
export async function signIn(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext({ ...devices['Pixel 7'] })).newPage();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByTestId('signed-in-name')).toBeVisible();
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
  return page;
}

/** Joins a target with its code and a task, by hand, and waits for the pad. */
export async function joinTarget(page: Page, code: string, task: RegExp, target: number): Promise<void> {
  await page.goto(`/join?code=${code}`);
  await page.getByRole('radio', { name: task }).check();
  await page.getByRole('button', { name: 'Join target' }).click();
  await expect(page.getByRole('heading', { name: new RegExp(`Target ${target}`) })).toBeVisible();
}

/** A demo person's phone simulated through the API, for what the test does not tap by hand. */
export const phoneOf = async (request: APIRequestContext, email: string) =>
  apiPhone(request, await token(request, email), `pad-${email}`);
