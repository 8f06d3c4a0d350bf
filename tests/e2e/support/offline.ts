import type { BrowserContext, Page } from '@playwright/test';

/**
 * Opens the app, waits until its service worker controls the page (so the app opens with no
 * signal), then takes the signal away.
 */
export async function openThenGoOffline(page: Page, context: BrowserContext): Promise<void> {
  await page.goto('/');
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
  await context.setOffline(true);
}
