/**
 * The app as a mid-range phone on a weak signal sees it: Chromium (Pixel 7 viewport) with its CPU
 * slowed 4× and its network at 1.6 Mbps down / 750 kbps up with 150 ms round trips, both set
 * through the DevTools protocol.
 * - Cold load (empty HTTP cache, no service worker; the phone has signed in and joined) of the pad
 *   and of the home screen: largest contentful paint, budget ≤ 2.5 s.
 * - Offline repeat load of the pad from the service worker: the installed app reopened in a phone's
 *   own profile (support/installedPhone.ts) with its tabs closed, largest contentful paint, budget
 *   ≤ 1 s, beside the floor: a one-line page from a service worker, reopened the same way
 *   (support/offlineFloor.ts).
 * - Tap → next paint on the pad's keys (Event Timing: an interaction's longest event, from the
 *   input to the frame after its handlers), against a one-button page tapped the same way (same
 *   viewport, touch taps, throttle and warm-up), each pad tap followed by one there: budget p95 ≤
 *   1.5× the one-button page's. Between them, the same key on the pad's markup copied into a page
 *   without the app: what the page itself costs a tap, apart from the app's work.
 * Needs a built client (`npm run build`) and Debian's Chromium. Figures are printed, never asserted.
 * SLOW_PHONE_PARTS=taps (of cold, offline, taps) runs parts alone, SLOW_PHONE_LOADS more loads; CLIENT_DIR=<folder> serves another build.
 */
import { chromium, devices, type BrowserContext, type Page } from '@playwright/test';
import { chromiumArgs, chromiumPath } from '../tests/support/chromium';
import { joinAsWriter, startBenchServer } from './support/fieldPhone';
import { median, percentile } from './support/stats';
import { offlineFloor } from './support/offlineFloor';
import { closeAppTabs, phoneProfile } from './support/installedPhone';

const CPU_SLOWDOWN = 4;
const WEAK_SIGNAL = {
  offline: false,
  latency: 150,
  downloadThroughput: 1_600_000 / 8,
  uploadThroughput: 750_000 / 8,
};
const LOADS = Number(process.env.SLOW_PHONE_LOADS ?? 3);
/** Which parts run (`SLOW_PHONE_PARTS=offline` for the offline repeat load alone). */
const PARTS = (process.env.SLOW_PHONE_PARTS ?? 'cold,offline,taps').split(',');
const TAPS = 120;
const TAP_PAUSE_MS = 250;
const WARM_UP_TAPS = 6;

async function slowDown(page: Page, network: boolean) {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: CPU_SLOWDOWN });
  // DevTools' network log only where the network is slowed: it costs the page's main thread on
  // every request, which a phone does not pay.
  if (network) {
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', WEAK_SIGNAL);
  }
  return cdp;
}

/** The page's largest contentful paint (ms from navigation start), from its buffered entries. */
function largestContentfulPaint(page: Page): Promise<number> {
  return page.evaluate(
    () =>
      new Promise<number>((resolve) => {
        new PerformanceObserver((list) => resolve(list.getEntries().at(-1)!.startTime)).observe({
          type: 'largest-contentful-paint',
          buffered: true,
        } as unknown as ObserveOptions);
      }),
  );
}

/**
 * Waits, in the page itself, for an element with this test id. Not Playwright's locators: their
 * selector engine is a large script compiled in the page on first use (~90 ms of the main thread
 * at 4× CPU, in Chromium's trace), which landed while the app was still starting and delayed its
 * paint; no phone runs it.
 */
function shown(page: Page, testId: string): Promise<void> {
  return page.evaluate(`new Promise((resolve) => {
    const look = () => (document.querySelector('[data-testid="${testId}"]') ? resolve() : requestAnimationFrame(look));
    look();
  })`);
}

/** Loads `url` `LOADS` times, each with an empty HTTP cache, and returns each load's LCP. */
async function coldLoads(context: BrowserContext, url: string, ready: (page: Page) => Promise<void>) {
  const lcps: number[] = [];
  for (let i = 0; i < LOADS; i += 1) {
    const page = await context.newPage();
    const cdp = await slowDown(page, true);
    await cdp.send('Network.clearBrowserCache');
    await page.goto(url);
    await ready(page);
    await page.waitForLoadState('networkidle');
    lcps.push(await largestContentfulPaint(page));
    await page.close();
  }
  return lcps;
}

/** The page's own types, which this Node-typed file does not have (the DOM's event timing entries). */
type TapEntry = {
  interactionId?: number;
  startTime: number;
  duration: number;
  processingStart: number;
  processingEnd: number;
  target?: { closest?: (s: string) => { ariaLabel: string | null } | null } | null;
};
type ObserveOptions = Parameters<InstanceType<typeof PerformanceObserver>['observe']>[0];
/** One tap's longest event: tap → next paint, and its three parts (Event Timing's own split). */
type TapPaint = { duration: number; inputDelay: number; handlers: number; presentation: number };
type WithTaps = { tapPaints: Map<number, TapPaint>; tapsFrom: number };

/**
 * Starts collecting, per tap on a matching element, its longest event's duration (tap → next
 * paint) with its parts: waiting for the main thread (input delay), the page's handlers (the
 * app's JavaScript and React's render), and the frame after them (style, layout, paint);
 * `countTapsFromNow` drops what the warm-up taps left.
 */
async function watchTaps(page: Page, labelStart: string) {
  await page.evaluate((start) => {
    const watched = globalThis as unknown as WithTaps;
    watched.tapPaints = new Map();
    watched.tapsFrom = 0;
    new PerformanceObserver((list) => {
      for (const e of list.getEntries() as unknown as TapEntry[]) {
        const label = e.target?.closest?.('button')?.ariaLabel ?? '';
        if (!e.interactionId || e.startTime < watched.tapsFrom || !label.startsWith(start)) continue;
        const before = watched.tapPaints.get(e.interactionId);
        if (before && before.duration >= e.duration) continue;
        watched.tapPaints.set(e.interactionId, {
          duration: e.duration,
          inputDelay: e.processingStart - e.startTime,
          handlers: e.processingEnd - e.processingStart,
          presentation: e.startTime + e.duration - e.processingEnd,
        });
      }
    }).observe({
      type: 'event',
      durationThreshold: 16,
      buffered: true,
    } as unknown as ObserveOptions);
  }, labelStart);
}
const countTapsFromNow = (page: Page) =>
  page.evaluate(() => {
    const watched = globalThis as unknown as WithTaps;
    watched.tapPaints.clear();
    watched.tapsFrom = performance.now();
  });
const tapPaints = (page: Page) =>
  page.evaluate(() => [...(globalThis as unknown as WithTaps).tapPaints.values()]);

/** A touch tap in the middle of the button named `name`, as a finger makes. */
async function tap(page: Page, name: string) {
  // A tab in the background gets no input: the page tapped is the one in front, as on a phone.
  await page.bringToFront();
  const target = page.getByRole('button', { name, exact: true });
  await target.scrollIntoViewIfNeeded();
  const box = (await target.boundingBox())!;
  await page.touchscreen.tap(box.x + box.width / 2, box.y + box.height / 2);
  await page.waitForTimeout(TAP_PAUSE_MS);
}

/**
 * A page with one button that counts its taps: the floor this browser and throttle set. Its
 * viewport is the app's own (`index.html`), so both lay out and scale alike.
 */
const ONE_BUTTON_PAGE = `<!doctype html>
<meta name="viewport" content="width=device-width, initial-scale=1, viewport-fit=cover">
<button aria-label="Tap me" style="font-size:32px;padding:24px">Tapped 0</button>
<script>let n = 0; const b = document.querySelector('button');
b.addEventListener('click', () => { n += 1; b.textContent = 'Tapped ' + n; });</script>`;

/** The one-button page, open beside the pad. */
async function oneButtonPage(context: BrowserContext, base: string): Promise<Page> {
  const page = await context.newPage();
  await page.route(`${base}/bench/one-button`, (route) =>
    route.fulfill({ contentType: 'text/html', body: ONE_BUTTON_PAGE }),
  );
  await page.goto(`${base}/bench/one-button`);
  return page;
}

/**
 * The pad's own markup and styles, copied from the open pad into a page without the app: its keys
 * only write the tapped value into the end's line. Tapped as the pad is, it shows what the page
 * itself costs a tap (hit tests, style, layout and paint of this markup) apart from what the app
 * does on a tap (React, the database).
 */
async function padMarkupPage(pad: Page, context: BrowserContext, base: string): Promise<Page> {
  // The page's own script, as a string: this file is typed for Node, not the DOM.
  const script = `document.addEventListener('click', (e) => {
    const key = e.target.closest('button[aria-label^="Arrow "]');
    const line = [...document.querySelectorAll('p')].find((p) => p.textContent.startsWith('End '));
    if (key && line) line.firstChild.textContent = 'End ' + key.textContent + ' ';
  });`;
  const html = await pad.evaluate<string>(`(() => {
    const head = [...document.head.querySelectorAll('meta[name="viewport"], link[rel="stylesheet"], style')]
      .map((e) => e.outerHTML).join('');
    return '<!doctype html><html class="' + document.documentElement.className + '"><head>' + head +
      '</head><body>' + document.body.innerHTML + '<script>' + ${JSON.stringify(script)} + '</' + 'script></body></html>';
  })()`);
  const page = await context.newPage();
  await page.route(`${base}/bench/pad-markup`, (route) =>
    route.fulfill({ contentType: 'text/html', body: html }),
  );
  await page.goto(`${base}/bench/pad-markup`);
  return page;
}

/**
 * Taps the pad's keys as a writer enters ends, each tap followed by the same key on the pad's
 * markup without the app and one on the one-button page, so a burst of load from elsewhere on the
 * machine weighs on all alike. All are slowed and watched the same way (from the start), every
 * counted press is a touch tap, and the first `WARM_UP_TAPS` of each are not counted (the code a
 * tap runs is compiled then).
 */
async function tapsSideBySide(
  pad: Page,
  markup: Page,
  floor: Page,
): Promise<{ pad: TapPaint[]; markup: TapPaint[]; floor: TapPaint[] }> {
  for (const [page, label] of [
    [pad, 'Arrow '],
    [markup, 'Arrow '],
    [floor, 'Tap me'],
  ] as const) {
    await slowDown(page, false);
    await watchTaps(page, label);
  }
  const values = ['X', '10', '9', '9', '8', '7'];
  for (let taps = 0; taps < TAPS + WARM_UP_TAPS;) {
    const archers = await pad.getByRole('tab').count();
    for (let a = 0; a < archers && taps < TAPS + WARM_UP_TAPS; a += 1) {
      // Playwright's click, which waits for the tab to be uncovered: a touch at a tab scrolled to
      // the screen's top edge lands on the app's sticky header instead.
      await pad.bringToFront();
      await pad.getByRole('tab').nth(a).click();
      for (const v of values) {
        await tap(pad, `Arrow ${v}`);
        await tap(markup, `Arrow ${v}`);
        await tap(floor, 'Tap me');
        taps += 1;
        if (taps === WARM_UP_TAPS) for (const page of [pad, markup, floor]) await countTapsFromNow(page);
      }
    }
    await pad.bringToFront();
    await pad.getByRole('button', { name: 'Next end' }).click();
  }
  await pad.waitForTimeout(500);
  return { pad: await tapPaints(pad), markup: await tapPaints(markup), floor: await tapPaints(floor) };
}

/**
 * Reopening the installed app on the pad with no signal: the phone's own profile (compiled code
 * kept as on a phone), the app's tabs closed first, each load a new tab.
 */
async function offlineRepeat(server: Awaited<ReturnType<typeof startBenchServer>>) {
  const phone = await phoneProfile();
  const { context } = phone;
  try {
    const page = await context.newPage();
    await joinAsWriter(page, server, 21, 6);
    // Installed and precached, then the phone loses its signal.
    await page.evaluate(() =>
      (
        globalThis as unknown as { navigator: { serviceWorker: { ready: Promise<unknown> } } }
      ).navigator.serviceWorker.ready.then(() => undefined),
    );
    const padUrl = page.url();
    await closeAppTabs(context);
    await context.setOffline(true);
    const lcps: number[] = [];
    for (let i = 0; i < LOADS; i += 1) {
      const repeat = await context.newPage();
      await slowDown(repeat, false);
      await repeat.goto(padUrl);
      await shown(repeat, 'end-number');
      await repeat.waitForTimeout(500);
      lcps.push(await largestContentfulPaint(repeat));
      await repeat.close();
    }
    return lcps;
  } finally {
    await phone.close();
  }
}

// Another port when two people bench at once (`SLOW_PHONE_PORT`).
const port = Number(process.env.SLOW_PHONE_PORT ?? 4474);
const server = await startBenchServer(port, `.tmp/bench-slow-phone-${port}`);
try {
  const browser = await chromium.launch({ executablePath: chromiumPath(), args: chromiumArgs });
  // Cold loads and taps without a service worker: every file comes over the (slowed) network.
  const context = await browser.newContext({ ...devices['Pixel 7'], serviceWorkers: 'block' });
  const page = await context.newPage();
  await joinAsWriter(page, server, 20, 5);
  const padUrl = page.url();

  const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
  const loads = (label: string, lcps: number[], budgetMs: number) =>
    console.log(
      `${label}: LCP median ${s(median(lcps))}, worst ${s(Math.max(...lcps))} over ${lcps.length} loads (budget ≤ ${s(budgetMs)}; each: ${lcps.map(s).join(', ')})`,
    );
  console.log(
    `CPU ${CPU_SLOWDOWN}× slower; network 1.6 Mbps down, 750 kbps up, ${WEAK_SIGNAL.latency} ms round trip.`,
  );
  if (PARTS.includes('cold')) {
    loads('cold pad', await coldLoads(context, padUrl, (p) => shown(p, 'end-number')), 2500);
    loads(
      'cold home (signed in)',
      await coldLoads(context, `${server.base}/`, (p) => shown(p, 'signed-in-name')),
      2500,
    );
  }
  if (PARTS.includes('offline')) {
    loads('offline repeat pad (service worker)', await offlineRepeat(server), 1000);
    const floor = await offlineFloor(LOADS, async (tab, url) => {
      await slowDown(tab, false);
      await tab.goto(url);
      await tab.waitForTimeout(500);
      const lcp = await largestContentfulPaint(tab);
      await tab.close();
      return lcp;
    });
    loads('  floor: a one-line page from a service worker, the same way', floor, 1000);
  }
  if (PARTS.includes('taps')) await tapFigures(page, context);
  await browser.close();
} finally {
  server.child.kill('SIGTERM');
}

async function tapFigures(page: Page, context: BrowserContext) {
  const taps = await tapsSideBySide(
    page,
    await padMarkupPage(page, context, server.base),
    await oneButtonPage(context, server.base),
  );
  const [pad, markup, floor] = [taps.pad, taps.markup, taps.floor].map((t) => t.map((x) => x.duration)) as [
    number[],
    number[],
    number[],
  ];
  const figures = (ms: number[]) =>
    `p50 ${percentile(ms, 50).toFixed(0)} ms, p95 ${percentile(ms, 95).toFixed(0)} ms, max ${Math.max(...ms).toFixed(0)} ms (${ms.length} taps)`;
  const ratio = (a: number[], b: number[]) => (percentile(a, 95) / percentile(b, 95)).toFixed(2);
  console.log(`tap → next paint, one-button page: ${figures(floor)}`);
  console.log(`tap → next paint, the pad's markup without the app: ${figures(markup)}`);
  console.log(`tap → next paint, pad arrow keys: ${figures(pad)}`);
  console.log(`pad p95 / one-button p95 = ${ratio(pad, floor)} (budget ≤ 1.5)`);
  console.log(
    `  of which the page itself (markup / one-button) ${ratio(markup, floor)}, the app's work (pad / markup) ${ratio(pad, markup)}`,
  );
  // Where a tap's time goes, on each page: what the app adds shows as handlers and presentation.
  const part = (t: TapPaint[], k: Exclude<keyof TapPaint, 'duration'>) =>
    `${percentile(
      t.map((x) => x[k]),
      50,
    ).toFixed(1)} / ${percentile(
      t.map((x) => x[k]),
      95,
    ).toFixed(1)}`;
  console.log(
    '  parts of a tap, p50 / p95 ms: input delay (main thread busy) · handlers · presentation (the frame)',
  );
  for (const [label, t] of [
    ['one-button', taps.floor],
    ['markup', taps.markup],
    ['pad', taps.pad],
  ] as const) {
    console.log(
      `    ${label.padEnd(10)} ${part(t, 'inputDelay')} · ${part(t, 'handlers')} · ${part(t, 'presentation')}`,
    );
  }
}
