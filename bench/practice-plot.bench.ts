/**
 * The practice screen in Chromium on a phone viewport: time from the "Keep arrow" tap to the
 * committed IndexedDB transaction of a plotted arrow, as the page hears of it (goal p95 ≤ 16 ms,
 * the pad tap's budget), over an open-ended session of 120 plotted arrows, with no account and
 * offline. Needs a built client (`npm run build`) and Debian's Chromium.
 */
import { chromium, devices } from '@playwright/test';
import { chromiumArgs, chromiumPath } from '../tests/support/chromium';
import { startBenchServer } from './support/fieldPhone';
import { percentile } from './support/stats';

const ARROWS = 120;
const server = await startBenchServer(4473, '.tmp/bench-practice');

try {
  const browser = await chromium.launch({ executablePath: chromiumPath(), args: chromiumArgs });
  const context = await browser.newContext({ ...devices['Pixel 7'], baseURL: server.base });
  const page = await context.newPage();
  await page.goto('/');
  await page.waitForFunction(
    () =>
      (globalThis as { navigator?: { serviceWorker?: { controller: unknown } } }).navigator?.serviceWorker
        ?.controller != null,
  );
  await context.setOffline(true);
  await page.goto('/practice');
  await page.getByLabel('Arrows per end').selectOption('6');
  await page.getByLabel('Ends', { exact: true }).fill('');
  await page.getByRole('button', { name: 'Start free practice' }).click();
  await page.getByRole('button', { name: 'Plot on the face' }).click();

  const face = page.getByTestId('plot-face');
  const keep = page.getByTestId('keep-arrow');
  for (let i = 0; i < ARROWS; i += 1) {
    await face.scrollIntoViewIfNeeded();
    const box = (await face.boundingBox())!;
    // A loose group around the centre, different each arrow.
    const angle = i * 2.4;
    const reach = 0.05 + (0.15 * ((i * 7) % 10)) / 10;
    await page.touchscreen.tap(
      box.x + box.width * (0.5 + reach * Math.cos(angle)),
      box.y + box.height * (0.5 + reach * Math.sin(angle)),
    );
    const k = (await keep.boundingBox())!;
    await page.touchscreen.tap(k.x + k.width / 2, k.y + k.height / 2);
    await page.waitForFunction(
      (n) => performance.getEntriesByName('ringcall:practice-tap-to-commit').length >= n,
      i + 1,
    );
  }
  const ms = await page.evaluate(() =>
    performance.getEntriesByName('ringcall:practice-tap-to-commit').map((e) => e.duration),
  );
  console.log(
    `plotted arrow kept → IndexedDB commit (the page hears of it), ${ms.length} arrows: p50 ${percentile(ms, 50).toFixed(1)} ms, p95 ${percentile(ms, 95).toFixed(1)} ms, max ${Math.max(...ms).toFixed(1)} ms (goal p95 ≤ 16 ms)`,
  );
  await browser.close();
} finally {
  server.child.kill('SIGTERM');
}
