/** The progress screen's chunk, and the chart library's after it: one specifier each, so both loads share them. */
export const loadProgressScreen = () => import('./ProgressScreen');
export const loadProgressChart = () => import('./ProgressChart');

/**
 * Fetches and runs the progress screen's and the chart's code while the practice log sits idle
 * (a chart drawn once, unseen: warmChart), so the tap on "Progress over weeks" does not wait for
 * them to be fetched and compiled. A failed warm-up changes nothing: the tap loads them again.
 */
export function warmProgress(): () => void {
  let cancelled = false;
  const run = () => {
    if (cancelled) return;
    void loadProgressScreen()
      .then(() => (cancelled ? undefined : loadProgressChart()))
      .then((chart) => {
        if (!cancelled) chart?.warmChart();
      })
      .catch(() => undefined);
  };
  if (typeof requestIdleCallback === 'function') {
    const handle = requestIdleCallback(run, { timeout: 4000 });
    return () => {
      cancelled = true;
      cancelIdleCallback(handle);
    };
  }
  const timer = setTimeout(run, 1500);
  return () => {
    cancelled = true;
    clearTimeout(timer);
  };
}
