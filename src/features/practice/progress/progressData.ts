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
