// One formatter for every label: toLocaleDateString builds a new one each call, which showed
// in the progress benchmark (52 weeks × 3 tables).
const dayMonthYear = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});

/** A week's Monday (YYYY-MM-DD, UTC) as a person reads it: "30 Nov 2026". */
export const weekLabel = (weekStart: string): string =>
  dayMonthYear.format(new Date(`${weekStart}T00:00:00Z`));

const localDay = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

/** The day a session started, on this phone's calendar: "3 Dec 2026". */
export const dayLabel = (iso: string): string => localDay.format(new Date(iso));

export const perArrow = (n: number) => n.toFixed(2);

/** A chart's height (CSS pixels), also kept by its place before it is drawn. */
export const CHART_HEIGHT = 220;

const WEEK_SECONDS = 7 * 24 * 60 * 60;
const secondsOf = (weekStart: string) => Date.parse(`${weekStart}T00:00:00Z`) / 1000;

/**
 * Weeks on a time axis: every week from the first with practice to the last, in seconds (UTC
 * Mondays are exactly a week apart), with no average where nobody shot, so the line breaks there
 * instead of joining weeks months apart as if they were neighbours.
 */
export function weeklyLine(weeks: readonly { weekStart: string; averagePerArrow: number }[]): {
  xs: number[];
  ys: (number | null)[];
} {
  if (weeks.length === 0) return { xs: [], ys: [] };
  const byWeek = new Map(weeks.map((w) => [secondsOf(w.weekStart), w.averagePerArrow]));
  const first = secondsOf(weeks[0]!.weekStart);
  const last = secondsOf(weeks[weeks.length - 1]!.weekStart);
  const xs: number[] = [];
  for (let x = first; x <= last; x += WEEK_SECONDS) xs.push(x);
  return { xs, ys: xs.map((x) => byWeek.get(x) ?? null) };
}
