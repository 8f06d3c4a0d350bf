/**
 * The practice screen in Chromium on a phone viewport: time from the "Keep arrow" tap to the
 * committed IndexedDB transaction of a plotted arrow, as Chromium's trace records it (goal p95
 * ≤ 16 ms, the pad tap's budget, measured the same way: bench/pad-tap.bench.ts) and as the page
 * hears of it, over an open-ended session of 120 plotted arrows, with no account and
 * offline. Needs a built client (`npm run build`) and Debian's Chromium; CLIENT_DIR=<folder>
 * serves another build (the code before, side by side).
 */
import { cpus, loadavg } from 'node:os';
import { chromium, devices } from '@playwright/test';
import { chromiumArgs, chromiumPath } from '../tests/support/chromium';
import { startBenchServer } from './support/fieldPhone';
import { COMMIT_TRACE_CATEGORIES, commitTimes, type Trace } from './support/idbTrace';
import { percentile } from './support/stats';

const ARROWS = 120;
const server = await startBenchServer(4473, '.tmp/bench-practice');
// The server child would otherwise outlive a run that fails, holding the port for the next.
process.on('exit', () => server.child.kill('SIGTERM'));

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

  await browser.startTracing(page, { categories: COMMIT_TRACE_CATEGORIES });
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
  const committed = commitTimes(
    JSON.parse((await browser.stopTracing()).toString('utf8')) as Trace,
    'ringcall:practice-tap-to-commit',
  );
  const figures = (t: number[]) =>
    `${t.length} arrows: p50 ${percentile(t, 50).toFixed(1)} ms, p95 ${percentile(t, 95).toFixed(1)} ms, max ${Math.max(...t).toFixed(1)} ms`;
  console.log(`plotted arrow kept → IndexedDB commit (the browser's trace), ${figures(committed)} (goal p95 ≤ 16 ms)`);
  console.log(`plotted arrow kept → the page hears of the commit, ${figures(ms)}`);
  console.log(`machine load (1-minute average, ${cpus().length} cores): ${loadavg()[0]!.toFixed(1)}`);
  await browser.close();
} finally {
  server.child.kill('SIGTERM');
}
