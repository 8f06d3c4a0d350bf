import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, devices, type BrowserContext } from '@playwright/test';
import { chromiumArgs, chromiumPath } from '../../tests/support/chromium';

/**
 * A phone's own browser profile (Pixel 7), where an installed app is reopened. Not a throwaway
 * context: Chromium keeps no compiled code between a throwaway context's pages, so every load
 * there compiled the app's scripts afresh, which a phone's profile does not.
 */
export async function phoneProfile(): Promise<{ context: BrowserContext; close: () => Promise<void> }> {
  const dir = mkdtempSync(join(tmpdir(), 'ringcall-phone-'));
  const { viewport, userAgent, deviceScaleFactor, isMobile, hasTouch } = devices['Pixel 7'];
  const context = await chromium.launchPersistentContext(dir, {
    executablePath: chromiumPath(),
    args: chromiumArgs,
    viewport,
    userAgent,
    deviceScaleFactor,
    isMobile,
    hasTouch,
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/**
 * Closes every tab of the app and opens a blank one (the browser stays up): the app is then
 * reopened as a phone reopens it, with no page of it still running to share its memory.
 */
export async function closeAppTabs(context: BrowserContext): Promise<void> {
  const blank = await context.newPage();
  await blank.goto('about:blank');
  for (const page of context.pages()) if (page !== blank) await page.close();
}
