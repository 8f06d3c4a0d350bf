import { describe, expect, it } from 'vitest';
import type { ArrowValue, EndOnRecord, MatchEnd } from '../../src/core';
import { countedEnds, matchState } from '../../src/core/matches';

/*
 * Which ends of a match count, in order (Ringcall's rule for two writers at a match's target, not a
 * published one: two independent scorecards agreeing is common practice): a judge's or signed end,
 * or an end both writers agree on; the first end that does not count stops the count.
 */

const v = (text: string) => (text ? (text.split(' ') as ArrowValue[]) : []);
const end = (a: string, b: string): MatchEnd => ({ a: v(a), b: v(b) });
const agreed = (a: string, b: string): EndOnRecord => ({ writers: [end(a, b), end(a, b)] });

describe('countedEnds', () => {
  it('counts the ends both writers agree on, in order, highest first', () => {
    const counted = countedEnds('sets', [
      { writers: [end('9 10 X', '9 9 9'), end('X 9 10', '9 9 9')] },
      agreed('9 9 9', '10 10 10'),
    ]);
    expect(counted).toEqual([
      { ...end('X 10 9', '9 9 9'), by: 'writers' },
      { ...end('9 9 9', '10 10 10'), by: 'writers' },
    ]);
  });

  it('takes a counted end out of the count when one writer changes it, and back when both agree again', () => {
    const before = [agreed('10 10 10', '9 9 9'), agreed('9 9 9', '9 9 9')];
    expect(matchState('sets', { ends: countedEnds('sets', before) }).score).toEqual({ a: 3, b: 1 });
    const changed: EndOnRecord[] = [
      { writers: [end('10 8 8', '9 9 9'), end('10 10 10', '9 9 9')] },
      before[1]!,
    ];
    // The changed end stops the count, and the agreed end after it waits with it.
    expect(countedEnds('sets', changed)).toEqual([]);
    const again: EndOnRecord[] = [agreed('10 8 8', '9 9 9'), before[1]!];
    const counted = countedEnds('sets', again);
    expect(counted).toHaveLength(2);
    expect(matchState('sets', { ends: counted }).score).toEqual({ a: 1, b: 3 });
  });

  it('stops at the first end not agreed, even when later ends agree', () => {
    const ends: EndOnRecord[] = [
      agreed('10 10 10', '9 9 9'),
      { writers: [end('10 10 10', '9 9 9'), undefined] },
      agreed('9 9 9', '10 10 10'),
    ];
    expect(countedEnds('sets', ends)).toHaveLength(1);
  });

  it('counts a closed end (the judge’s or signed) as it is, whatever the writers wrote', () => {
    const judge = { ...end('10 9 9', '9 9 9'), by: 'judge' as const };
    const ends: EndOnRecord[] = [
      { closed: judge, writers: [end('10 10 10', '9 9 9'), end('9 9 9', '9 9 9')] },
      agreed('9 9 9', '8 8 8'),
    ];
    expect(countedEnds('sets', ends)).toEqual([judge, { ...end('9 9 9', '8 8 8'), by: 'writers' }]);
    // A judge's end after a gap waits for the gap like any other.
    expect(countedEnds('sets', [undefined, { closed: judge }])).toEqual([]);
  });

  it('stops at an end the rules refuse after the ends before it (after the match was won)', () => {
    const win = agreed('10 10 10', '9 9 9');
    const ends = [win, win, win, agreed('9 9 9', '10 10 10')];
    expect(countedEnds('sets', ends)).toHaveLength(3);
    expect(countedEnds('cumulative', ends)).toHaveLength(4);
  });
});
