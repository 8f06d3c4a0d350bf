import { expect, test, type Route } from '@playwright/test';
import { DEMO_PASSWORD, demoArchers } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { demoTarget } from './support/demoDb';
import { joinTarget } from './support/fieldPhones';

const TARGET = 2;
/** Long enough that the pad's chunk is asked for while the layout's is held, on a busy machine. */
const HOLD_MS = 600;

/**
 * What the pad waits for when the app opens on it (the slow phone's offline repeat load): its
 * chunks, fetched beside the layout's rather than after it; its first read, so the first drawing
 * is the pad whole; one font file a weight; the sync's first round and the check of who is signed
 * in after the pad has drawn. The service worker is kept out so the page's requests can
 * be held, and the page comes without the server's preload hints, as the service worker's copy does.
 */
test('opened on the pad: its chunks beside the layout, drawn whole at once, latin fonts only, the first sync and sign-in check after the pad', async ({
  browser,
}) => {
  const context = await browser.newContext({ serviceWorkers: 'block' });
  const page = await context.newPage();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(demoArchers()[25]!.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByTestId('signed-in-name')).toBeVisible({ timeout: 15_000 });
  await joinTarget(page, demoTarget(TARGET).code, /Following/, TARGET);
  const padUrl = page.url();

  const pad = await context.newPage();
  await pad.route(/\/pad\/\d+\/\d+$/, async (route) => {
    const response = await route.fetch();
    const headers = { ...response.headers() };
    delete headers['link'];
    await route.fulfill({ response, headers });
  });
  const fonts: string[] = [];
  pad.on('request', (r) => {
    if (r.url().endsWith('.woff2')) fonts.push(r.url().replace(/^.*\//, ''));
  });
  // Whether the pad was on screen when the sync's first request left, and the check of who is
  // signed in (which refreshes the session first).
  const syncs: boolean[] = [];
  await pad.route(/\/api\/sync\//, async (route) => {
    syncs.push(await pad.getByTestId('end-number').isVisible());
    await route.continue();
  });
  const whoChecks: boolean[] = [];
  await pad.route(/\/api\/(me|auth\/refresh)$/, async (route) => {
    whoChecks.push(await pad.getByTestId('end-number').isVisible());
    await route.continue();
  });
  // What the app's first drawing put on the page: the pad whole, not a frame saying "Opening…".
  await pad.addInitScript(() => {
    new MutationObserver((_, observer) => {
      const root = document.getElementById('root');
      if (!root || root.childElementCount === 0) return;
      (globalThis as unknown as { firstDrawing: string }).firstDrawing = root.innerText;
      observer.disconnect();
    }).observe(document, { childList: true, subtree: true });
  });
  // The layout's chunk is held: the pad's must be asked for meanwhile, not once the layout has run.
  let padAsked = false;
  let padAskedWhileHeld: boolean | undefined;
  pad.on('request', (r) => {
    if (/\/assets\/PadScreen-[^/]+\.js$/.test(r.url())) padAsked = true;
  });
  await pad.route(/\/assets\/AppLayout-[^/]+\.js$/, async (route: Route) => {
    await pad.waitForTimeout(HOLD_MS);
    padAskedWhileHeld = padAsked;
    await route.continue();
  });
  await pad.goto(padUrl);
  await expect(pad.getByTestId('end-number')).toBeVisible();
  expect(padAskedWhileHeld).toBe(true);
  await expect.poll(() => syncs.length, { timeout: 15_000 }).toBeGreaterThan(0);
  expect(syncs[0]).toBe(true);
  await expect.poll(() => whoChecks.length, { timeout: 15_000 }).toBeGreaterThan(0);
  expect(whoChecks[0]).toBe(true);
  const firstDrawing = await pad.evaluate(() => (globalThis as unknown as { firstDrawing: string }).firstDrawing);
  expect(firstDrawing).toContain('End 1');
  expect(firstDrawing).not.toContain('Opening');
  // Every word on the pad is in the latin subset: the latin-ext files are never fetched.
  expect(fonts.filter((f) => f.includes('-latin-ext-'))).toEqual([]);
  expect(fonts.some((f) => f.includes('-latin-400-'))).toBe(true);
  await checkA11y(pad, 'pad opened on its own');
  await pad.screenshot({ path: '.tmp/screens/pad-first-load.png', fullPage: true });
  await context.close();
});
