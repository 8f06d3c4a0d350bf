import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { ProgressSeries } from '../../../core/practice/progress';
import { perArrow } from './progressData';

const shortDay = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
const dayOf = (weekStart: string) => shortDay.format(new Date(`${weekStart}T00:00:00Z`));

/**
 * The weekly average per arrow of one distance and face, drawn with uPlot (this file is the only
 * one that imports it, loaded after the progress screen). The best session is a larger ring on
 * its week. Hidden from screen readers: the table beside it holds the same figures.
 */
export function ProgressChart({ series }: { series: ProgressSeries }) {
  const box = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    // One step a week with practice (the table gives every date): a year stays readable on a phone.
    const xs = series.weeks.map((_w, i) => i);
    const labelEvery = Math.max(1, Math.ceil(series.weeks.length / 4));
    const averages = series.weeks.map((w) => w.averagePerArrow);
    const best = series.weeks.map((w) =>
      w.weekStart === series.best.weekStart ? series.best.averagePerArrow : null,
    );
    const ys = [...averages, series.best.averagePerArrow];
    const low = Math.max(0, Math.floor(Math.min(...ys)) - 1);
    const high = Math.min(11, Math.ceil(Math.max(...ys)) + 0.5);
    const ink = '#123047';
    const plot = new uPlot(
      {
        width: Math.max(240, el.clientWidth),
        height: 220,
        legend: { show: false },
        cursor: { show: false },
        scales: {
          // Half a step either side, so a lone week stands in the middle.
          x: { time: false, auto: false, range: [-0.5, xs.length - 0.5] },
          y: { range: [low, high] },
        },
        axes: [
          {
            stroke: ink,
            font: '14px "Atkinson Hyperlegible", sans-serif',
            splits: () => xs.filter((i) => i % labelEvery === 0),
            values: (_u, splits) => splits.map((i) => dayOf(series.weeks[i]?.weekStart ?? '')),
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
            points: { size: 9, fill: '#1f5f3a', stroke: '#1f5f3a' },
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
    el.dataset['drawn'] = String(series.weeks.length);
    return () => plot.destroy();
  }, [series]);
  return (
    <div
      ref={box}
      aria-hidden="true"
      data-testid="progress-chart"
      title={`Average per arrow by week; best session ${perArrow(series.best.averagePerArrow)}`}
      className="w-full overflow-hidden"
    />
  );
}
