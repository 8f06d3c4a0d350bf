import { describe, expect, it } from 'vitest';
import { weeklyLine } from '../../src/features/practice/progress/progressData';

const day = (iso: string) => Date.parse(`${iso}T00:00:00Z`) / 1000;

describe('weeks on the progress chart’s time axis', () => {
  it('places weeks by date and leaves a week with no practice empty, so the line breaks', () => {
    const line = weeklyLine([
      { weekStart: '2026-11-02', averagePerArrow: 8.5 },
      { weekStart: '2026-11-23', averagePerArrow: 9.1 },
    ]);
    expect(line.xs).toEqual([day('2026-11-02'), day('2026-11-09'), day('2026-11-16'), day('2026-11-23')]);
    expect(line.ys).toEqual([8.5, null, null, 9.1]);
  });

  it('steps whole weeks across a clock change and a new year (UTC Mondays)', () => {
    const line = weeklyLine([
      { weekStart: '2026-10-19', averagePerArrow: 7 },
      { weekStart: '2027-01-04', averagePerArrow: 8 },
    ]);
    expect(line.xs).toHaveLength(12);
    expect(line.xs[1]! - line.xs[0]!).toBe(7 * 86400);
    expect(line.xs.at(-1)).toBe(day('2027-01-04'));
    expect(line.ys.filter((y) => y !== null)).toEqual([7, 8]);
  });

  it('draws nothing for no weeks', () => {
    expect(weeklyLine([])).toEqual({ xs: [], ys: [] });
  });
});
