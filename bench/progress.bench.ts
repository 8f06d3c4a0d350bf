/**
 * The progress screen over a year of practice: 300 sessions, 20,000 arrows written into the
 * page's IndexedDB, then the screen drawn (tap on "Progress over weeks" → every chart on screen
 * drawn; those below it are drawn when scrolled near, tests/e2e/progress.spec.ts) in Chromium at
 * 4× CPU throttling (`Emulation.setCPUThrottlingRate`), Pixel 7 viewport. Prints the
 * script time Chromium counts while drawing (`Performance.getMetrics` ScriptDuration; goal
 * ≤ 100 ms), the first time (1.5 s after the log shows: the progress screen's chunk fetched while
 * the log was idle, its code run for the first time) and again. BENCH_PROFILE=<folder> writes
 * CPU profiles of the first two visits; CLIENT_DIR=<folder> serves another build (the code before,
 * side by side). Needs a built client (`npm run build`) and Debian's Chromium.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { chromium, devices, type CDPSession } from '@playwright/test';
import { chromiumArgs, chromiumPath } from '../tests/support/chromium';
import { progressParts } from '../src/core/practice/progress';
import type { PracticeArrow } from '../src/core/practice';
import { startBenchServer } from './support/fieldPhone';
import { percentile } from './support/stats';

const SESSIONS = 300;
const ARROWS = 20_000;
const THROTTLE = 4;
const RUNS = 6;
/** Before the first tap (BENCH_PAUSE_MS=0: tapped as soon as the link shows). */
const PAUSE_MS = Number(process.env['BENCH_PAUSE_MS'] ?? 1500);
/** BENCH_PROFILE=<folder>: V8 CPU profiles of the first visit and the second (DevTools opens them). */
const PROFILE_DIR = process.env['BENCH_PROFILE'];

const server = await startBenchServer(4475, '.tmp/bench-progress');
// The server child would keep this process, and `npm run bench`, waiting for ever.
process.on('exit', () => server.child.kill('SIGTERM'));

/** A year of practice as the phone stores it (src/local/db.ts): rows for the two practice tables. */
function yearOfPractice() {
  const sessions: object[] = [];
  const ends: object[] = [];
  const setups = [
    { distanceM: 18, faceId: 'full-40', venue: 'indoor' },
    { distanceM: 70, faceId: 'full-122', venue: 'outdoor' },
    { distanceM: 30, faceId: 'full-80', venue: 'outdoor' },
  ] as const;
  const values = ['X', '10', '9', '8', '7', '6', '5', 'M'] as const;
  let seed = 17;
  const random = () => {
    seed = (seed * 1_103_515_245 + 12_345) % 2 ** 31;
    return seed / 2 ** 31;
  };
  const start = Date.parse('2025-12-01T17:00:00.000Z');
  let left = ARROWS;
  for (let s = 0; s < SESSIONS; s += 1) {
    const arrows = Math.round(left / (SESSIONS - s));
    left -= arrows;
    const setup = setups[s % 3]!;
    const id = `bench-${String(s).padStart(3, '0')}`;
    const startedAt = new Date(start + Math.floor((s * 365 * 86_400_000) / SESSIONS)).toISOString();
    // Skill grows over the year: the values lean higher as s grows.
    const own: { distanceM: number; faceId: (typeof setup)['faceId']; arrows: PracticeArrow[] }[] = [];
    for (let index = 0; index * 6 < arrows; index += 1) {
      const n = Math.min(6, arrows - index * 6);
      const shot = Array.from({ length: n }, (_, k): PracticeArrow => {
        const value = values[Math.min(7, Math.floor(random() * (5 - (3 * s) / SESSIONS)))]!;
        // Every other end plotted: a point kept with the value.
        return index % 2 === 0 ? { value, xMm: 3 * k - 7, yMm: 5 - 2 * k } : { value };
      });
      own.push({ distanceM: setup.distanceM, faceId: setup.faceId, arrows: shot });
      ends.push({ key: `${id}:${index}`, sessionId: id, index, ...setup, arrows: shot, at: startedAt });
    }
    sessions.push({
      id,
      ownerId: 0,
      startedAt,
      bowStyle: s % 5 === 0 ? 'barebow' : 'recurve',
      venue: setup.venue,
      distanceM: setup.distanceM,
      faceId: setup.faceId,
      arrowsPerEnd: 6,
      plannedEnds: null,
      shaftDiameterMm: 5.5,
      finishedAt: startedAt,
      // Kept with each arrow stored, as src/features/practice/practiceStore.ts does.
      progress: progressParts(own),
    });
  }
  return { sessions, ends };
}

async function scriptSeconds(cdp: CDPSession): Promise<number> {
  const { metrics } = await cdp.send('Performance.getMetrics');
  return metrics.find((m) => m.name === 'ScriptDuration')?.value ?? 0;
}

const browser = await chromium.launch({ executablePath: chromiumPath(), args: chromiumArgs });
try {
  const context = await browser.newContext({ ...devices['Pixel 7'], baseURL: server.base });
  const page = await context.newPage();
  // The practice log opens the phone's database (Dexie creates its tables).
  await page.goto('/practice');
  await page.getByRole('heading', { name: 'Practice log' }).waitFor();
  const year = yearOfPractice();
  // Written as the page would (raw IndexedDB into Dexie's tables); a string, as this file has no DOM types.
  await page.evaluate(`new Promise((resolve, reject) => {
    const { sessions, ends } = ${JSON.stringify(year)};
    const open = indexedDB.open('ringcall');
    open.onerror = () => reject(open.error);
    open.onsuccess = () => {
      const db = open.result;
      const tx = db.transaction(['practiceSessions', 'practiceEnds'], 'readwrite');
      for (const s of sessions) tx.objectStore('practiceSessions').put(s);
      for (const e of ends) tx.objectStore('practiceEnds').put(e);
      tx.oncomplete = () => { db.close(); resolve(); };
      tx.onerror = () => reject(tx.error);
    };
  })`);
  const stored = (year.ends as { arrows: unknown[] }[]).reduce((n, e) => n + e.arrows.length, 0);
  // The service worker installed by this first load takes control of the page once, on a new
  // phone: not during the measured tap (its "controlling" event then ran ~30 ms of script there).
  await page.waitForFunction(
    () =>
      (globalThis as { navigator?: { serviceWorker?: { controller: unknown } } }).navigator?.serviceWorker
        ?.controller != null,
  );
  await page.reload();
  const link = page.getByRole('link', { name: 'Progress over weeks' });
  await link.waitFor();
  // A person reads the log before tapping (BENCH_PAUSE_MS=0: the tap at once).
  await page.waitForTimeout(PAUSE_MS);

  // Playwright's own helper script starts in the page on its first evaluate (Chromium builds its
  // Temporal object then, ~65 ms of script at 4×): started here, it is not counted as the tap's.
  await page.evaluate('0');
  const cdp = await context.newCDPSession(page);
  await cdp.send('Performance.enable');
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: THROTTLE });
  const scriptMs: number[] = [];
  const wallMs: number[] = [];
  let charts = 0;
  for (let run = 0; run < RUNS; run += 1) {
    if (PROFILE_DIR && run < 2) {
      await cdp.send('Profiler.enable');
      await cdp.send('Profiler.setSamplingInterval', { interval: 100 });
      await cdp.send('Profiler.start');
    }
    const before = await scriptSeconds(cdp);
    const started = Date.now();
    // Clicked from inside the page: a Playwright locator's own search of the page (roles, names)
    // would count as the page's script time.
    // Tapped, and waited for with one observer of the charts' "drawn" mark: polling from here
    // (Playwright's script every 50 ms, each poll laying the page out) would be counted as the
    // page's script time too. The charts near the screen are drawn together (one
    // IntersectionObserver answer), so the first mark ends the wait; which of them are on screen
    // is read after the measurement.
    await page.evaluate(`new Promise((resolve) => {
      const watch = new MutationObserver(() => {
        watch.disconnect();
        resolve();
      });
      watch.observe(document.body, { subtree: true, attributes: true, attributeFilter: ['data-drawn'] });
      document.querySelector('a[href="/practice/progress"]').click();
    })`);
    wallMs.push(Date.now() - started);
    scriptMs.push(((await scriptSeconds(cdp)) - before) * 1000);
    const onScreen = (await page.evaluate(`[...document.querySelectorAll('[data-testid="progress-chart"]')]
      .filter((c) => c.getBoundingClientRect().top < innerHeight)
      .map((c) => c.dataset.drawn !== undefined)`)) as boolean[];
    if (onScreen.length === 0 || onScreen.includes(false))
      throw new Error('A chart on screen was not drawn.');
    charts = onScreen.length;
    if (PROFILE_DIR && run < 2) {
      const { profile } = await cdp.send('Profiler.stop');
      mkdirSync(PROFILE_DIR, { recursive: true });
      writeFileSync(
        `${PROFILE_DIR}/progress-${run === 0 ? 'first' : 'again'}.cpuprofile`,
        JSON.stringify(profile),
      );
    }
    if (run === 0) {
      await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
      await page.screenshot({ path: '.tmp/screens/progress-year.png' });
      await cdp.send('Emulation.setCPUThrottlingRate', { rate: THROTTLE });
    }
    await page.getByRole('link', { name: 'Back to the practice log' }).click();
    await link.waitFor();
  }
  const warm = scriptMs.slice(1);
  const warmWall = wallMs.slice(1);
  console.log(
    `progress screen, ${SESSIONS} sessions, ${stored} arrows in IndexedDB, ${charts} chart(s) on screen, CPU ${THROTTLE}× slower, Pixel 7 viewport:`,
  );
  console.log(
    `  script time drawing it (tap → the charts on screen drawn): first ${scriptMs[0]!.toFixed(0)} ms (the screen's code run for the first time), then p50 ${percentile(warm, 50).toFixed(0)} ms, max ${Math.max(...warm).toFixed(0)} ms over ${warm.length} (goal ≤ 100 ms)`,
  );
  console.log(
    `  wall time: first ${wallMs[0]} ms, then p50 ${percentile(warmWall, 50).toFixed(0)} ms; machine load (1-minute average, ${cpus().length} cores): ${loadavg()[0]!.toFixed(1)}`,
  );
} finally {
  await browser.close();
  server.child.kill('SIGTERM');
}
