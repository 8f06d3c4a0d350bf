import type { ComponentType } from 'react';
import type * as ProgressScreenModule from './ProgressScreen';
import type * as ProgressChartModule from './ProgressChart';

type ScreenModule = typeof ProgressScreenModule;
type ChartModule = typeof ProgressChartModule;
let screenModule: ScreenModule | undefined;
let chartModule: ChartModule | undefined;

/** The progress screen's chunk, and the chart library's after it: one specifier each, so both loads share them. */
export const loadProgressScreen = () => import('./ProgressScreen').then((m) => (screenModule = m));
export const loadProgressChart = () => import('./ProgressChart').then((m) => (chartModule = m));

/**
 * What React.lazy loads a component with. When its chunk came already (warmProgress), a thenable
 * that answers at once: React draws the component without suspending (a promise answers a
 * microtask later, and React would commit the fallback first, then draw again: on the first
 * visit, twice for the screen and again for the charts).
 */
function loadedFirst<M, P>(
  loaded: () => M | undefined,
  load: () => Promise<M>,
  pick: (m: M) => ComponentType<P>,
): () => Promise<{ default: ComponentType<P> }> {
  return () => {
    const module = loaded();
    if (!module) return load().then((m) => ({ default: pick(m) }));
    const now = { default: pick(module) };
    return { then: (answer: (value: typeof now) => void) => answer(now) } as Promise<typeof now>;
  };
}

export const progressScreenLoader = loadedFirst(
  () => screenModule,
  loadProgressScreen,
  (m) => m.ProgressScreen,
);
export const progressChartLoader = loadedFirst(
  () => chartModule,
  loadProgressChart,
  (m) => m.ProgressChart,
);

/** Runs `run` when the page is idle (or after 1.5 s without requestIdleCallback); the answer cancels it. */
function whenIdle(run: () => void): () => void {
  if (typeof requestIdleCallback === 'function') {
    const handle = requestIdleCallback(run, { timeout: 4000 });
    return () => cancelIdleCallback(handle);
  }
  const timer = setTimeout(run, 1500);
  return () => clearTimeout(timer);
}

/**
 * Fetches and runs the progress screen's and the chart's code while the practice log sits idle
 * (a chart drawn once, unseen: warmChart), so the tap on "Progress over weeks" does not wait for
 * them to be fetched and compiled; then `warmed`. A failed warm-up changes nothing: the tap loads
 * them again.
 */
export function warmProgress(warmed: () => void): () => void {
  let cancelled = false;
  const stop = whenIdle(() => {
    void loadProgressScreen()
      .then(() => (cancelled ? undefined : loadProgressChart()))
      .then((chart) => {
        if (cancelled || !chart) return;
        chart.warmChart();
        warmed();
      })
      .catch(() => undefined);
  });
  return () => {
    cancelled = true;
    stop();
  };
}

/**
 * Works out, while the log sits idle, what progress shows of the log's answers (progressView,
 * kept for the screen): the tap on "Progress over weeks" finds it done. Again for each new answer.
 */
export function warmProgressView(
  own: Parameters<ScreenModule['progressView']>[0],
  cards: Parameters<ScreenModule['progressView']>[1],
): () => void {
  let cancelled = false;
  const stop = whenIdle(() => {
    void loadProgressScreen()
      .then((screen) => {
        if (!cancelled) screen.progressView(own, cards, {});
      })
      .catch(() => undefined);
  });
  return () => {
    cancelled = true;
    stop();
  };
}
