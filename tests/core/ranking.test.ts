// Ranking ties. Source: World Archery Constitution and Rules, Book 3 (Target Archery), chapter 14
// "Scoring", art. 14.5 "Ties", in the editions in force since 1 April 2018 — cited FROM MEMORY,
// check the article numbers against the edition in use:
// - 14.5.1: ties in score, other than those for entry into the elimination round or for medals,
//   are broken outdoors by most 10s (X included), then most Xs; indoors by most 10s (inner 10s
//   for compound), then most 9s; archers still level are declared equal and share the place.
// - 14.5.2: ties for entry into the elimination round, and for medal places, are decided by a
//   shoot-off, NOT by counting 10s and Xs: one arrow each, the higher value wins; equal values,
//   the arrow closest to the centre wins (measured). The single-arrow, closest-to-centre shoot-off
//   as art. 14.5.2.2 is confirmed by World Archery's published clarification of December 2018
//   ("Clarification of tiebreak rules for indoor matchplay competition", worldarchery.sport).
// Shared places 1, 2, 2, 4 are standard competition ranking: common practice. Medal places 1–3
// when there are no eliminations: common practice.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ScoringError, cardTotals, getRound } from '../../src/core';
import { rankArchers } from '../../src/core/ranking';
import type { ArrowValue, RankInput, ShootOffArrow } from '../../src/core';
import { arrowValue } from './arbitraries';

const row = (id: string, total: number, tens = 0, xs = 0, nines = 0, shootOff?: ShootOffArrow[]) => ({
  id,
  total,
  tens,
  xs,
  nines,
  ...(shootOff ? { shootOff } : {}),
});
const view = (ranked: ReturnType<typeof rankArchers>) => ranked.map((r) => [r.id, r.place, r.tied]);
// Places beyond the medals, so the count-back applies: no cut, medalPlaces 0.
const noMedals = { medalPlaces: 0 };

describe('rankArchers: count-back (WA Book 3, 14.5.1, from memory)', () => {
  it('outdoors orders equal totals by 10s (X included), then Xs', () => {
    const ranked = rankArchers(
      [row('a', 650, 20, 8, 30), row('b', 660, 10, 2), row('c', 650, 20, 9, 0), row('d', 650, 22, 1)],
      noMedals,
    );
    expect(view(ranked)).toEqual([
      ['b', 1, false],
      ['d', 2, false],
      ['c', 3, false],
      ['a', 4, false],
    ]);
  });

  it('indoors orders equal totals by 10s, then 9s — not Xs', () => {
    const rows = [row('a', 580, 20, 15, 30), row('c', 580, 20, 2, 35), row('d', 580, 22, 0, 0)];
    expect(view(rankArchers(rows, { ...noMedals, venue: 'indoor' }))).toEqual([
      ['d', 1, false],
      ['c', 2, false],
      ['a', 3, false],
    ]);
    // The same archers outdoors: Xs decide between a and c.
    expect(view(rankArchers(rows, noMedals)).map((r) => r[0])).toEqual(['d', 'a', 'c']);
  });

  it('shares places for archers still level and skips the next (1, 2, 2, 4)', () => {
    const ranked = rankArchers(
      [row('a', 600, 30, 10), row('b', 590, 20, 5), row('c', 590, 20, 5), row('d', 580)],
      noMedals,
    );
    expect(view(ranked)).toEqual([
      ['a', 1, false],
      ['b', 2, true],
      ['c', 2, true],
      ['d', 4, false],
    ]);
    expect(ranked.every((r) => !r.shootOff && !r.decidedByShootOff)).toBe(true);
  });

  it('reads the counts from real cards: an indoor X is a 10, not a tie-break of its own', () => {
    const round = getRound('18m');
    const end = (...values: ArrowValue[]) => values;
    const a = cardTotals(round, [end('X', 'X', '9')]);
    const b = cardTotals(round, [end('10', '10', '9')]);
    const c = cardTotals(round, [end('10', '10', '9'), end('M', 'M', 'M')]);
    const rows = [a, b, c].map((t, i) => row(`${i}`, t.total, t.tens, t.xs, t.nines));
    expect(view(rankArchers(rows, { ...noMedals, venue: 'indoor' }))).toEqual([
      ['0', 1, true],
      ['1', 1, true],
      ['2', 1, true],
    ]);
  });
});

describe('rankArchers: ties that decide the cut or a medal (WA Book 3, 14.5.2, from memory)', () => {
  it('flags equal totals across the cut for a shoot-off without counting 10s and Xs', () => {
    const rows = [row('a', 600), row('b', 590, 9, 9), row('c', 590, 1, 0), row('d', 580)];
    const ranked = rankArchers(rows, { cut: 2 });
    expect(ranked.map((r) => [r.id, r.place, r.tied, r.shootOff])).toEqual([
      ['a', 1, false, false],
      ['b', 2, true, true],
      ['c', 2, true, true],
      ['d', 4, false, false],
    ]);
  });

  it('counts back a tie on the cut for now while a tied archer still has ends to shoot', () => {
    const rows = [row('a', 600), { ...row('b', 590, 1), complete: false }, row('c', 590, 9), row('d', 580)];
    expect(rankArchers(rows, { cut: 2 }).map((r) => [r.id, r.place, r.shootOff])).toEqual([
      ['a', 1, false],
      ['c', 2, false],
      ['b', 3, false],
      ['d', 4, false],
    ]);
  });

  it('counts back a tie that stays inside or outside the cut', () => {
    const rows = [row('a', 600), row('b', 590, 9), row('c', 590, 1), row('d', 580)];
    for (const cut of [1, 3]) {
      const ranked = rankArchers(rows, { cut });
      expect(view(ranked)).toEqual([
        ['a', 1, false],
        ['b', 2, false],
        ['c', 3, false],
        ['d', 4, false],
      ]);
      expect(ranked.some((r) => r.shootOff)).toBe(false);
    }
  });

  it('without eliminations, flags equal totals on a medal place (1–3), not below', () => {
    const rows = [
      row('a', 600),
      row('b', 590),
      row('c', 590, 5),
      row('d', 590, 9),
      row('e', 500),
      row('f', 500, 2),
    ];
    const ranked = rankArchers(rows);
    expect(ranked.map((r) => [r.id, r.place, r.shootOff])).toEqual([
      ['a', 1, false],
      ['b', 2, true],
      ['c', 2, true],
      ['d', 2, true],
      // Place 5 is no medal: counted back.
      ['f', 5, false],
      ['e', 6, false],
    ]);
  });

  it('with a cut, medals come from the eliminations: a tie for first is counted back', () => {
    const ranked = rankArchers([row('a', 600, 5), row('b', 600, 6), row('c', 500)], { cut: 3 });
    expect(view(ranked)).toEqual([
      ['b', 1, false],
      ['a', 2, false],
      ['c', 3, false],
    ]);
  });
});

describe('rankArchers: shoot-offs', () => {
  const tie = (shootA?: ShootOffArrow[], shootB?: ShootOffArrow[]) =>
    rankArchers([row('a', 600), row('b', 590, 0, 0, 0, shootA), row('c', 590, 0, 0, 0, shootB)], { cut: 2 });
  const order = (ranked: ReturnType<typeof rankArchers>) =>
    ranked.map((r) => [r.id, r.place, r.shootOff, r.decidedByShootOff]);

  it('the higher arrow wins the shoot-off, and the place follows', () => {
    expect(order(tie([{ value: '8' }], [{ value: '9' }]))).toEqual([
      ['a', 1, false, false],
      ['c', 2, false, true],
      ['b', 3, false, true],
    ]);
  });

  it('equal values go to the arrow measured closest to the centre', () => {
    expect(
      order(tie([{ value: '9', distanceMm: 31 }], [{ value: '9', distanceMm: 44 }])).map((r) => r[0]),
    ).toEqual(['a', 'b', 'c']);
  });

  it('equal values without a measurement go to the arrow the judge marked closer', () => {
    expect(order(tie([{ value: 'X' }], [{ value: '10', closer: true }])).map((r) => r[0])).toEqual([
      'a',
      'c',
      'b',
    ]);
  });

  it('archers still level after an arrow shoot again; until then the tie stays flagged', () => {
    const level: ShootOffArrow = { value: '10', distanceMm: 12 };
    expect(order(tie([level], [level]))).toEqual([
      ['a', 1, false, false],
      ['b', 2, true, false],
      ['c', 2, true, false],
    ]);
    expect(order(tie([level, { value: '7' }], [level, { value: '8' }])).map((r) => r[0])).toEqual([
      'a',
      'c',
      'b',
    ]);
  });

  it('one archer of the tie not having shot yet leaves it undecided', () => {
    expect(order(tie([{ value: '10' }]))).toEqual([
      ['a', 1, false, false],
      ['b', 2, true, false],
      ['c', 2, true, false],
    ]);
  });

  it('of three level on the cut, the shoot-off winner goes through and the other two stay flagged', () => {
    const ranked = rankArchers(
      [
        row('a', 600),
        row('b', 590, 0, 0, 0, [{ value: '9' }]),
        row('c', 590, 0, 0, 0, [{ value: '7' }]),
        row('d', 590, 0, 0, 0, [{ value: '7' }]),
      ],
      { cut: 3 },
    );
    expect(order(ranked)).toEqual([
      ['a', 1, false, false],
      ['b', 2, false, true],
      ['c', 3, true, true],
      ['d', 3, true, true],
    ]);
  });

  it('ignores shoot-off arrows when the tie no longer decides anything', () => {
    const ranked = rankArchers(
      [row('a', 600, 0, 0, 0, [{ value: 'M' }]), row('b', 600, 1, 0, 0, [{ value: 'X' }])],
      {
        cut: 2,
      },
    );
    expect(view(ranked)).toEqual([
      ['b', 1, false],
      ['a', 2, false],
    ]);
  });
});

describe('rankArchers: input', () => {
  it('keeps the caller’s own fields', () => {
    const [first] = rankArchers([{ ...row('a', 1), name: 'Ada', division: 'RM' }]);
    expect(first).toEqual({
      id: 'a',
      total: 1,
      tens: 0,
      xs: 0,
      nines: 0,
      name: 'Ada',
      division: 'RM',
      place: 1,
      tied: false,
      shootOff: false,
      decidedByShootOff: false,
    });
  });

  it('handles an empty field', () => {
    expect(rankArchers([], { cut: 8 })).toEqual([]);
  });

  it('refuses a cut or medal count that is not a whole number, and counts that are not numbers', () => {
    expect(() => rankArchers([], { cut: 2.5 })).toThrowError(ScoringError);
    expect(() => rankArchers([], { cut: -1 })).toThrowError('A cut of -1 is not a whole number of archers.');
    expect(() => rankArchers([], { medalPlaces: 1.5 })).toThrowError(ScoringError);
    expect(() => rankArchers([row('a', Number.NaN)])).toThrowError(
      'Archer a has a total, 10s, Xs or 9s count that is not a number.',
    );
  });
});

describe('rankArchers: properties', () => {
  const shootOffArb = fc.array(
    fc.record({
      value: arrowValue,
      distanceMm: fc.option(fc.integer({ min: 0, max: 3 }), { nil: undefined }),
      closer: fc.option(fc.boolean(), { nil: undefined }),
    }),
    { maxLength: 2 },
  );
  const rowsArb = fc.uniqueArray(
    fc.record({
      id: fc.string({ minLength: 1, maxLength: 3 }),
      total: fc.integer({ min: 0, max: 30 }),
      tens: fc.integer({ min: 0, max: 3 }),
      xs: fc.integer({ min: 0, max: 2 }),
      nines: fc.integer({ min: 0, max: 2 }),
      shootOff: fc.option(shootOffArb, { nil: undefined }),
    }),
    { maxLength: 30, selector: (r) => r.id },
  );
  const optsArb = fc.record({
    venue: fc.constantFrom('outdoor' as const, 'indoor' as const),
    cut: fc.option(fc.nat({ max: 30 }), { nil: undefined }),
  });
  const shuffled = <T>(items: readonly T[]) =>
    fc.shuffledSubarray([...items], { minLength: items.length, maxLength: items.length });

  it('the order of the input never changes the standings', () => {
    fc.assert(
      fc.property(
        rowsArb.chain((rows) => fc.tuple(fc.constant(rows), shuffled(rows))),
        optsArb,
        ([rows, reordered], opts) => {
          expect(rankArchers(reordered, opts)).toEqual(rankArchers(rows, opts));
        },
      ),
    );
  });

  it('places follow totals: an archer with a higher total never ranks below a lower one', () => {
    fc.assert(
      fc.property(rowsArb, optsArb, (rows, opts) => {
        const ranked = rankArchers(rows, opts);
        expect(ranked).toHaveLength(rows.length);
        for (const a of ranked)
          for (const b of ranked) if (a.total > b.total) expect(a.place).toBeLessThan(b.place);
        // Places are standard competition ranking: each is 1 + the archers listed above it.
        ranked.forEach((r, i) => {
          if (i === 0 || ranked[i - 1]!.place !== r.place) expect(r.place).toBe(i + 1);
        });
      }),
    );
  });

  it('adding a signed end never lowers anyone’s total', () => {
    const round = getRound('70m');
    const endArb = fc.array(arrowValue, { minLength: 6, maxLength: 6 });
    fc.assert(
      fc.property(
        fc.array(fc.array(endArb, { maxLength: 11 }), { minLength: 1, maxLength: 8 }),
        fc.nat(),
        endArb,
        (cards, who, added) => {
          const rowsOf = (all: ArrowValue[][][]): RankInput[] =>
            all.map((ends, i) => {
              const t = cardTotals(round, ends);
              return row(`${i}`, t.total, t.tens, t.xs, t.nines);
            });
          const index = who % cards.length;
          const after = cards.map((ends, i) => (i === index ? [...ends, added] : ends));
          const before = new Map(rankArchers(rowsOf(cards)).map((r) => [r.id, r.total]));
          for (const r of rankArchers(rowsOf(after)))
            expect(r.total).toBeGreaterThanOrEqual(before.get(r.id)!);
        },
      ),
    );
  });
});
