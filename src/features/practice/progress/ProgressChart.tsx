import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { ProgressSeries } from '../../../core/practice/progress';
import { CHART_HEIGHT, perArrow, weeklyLine } from './progressData';

const shortDay = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
const dayOf = (seconds: number) => shortDay.format(new Date(seconds * 1000));

/** The chart of one series drawn into `el` (uPlot); its destroy takes it down. */
function drawChart(el: HTMLElement, series: ProgressSeries): uPlot {
  // Weeks placed by date; a week with no practice breaks the line (the table gives every week).
  const { xs, ys: averages } = weeklyLine(series.weeks);
  const bestAt = Date.parse(`${series.best.weekStart}T00:00:00Z`) / 1000;
  const best = xs.map((x) => (x === bestAt ? series.best.averagePerArrow : null));
  const week = 7 * 24 * 60 * 60;
  const labelEvery = Math.max(1, Math.ceil(xs.length / 4));
  const ys = [...series.weeks.map((w) => w.averagePerArrow), series.best.averagePerArrow];
  const low = Math.max(0, Math.floor(Math.min(...ys)) - 1);
  const high = Math.min(11, Math.ceil(Math.max(...ys)) + 0.5);
  const ink = '#123047';
  return new uPlot(
    {
      width: Math.max(240, el.clientWidth),
      height: CHART_HEIGHT,
      legend: { show: false },
      cursor: { show: false },
      scales: {
        // Half a week either side, so a lone week stands in the middle. Labels are our own (UTC).
        x: { time: false, auto: false, range: [xs[0]! - week / 2, xs[xs.length - 1]! + week / 2] },
        y: { range: [low, high] },
      },
      axes: [
        {
          stroke: ink,
          font: '14px "Atkinson Hyperlegible", sans-serif',
          splits: () => xs.filter((_x, i) => i % labelEvery === 0),
          values: (_u, splits) => splits.map(dayOf),
        },
        {
          stroke: ink,
          font: '14px "Atkinson Hyperlegible", sans-serif',
          size: 44,
          values: (_u, splits) => splits.map((s) => s.toFixed(1)),
        },
      ],
      series: [
        {},
        {
          label: 'Average per arrow',
          stroke: '#1f5f3a',
          width: 3,
          // Points always drawn: a week alone between gaps has no line to show it.
          points: { show: true, size: 9, fill: '#1f5f3a', stroke: '#1f5f3a' },
        },
        {
          label: 'Best session',
          stroke: ink,
          paths: () => null,
          points: { show: true, size: 18, width: 3, stroke: ink, fill: 'transparent' },
        },
      ],
    },
    [xs, averages, best],
    el,
  );
}

/** Two made-up weeks, drawn once while the log is idle (warmChart). */
const WARM_SERIES: ProgressSeries = {
  distanceM: 18,
  faceId: 'full-40',
  weeks: [
    { weekStart: '2026-01-05', sessions: 1, arrows: 3, total: 27, averagePerArrow: 9 },
    { weekStart: '2026-01-19', sessions: 1, arrows: 3, total: 24, averagePerArrow: 8 },
  ],
  best: {
    sessionId: 'warm',
    startedAt: '2026-01-05T17:00:00.000Z',
    weekStart: '2026-01-05',
    arrows: 3,
    averagePerArrow: 9,
  },
};

/**
 * Draws a chart into a box that is never shown and takes it down, while the practice log sits
 * idle: uPlot's code is compiled and run once then, not on the tap on "Progress over weeks"
 * (the first visit cost ~70 ms more of script than later ones at 4× CPU, bench/progress.bench.ts).
 */
export function warmChart(): void {
  const plot = drawChart(document.createElement('div'), WARM_SERIES);
  // uPlot draws in a microtask after it is made: taken down after that draw.
  setTimeout(() => plot.destroy(), 0);
}

/** How near the screen's edge a chart below it is drawn: before the archer scrolls to it. */
const DRAW_AHEAD = '300px';

/**
 * The weekly average per arrow of one distance and face on a time axis, drawn with uPlot (this file is the only
 * one that imports it, loaded after the progress screen). The best session is a larger ring on
 * its week. Hidden from screen readers: the table beside it holds the same figures. Drawn when
 * it comes near the screen: on a phone the first chart shows, the others wait for a scroll
 * (each chart's canvases at the phone's pixel ratio were most of the tap's cost).
 */
export function ProgressChart({ series }: { series: ProgressSeries }) {
  const box = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    let plot: uPlot | undefined;
    const draw = () => {
      plot = drawChart(el, series);
      el.dataset['drawn'] = String(series.weeks.length);
    };
    const near = new IntersectionObserver(
      (entries) => {
        if (!entries.some((e) => e.isIntersecting)) return;
        near.disconnect();
        draw();
      },
      { rootMargin: `${DRAW_AHEAD} 0px` },
    );
    near.observe(el);
    return () => {
      near.disconnect();
      plot?.destroy();
      delete el.dataset['drawn'];
    };
  }, [series]);
  return (
    <div
      ref={box}
      aria-hidden="true"
      data-testid="progress-chart"
      title={`Average per arrow by week; best session ${perArrow(series.best.averagePerArrow)}`}
      // The chart's height before it is drawn: the page does not jump when it is.
      style={{ minHeight: CHART_HEIGHT }}
      className="w-full overflow-hidden"
    />
  );
}
