// Alternate shooting in individual matches. Source: World Archery Constitution and Rules, Book 3
// (Target Archery), match play, the article on alternate shooting beside the time limits (art. 14.4
// in the editions in force since 1 April 2018) — number and wording cited FROM MEMORY, check them
// against the edition in force:
// - the higher-ranked archer decides who shoots first in the first end;
// - the archer with the lower score shoots first in the next end (set system: Ringcall reads the
//   lower SET POINTS, the score on the card; cumulative: the lower running total);
// - level, the archer who shot first in the first end;
// - within an end one arrow each in turn; 20 s an arrow (MATCH_SECONDS_PER_ARROW, timing.ts);
// - the shoot-off comes when the match is level, so the first end's first archer shoots first
//   (the same rule; from memory too).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  ScoringError,
  type AlternateFrom,
  type ArrowValue,
  type MatchEnd,
  type MatchFormat,
  type Side,
} from '../../src/core';
import {
  alternates,
  endOrder,
  lastInOrder,
  matchState,
  nextArrow,
  nextInOrder,
} from '../../src/core/matches';
import { arrowValue } from './arbitraries';

const v = (text: string) => (text ? (text.split(' ') as ArrowValue[]) : []);
const end = (a: string, b: string): MatchEnd => ({ a: v(a), b: v(b) });
const threeArrows = fc.array(arrowValue, { minLength: 3, maxLength: 3 });
const anyEnd = fc.record({ a: threeArrows, b: threeArrows });
const format = fc.constantFrom<MatchFormat>('sets', 'cumulative');
const side = fc.constantFrom<Side>('a', 'b');

/** The complete ends the match still asks for, fed in order (an end after the match is won is left out). */
function playable(f: MatchFormat, ends: MatchEnd[]): MatchEnd[] {
  const kept: MatchEnd[] = [];
  for (const e of ends) {
    if (matchState(f, { ends: kept }).next !== 'end') break;
    kept.push(e);
  }
  return kept;
}

/** Shoots the next end by asking whose arrow is next after every arrow: the order the sides shot in. */
function shootEnd(f: MatchFormat, ends: MatchEnd[], chosen: Side, values: ArrowValue[]): Side[] {
  const current = { a: [] as ArrowValue[], b: [] as ArrowValue[] };
  const order: Side[] = [];
  for (
    let turn = nextArrow(f, { ends }, chosen, current);
    turn;
    turn = nextArrow(f, { ends }, chosen, current)
  ) {
    current[turn].push(values[order.length % values.length]!);
    order.push(turn);
    if (order.length > 6) throw new Error('an end never ends');
  }
  return order;
}

describe('whose arrow is next (WA Book 3, alternate shooting, from memory)', () => {
  it('starts with the chosen archer in the first end and alternates arrow by arrow', () => {
    expect(shootEnd('sets', [], 'b', v('10'))).toEqual(['b', 'a', 'b', 'a', 'b', 'a']);
    expect(nextArrow('sets', { ends: [] }, 'a', end('10', ''))).toBe('b');
    expect(nextArrow('sets', { ends: [] }, 'a', end('10 9 9', '9 9 9'))).toBeNull();
  });

  it('lets the archer behind in set points shoot first, not the one behind in arrow totals', () => {
    // Set 1: a wins 29–28 (2–0); set 2: b wins 30–20 (2–2); set 3: a wins 28–27 (4–2).
    const ends = [end('10 10 9', '10 9 9'), end('10 5 5', '10 10 10'), end('10 9 9', '9 9 9')];
    expect(matchState('sets', { ends }).totals).toEqual({ a: 77, b: 85 });
    // Behind on set points (2 to 4) though ahead on arrows: b shoots first.
    expect(nextArrow('sets', { ends }, 'a', end('', ''))).toBe('b');
  });

  it('lets the archer behind on the running total shoot first in the cumulative system', () => {
    const ends = [end('10 10 9', '10 10 10')];
    expect(nextArrow('cumulative', { ends }, 'b', end('', ''))).toBe('a');
    expect(nextArrow('cumulative', { ends }, 'b', end('10', ''))).toBe('b');
  });

  it('gives a level score to the archer who shot first in the first end', () => {
    const ends = [end('10 10 9', '10 10 9')];
    expect(nextArrow('sets', { ends }, 'b', end('', ''))).toBe('b');
    expect(nextArrow('cumulative', { ends }, 'a', end('', ''))).toBe('a');
  });

  it('starts the shoot-off with the first end’s first archer, one arrow each', () => {
    const tied = end('10 10 10', '10 10 10');
    const ends = [tied, tied, tied, tied, tied];
    expect(matchState('sets', { ends }).next).toBe('shoot-off');
    expect(shootEnd('sets', ends, 'b', v('9'))).toEqual(['b', 'a']);
    expect(shootEnd('cumulative', ends, 'a', v('9'))).toEqual(['a', 'b']);
  });

  it('asks for no arrow once the match is decided or waits for the judge', () => {
    const won = [end('10 10 10', '9 9 9'), end('10 10 10', '9 9 9'), end('10 10 10', '9 9 9')];
    expect(nextArrow('sets', { ends: won }, 'a', end('', ''))).toBeNull();
    const tied = end('10 10 10', '10 10 10');
    const level = [tied, tied, tied, tied, tied];
    const shootOff = { a: { value: '9' as const }, b: { value: '9' as const } };
    expect(matchState('sets', { ends: level, shootOff }).next).toBe('judge');
    expect(nextArrow('sets', { ends: level, shootOff }, 'a', end('', ''))).toBeNull();
  });

  it('counts arrows entered out of turn where they are: the first place not filled is next', () => {
    // The upper line's three first (as on a pad that does not alternate): the lower line's arrows follow.
    expect(nextArrow('sets', { ends: [] }, 'a', end('10 9 9', ''))).toBe('b');
    expect(nextArrow('sets', { ends: [] }, 'a', end('10 9 9', '9 9'))).toBe('b');
  });

  it('refuses more arrows than the end has, and a card the rules cannot produce', () => {
    expect(() => nextArrow('sets', { ends: [] }, 'a', end('10 9 9 9', ''))).toThrow(ScoringError);
    const tied = end('10 10 10', '10 10 10');
    const level = [tied, tied, tied, tied, tied];
    expect(() => nextArrow('sets', { ends: level }, 'a', end('10 9', ''))).toThrow(/1 arrow a side/);
    expect(() => nextArrow('cumulative', { ends: [...level, tied] }, 'a', end('', ''))).toThrow(ScoringError);
  });

  it('property: in every end the two sides alternate and each shoots exactly 3 arrows', () => {
    fc.assert(
      fc.property(format, fc.array(anyEnd, { maxLength: 5 }), side, arrowValue, (f, raw, chosen, value) => {
        const ends = playable(f, raw);
        const state = matchState(f, { ends });
        const order = shootEnd(f, ends, chosen, [value]);
        const each = state.next === 'end' ? 3 : state.next === 'shoot-off' ? 1 : 0;
        expect(order.filter((s) => s === 'a')).toHaveLength(each);
        expect(order.filter((s) => s === 'b')).toHaveLength(each);
        order.forEach((s, i) => i > 0 && expect(s).not.toBe(order[i - 1]));
      }),
    );
  });

  it('property: the side behind shoots first; level, the side chosen for the first end', () => {
    fc.assert(
      fc.property(format, fc.array(anyEnd, { maxLength: 5 }), side, (f, raw, chosen) => {
        const ends = playable(f, raw);
        const state = matchState(f, { ends });
        const first = nextArrow(f, { ends }, chosen, end('', ''));
        const { a, b } = state.score;
        const asks = state.next === 'end' || state.next === 'shoot-off';
        expect(first).toBe(!asks ? null : a === b ? chosen : a < b ? 'a' : 'b');
      }),
    );
  });

  it('property: the last arrow entered in turn is the one an undo takes back', () => {
    fc.assert(
      fc.property(side, fc.integer({ min: 0, max: 6 }), (first, n) => {
        const order = endOrder(first, 3);
        const current = { a: [] as ArrowValue[], b: [] as ArrowValue[] };
        for (let i = 0; i < n; i += 1) current[nextInOrder(order, current)!].push('9');
        expect(lastInOrder(order, current)).toBe(n === 0 ? null : order[n - 1]);
        expect(nextInOrder(order, current)).toBe(n === 6 ? null : order[n]);
      }),
    );
  });

  it('writes the order of an end from its first archer', () => {
    expect(endOrder('a', 3)).toEqual(['a', 'b', 'a', 'b', 'a', 'b']);
    expect(endOrder('b', 1)).toEqual(['b', 'a']);
  });
});

describe('which matches of a bracket alternate (the organizer’s setting)', () => {
  // A bracket of 16: rounds 0 (1/8), 1 (quarter-finals), 2 (semi-finals), 3 (final and bronze).
  const rounds = 4;
  it('never, the medal matches only, or from the semi-finals on', () => {
    const at = (from: AlternateFrom) => [0, 1, 2, 3].map((round) => alternates(from, { round }, rounds));
    expect(at('never')).toEqual([false, false, false, false]);
    expect(at('medal-matches')).toEqual([false, false, false, true]);
    expect(at('semi-finals')).toEqual([false, false, true, true]);
  });
});
