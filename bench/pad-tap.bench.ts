/**
 * The pad in Chromium on a phone viewport: time from a key tap to the IndexedDB commit of its
 * outbox row (goal p95 ≤ 16 ms), as the browser's trace records it and as the page hears of it,
 * and each route's first load in bytes on the wire (budget for the pad ≤ 130 KiB with brotli). Needs a built
 * client (`npm run build`) and Debian's Chromium.
 */
import { spawnSync } from 'node:child_process';
import { chromium, devices } from '@playwright/test';
import { chromiumArgs, chromiumPath } from '../tests/support/chromium';
import { joinAsWriter, startBenchServer } from './support/fieldPhone';
import { COMMIT_TRACE_CATEGORIES, commitTimes, type Trace } from './support/idbTrace';
import { percentile } from './support/stats';

const server = await startBenchServer(4471, '.tmp/bench-pad');

try {
  const browser = await chromium.launch({ executablePath: chromiumPath(), args: chromiumArgs });
  const page = await browser.newPage({ ...devices['Pixel 7'] });
  await joinAsWriter(page, server, 20, 5);

  const values = ['X', '10', '9', '9', '8', '7'];
  /** Four ends for the group of four, tapping `pauseMs` apart (0: as fast as the driver can tap). */
  const enterFourEnds = async (
    pauseMs: number,
  ): Promise<{ durations: number[]; committed: number[]; perSecond: number }> => {
    await page.evaluate(() => performance.clearMeasures('ringcall:tap-to-commit'));
    await browser.startTracing(page, { categories: COMMIT_TRACE_CATEGORIES });
    const started = performance.now();
    let taps = 0;
    for (let end = 0; end < 4; end += 1) {
      const archers = await page.getByRole('tab').count();
      for (let a = 0; a < archers; a += 1) {
        await page.getByRole('tab').nth(a).click();
        for (const v of values) {
          // A finger on the key: the test driver's own click checks would run in the page during the measure.
          const key = page.getByRole('button', { name: `Arrow ${v}`, exact: true });
          await key.scrollIntoViewIfNeeded();
          const box = (await key.boundingBox())!;
          await page.touchscreen.tap(box.x + box.width / 2, box.y + box.height / 2);
          taps += 1;
          if (pauseMs) await page.waitForTimeout(pauseMs);
        }
      }
      await page.getByRole('button', { name: 'Next end' }).click();
    }
    const perSecond = taps / ((performance.now() - started) / 1000);
    await page.waitForTimeout(500);
    const durations = await page.evaluate(() =>
      performance.getEntriesByName('ringcall:tap-to-commit').map((e) => e.duration),
    );
    const committed = commitTimes(
      JSON.parse((await browser.stopTracing()).toString('utf8')) as Trace,
      'ringcall:tap-to-commit',
    );
    return { durations, committed, perSecond };
  };
  for (const [label, pauseMs] of [
    ['as fast as the test driver can tap', 0],
    ['a quick thumb, a pause of 250 ms after each tap', 250],
  ] as const) {
    const { durations, committed, perSecond } = await enterFourEnds(pauseMs);
    const figures = (ms: number[]) =>
      `${ms.length} taps: p50 ${percentile(ms, 50).toFixed(1)} ms, p95 ${percentile(ms, 95).toFixed(1)} ms, max ${Math.max(...ms).toFixed(1)} ms`;
    console.log(`${label} (${perSecond.toFixed(1)} taps/s):`);
    console.log(`  tap → IndexedDB commit (the browser's trace), ${figures(committed)} (goal p95 ≤ 16 ms)`);
    console.log(`  tap → the page hears of the commit, ${figures(durations)}`);
  }
  await browser.close();
} finally {
  server.child.kill('SIGTERM');
}

spawnSync(process.execPath, ['--import', 'tsx', 'scripts/report-route-sizes.ts'], { stdio: 'inherit' });
