import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { ArrowValue, MatchEnd } from '../../src/core';
import { matchCrossCheck } from '../../src/core/matches';

/*
 * Two writers at a match's target, compared like a qualification end (the cross-check is common
 * practice of two independent scorecards, not a published rule): only complete ends, line by line,
 * arrow by arrow, in any order of tapping.
 */

const v = (text: string) => (text ? (text.split(' ') as ArrowValue[]) : []);
const end = (a: string, b: string): MatchEnd => ({ a: v(a), b: v(b) });

describe('matchCrossCheck', () => {
  it('agrees on the same arrows tapped in another order, giving the end highest first', () => {
    const check = matchCrossCheck(end('9 X 10', '8 9 M'), end('10 9 X', 'M 8 9'));
    expect(check.status).toBe('agreed');
    expect(check.agreed).toEqual(end('X 10 9', '9 8 M'));
  });

  it('waits until both writers wrote three arrows on each line', () => {
    expect(matchCrossCheck(end('10 10 10', '9 9'), end('10 10 10', '9 9')).status).toBe('waiting');
    expect(matchCrossCheck(end('10 10 10', '9 9 9'), undefined).status).toBe('waiting');
    expect(matchCrossCheck(end('10 10 10', '9 9 9'), undefined).agreed).toBeNull();
  });

  it('marks the arrow the writers differ on, on its line', () => {
    const check = matchCrossCheck(end('10 10 10', '9 9 9'), end('10 10 9', '9 9 9'));
    expect(check.status).toBe('mismatch');
    expect(check.agreed).toBeNull();
    expect(check.a.arrows.map((x) => x.same)).toEqual([true, true, false]);
    expect(check.b.status).toBe('agreed');
  });

  it('agrees exactly when both lines hold the same values (property)', () => {
    const value = fc.constantFrom<ArrowValue>('X', '10', '9', '8', '7', '1', 'M');
    const line = fc.array(value, { minLength: 3, maxLength: 3 });
    fc.assert(
      fc.property(line, line, line, line, (a1, b1, a2, b2) => {
        const same = (x: ArrowValue[], y: ArrowValue[]) => [...x].sort().join() === [...y].sort().join();
        const check = matchCrossCheck({ a: a1, b: b1 }, { a: a2, b: b2 });
        expect(check.status === 'agreed').toBe(same(a1, a2) && same(b1, b2));
      }),
    );
  });
});
