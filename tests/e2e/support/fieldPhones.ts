import { expect, type APIRequestContext, type Page } from '@playwright/test';
import { apiPhone, token } from './apiPhone';

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
