// Card totals: WA Book 3, scoring chapter (article numbers not given: they change between
// editions and are not known here for certain): X counts 10, 10s include Xs, more arrows than
// allowed → the lowest count.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ScoringError, cardTotals, endTotal, getRound } from '../../src/core';
import type { ArrowValue } from '../../src/core';
import { arrowValue, endAndReordering } from './arbitraries';

const seventy = getRound('70m');
const six = (v: ArrowValue): ArrowValue[] => Array<ArrowValue>(6).fill(v);

describe('cardTotals', () => {
  it('gives a blank card zero totals and the round max', () => {
    const card = cardTotals(seventy, []);
    expect(card).toMatchObject({
      total: 0,
      hits: 0,
      tens: 0,
      xs: 0,
      arrowsShot: 0,
      maxSoFar: 0,
      roundMax: 720,
    });
    expect(card.ends).toHaveLength(12);
    expect(
      card.ends.every((e) => e.values === undefined && e.total === undefined && e.runningTotal === undefined),
    ).toBe(true);
  });

  it('scores a perfect 70 m round 720 with 72 tens and Xs (WA Book 3: max 720)', () => {
    const card = cardTotals(
      seventy,
      Array.from({ length: 12 }, () => six('X')),
    );
    expect(card).toMatchObject({
      total: 720,
      hits: 72,
      tens: 72,
      xs: 72,
      arrowsShot: 72,
      maxSoFar: 720,
      roundMax: 720,
    });
    expect(card.distances.map((d) => d.total)).toEqual([360, 360]);
  });

  it('keeps running totals, per-distance subtotals and the max so far', () => {
    const card = cardTotals(seventy, [
      ['X', '10', '9', '9', '8', 'M'],
      ['10', '10', '10', '9', '9', '9'],
    ]);
    expect(card.ends[0]).toEqual({
      index: 0,
      distanceIndex: 0,
      values: ['X', '10', '9', '9', '8', 'M'],
      total: 46,
      runningTotal: 46,
    });
    expect(card.ends[1]?.runningTotal).toBe(103);
    expect(card).toMatchObject({ total: 103, hits: 11, tens: 5, xs: 1, arrowsShot: 12, maxSoFar: 120 });
    // 9s are counted for indoor ties (see ranking.test.ts).
    expect(card.nines).toBe(5);
    expect(card.distances[0]).toMatchObject({
      distanceIndex: 0,
      label: '70 m (1)',
      total: 103,
      max: 360,
      maxSoFar: 120,
    });
    expect(card.distances[1]).toMatchObject({ total: 0, maxSoFar: 0, max: 360 });
  });

  it('carries the running total over an end not entered yet', () => {
    const card = cardTotals(seventy, [six('9'), undefined, six('8')]);
    expect(card.ends.slice(0, 3).map((e) => e.runningTotal)).toEqual([54, undefined, 102]);
    expect(card.maxSoFar).toBe(120);
  });

  it('puts ends in the right distance on a 1440 card', () => {
    const round = getRound('1440-men');
    const ends = Array.from({ length: 36 }, (_, i) =>
      i < 12 ? six('10') : (['9', '9', '9'] satisfies ArrowValue[]),
    );
    const card = cardTotals(round, ends);
    expect(card.distances.map((d) => d.total)).toEqual([360, 360, 324, 324]);
    expect(card.total).toBe(1368);
    expect(card.roundMax).toBe(1440);
  });

  it('counts an M-only end as arrows shot but no hits', () => {
    const card = cardTotals(seventy, [six('M')]);
    expect(card).toMatchObject({ total: 0, hits: 0, arrowsShot: 6, maxSoFar: 60 });
    expect(card.ends[0]?.total).toBe(0);
  });

  it('counts only the lowest arrows of an end with too many (WA Book 3)', () => {
    const card = cardTotals(seventy, [['X', '10', '9', '9', '8', '7', '6']]);
    expect(card.ends[0]?.values).toEqual(['10', '9', '9', '8', '7', '6']);
    expect(card).toMatchObject({ total: 49, tens: 1, xs: 0, arrowsShot: 6 });
  });

  it('counts the compound indoor inner ring as a 10 without an X', () => {
    const card = cardTotals(getRound('18m'), [['10', '9', '9']]);
    expect(card).toMatchObject({ total: 28, tens: 1, xs: 0 });
  });

  it('refuses a card with more ends than the round', () => {
    expect(() =>
      cardTotals(
        seventy,
        Array.from({ length: 13 }, () => six('9')),
      ),
    ).toThrowError(ScoringError);
    expect(() =>
      cardTotals(
        seventy,
        Array.from({ length: 13 }, () => six('9')),
      ),
    ).toThrowError('The card has 13 ends; the 70 m round has 12.');
  });

  it('does not depend on entry order within ends (property)', () => {
    fc.assert(
      fc.property(fc.array(endAndReordering(6), { maxLength: 12 }), (pairs) => {
        const asTapped = cardTotals(
          seventy,
          pairs.map(([a]) => a),
        );
        const reordered = cardTotals(
          seventy,
          pairs.map(([, b]) => b),
        );
        expect(reordered).toEqual(asTapped);
      }),
    );
  });

  it('makes the total the sum of end totals and the last running total (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.option(fc.array(arrowValue, { minLength: 6, maxLength: 6 }), { nil: undefined }), {
          maxLength: 12,
        }),
        (ends) => {
          const card = cardTotals(seventy, ends);
          const sum = ends.reduce((s, e) => s + (e ? endTotal(e) : 0), 0);
          expect(card.total).toBe(sum);
          expect(card.distances.reduce((s, d) => s + d.total, 0)).toBe(sum);
          const lastEntered = card.ends.filter((e) => e.runningTotal !== undefined).at(-1);
          expect(lastEntered?.runningTotal ?? 0).toBe(sum);
          expect(card.total).toBeLessThanOrEqual(card.maxSoFar);
        },
      ),
    );
  });
});
