/**
 * The pad in Chromium on a phone viewport: time from a key tap to the IndexedDB commit of its
 * outbox row (goal p95 ≤ 16 ms), and each route's first-load JavaScript (goal for the pad
 * ≤ 130 KiB gzip). Needs a built client (`npm run build`) and Debian's Chromium.
 */
import { spawn, spawnSync } from 'node:child_process';
import { rmSync } from 'node:fs';
import Database from 'better-sqlite3';
import { chromium, devices } from '@playwright/test';
import { chromiumArgs, chromiumPath } from '../tests/support/chromium';
import { DEMO_PASSWORD, demoArchers } from '../server/demo/demoPeople';
import { percentile } from './support/stats';

const PORT = 4471;
const dir = '.tmp/bench-pad';
rmSync(dir, { recursive: true, force: true });
const server = spawn(process.execPath, ['--import', 'tsx', 'tests/e2e/support/startTestServer.ts'], {
  env: { ...process.env, PORT: String(PORT), HOST: '127.0.0.1', DATA_DIR: dir, MAIL_CATCHER_PORT: '0' },
  stdio: ['ignore', 'pipe', 'inherit'],
});
const base = `http://127.0.0.1:${PORT}`;
for (let i = 0; ; i += 1) {
  if (
    await fetch(`${base}/api/health`).then(
      (r) => r.ok,
      () => false,
    )
  )
    break;
  if (i > 100) throw new Error('The bench server did not start.');
  await new Promise((r) => setTimeout(r, 200));
}

try {
  const db = new Database(`${dir}/ringcall.sqlite`, { readonly: true });
  const { code } = db
    .prepare('select code from join_codes where target_number = 5 and revoked_at is null')
    .get() as { code: string };
  db.close();

  const browser = await chromium.launch({ executablePath: chromiumPath(), args: chromiumArgs });
  const page = await browser.newPage({ ...devices['Pixel 7'] });
  await page.goto(`${base}/sign-in`);
  await page.getByLabel('E-mail').fill(demoArchers()[20]!.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-name').waitFor();
  await page.goto(`${base}/join?code=${code}`);
  await page.getByRole('radio', { name: /Writer 1/ }).check();
  await page.getByRole('button', { name: 'Join target' }).click();
  await page.getByTestId('end-number').waitFor();

  const values = ['X', '10', '9', '9', '8', '7'];
  /** Four ends for the group of four, tapping `pauseMs` apart (0: as fast as the driver can tap). */
  const enterFourEnds = async (pauseMs: number): Promise<{ durations: number[]; perSecond: number }> => {
    await page.evaluate(() => performance.clearMeasures('ringcall:tap-to-commit'));
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
    return { durations, perSecond };
  };
  for (const [label, pauseMs] of [
    ['as fast as the test driver can tap', 0],
    ['a quick thumb, a pause of 250 ms after each tap', 250],
  ] as const) {
    const { durations, perSecond } = await enterFourEnds(pauseMs);
    console.log(
      `tap → IndexedDB commit, ${label} (${perSecond.toFixed(1)} taps/s), ${durations.length} taps: p50 ${percentile(durations, 50).toFixed(1)} ms, ` +
        `p95 ${percentile(durations, 95).toFixed(1)} ms, max ${Math.max(...durations).toFixed(1)} ms (goal p95 ≤ 16 ms)`,
    );
  }
  await browser.close();
} finally {
  server.kill('SIGTERM');
}

spawnSync(process.execPath, ['--import', 'tsx', 'scripts/report-route-sizes.ts'], { stdio: 'inherit' });
console.log('(goal: the pad route ≤ 130 KiB gzip)');
