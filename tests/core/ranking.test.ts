// Ranking ties: total, then 10s (X included), then Xs; archers still equal stay tied, and a
// shoot-off settles a tie that decides a cut (WA Book 3, ties; article number not given, check
// against the edition in use). Shared places 1, 2, 2, 4 are standard competition ranking:
// common practice.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ScoringError, rankArchers } from '../../src/core';

const row = (id: string, total: number, tens = 0, xs = 0) => ({ id, total, tens, xs });

describe('rankArchers', () => {
  it('orders by total, then 10s, then Xs (WA Book 3)', () => {
    const ranked = rankArchers([
      row('a', 650, 20, 8),
      row('b', 660, 10, 2),
      row('c', 650, 20, 9),
      row('d', 650, 22, 1),
    ]);
    expect(ranked.map((r) => [r.id, r.place, r.tied])).toEqual([
      ['b', 1, false],
      ['d', 2, false],
      ['c', 3, false],
      ['a', 4, false],
    ]);
  });

  it('shares places for equal archers and skips the next (1, 2, 2, 4)', () => {
    const ranked = rankArchers([
      row('a', 600, 30, 10),
      row('b', 590, 20, 5),
      row('c', 590, 20, 5),
      row('d', 580),
    ]);
    expect(ranked.map((r) => [r.id, r.place, r.tied])).toEqual([
      ['a', 1, false],
      ['b', 2, true],
      ['c', 2, true],
      ['d', 4, false],
    ]);
  });

  it('keeps tied archers in the order given', () => {
    expect(rankArchers([row('z', 500), row('y', 500), row('x', 500)]).map((r) => r.id)).toEqual([
      'z',
      'y',
      'x',
    ]);
  });

  it('flags a shoot-off only for a tie that straddles the cut', () => {
    const rows = [row('a', 600), row('b', 590), row('c', 590), row('d', 580)];
    const shootOffs = (cut: number) => rankArchers(rows, { cut }).map((r) => r.shootOff);
    expect(shootOffs(2)).toEqual([false, true, true, false]);
    expect(shootOffs(1)).toEqual([false, false, false, false]);
    expect(shootOffs(3)).toEqual([false, false, false, false]);
    expect(rankArchers(rows).some((r) => r.shootOff)).toBe(false);
    expect(rankArchers([row('a', 600), row('b', 600)], { cut: 1 }).map((r) => r.shootOff)).toEqual([
      true,
      true,
    ]);
  });

  it('keeps the caller’s own fields', () => {
    const [first] = rankArchers([{ ...row('a', 1), name: 'Ada', division: 'RM' }]);
    expect(first).toEqual({
      id: 'a',
      total: 1,
      tens: 0,
      xs: 0,
      name: 'Ada',
      division: 'RM',
      place: 1,
      tied: false,
      shootOff: false,
    });
  });

  it('handles an empty field', () => {
    expect(rankArchers([], { cut: 8 })).toEqual([]);
  });

  it('refuses a cut that is not a whole number, and counts that are not numbers', () => {
    expect(() => rankArchers([], { cut: 2.5 })).toThrowError(ScoringError);
    expect(() => rankArchers([], { cut: -1 })).toThrowError('A cut of -1 is not a whole number of archers.');
    expect(() => rankArchers([row('a', Number.NaN)])).toThrowError(
      'Archer a has a total, 10s or Xs count that is not a number.',
    );
  });

  const rowsArb = fc.array(
    fc.record({
      id: fc.uuid(),
      total: fc.integer({ min: 0, max: 30 }),
      tens: fc.integer({ min: 0, max: 3 }),
      xs: fc.integer({ min: 0, max: 2 }),
    }),
    { maxLength: 40 },
  );

  it('gives each archer 1 + the number of archers strictly better (property)', () => {
    fc.assert(
      fc.property(rowsArb, fc.option(fc.nat({ max: 40 }), { nil: undefined }), (rows, cut) => {
        const ranked = rankArchers(rows, cut === undefined ? {} : { cut });
        expect(ranked).toHaveLength(rows.length);
        const better = (a: (typeof rows)[number], b: (typeof rows)[number]) =>
          a.total > b.total ||
          (a.total === b.total && (a.tens > b.tens || (a.tens === b.tens && a.xs > b.xs)));
        const same = (a: (typeof rows)[number], b: (typeof rows)[number]) =>
          a.total === b.total && a.tens === b.tens && a.xs === b.xs;
        for (const r of ranked) {
          expect(r.place).toBe(1 + rows.filter((o) => better(o, r)).length);
          const equals = rows.filter((o) => same(o, r)).length;
          expect(r.tied).toBe(equals > 1);
          const straddles = cut !== undefined && r.place <= cut && cut < r.place - 1 + equals;
          expect(r.shootOff).toBe(r.tied && straddles);
        }
        ranked.slice(1).forEach((r, i) => expect(r.place).toBeGreaterThanOrEqual(ranked[i]?.place ?? 0));
      }),
    );
  });
});
