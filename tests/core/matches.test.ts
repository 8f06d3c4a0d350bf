// Individual matches. Source: World Archery Constitution and Rules, Book 3 (Target Archery),
// match play, art. 14.2 (set system, cumulative scoring) and the match shoot-off, in the editions
// in force since 1 April 2018 — cited FROM MEMORY, check the article numbers in the edition in use:
// - set system (recurve, barebow): sets of 3 arrows; set won 2 points, tied 1 each; first to 6;
//   5–5 after five sets, one-arrow shoot-off;
// - cumulative (compound): 5 ends of 3 arrows, max 150; level, one-arrow shoot-off;
// - shoot-off: higher value wins; equal, closest to centre (WA clarification of December 2018,
//   cited in tests/core/ranking.test.ts). That every cumulative end is shot even when the lead
//   cannot be caught is from memory too.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ScoringError } from '../../src/core';
import { matchState } from '../../src/core/matches';
import type { ArrowValue, MatchEnd, MatchRecord, ShootOffArrow } from '../../src/core';
import { arrowValue } from './arbitraries';

const v = (text: string) => text.split(' ') as ArrowValue[];
const end = (a: string, b: string): MatchEnd => ({ a: v(a), b: v(b) });
const threeArrows = fc.array(arrowValue, { minLength: 3, maxLength: 3 });
const anyEnd = fc.record({ a: threeArrows, b: threeArrows });
const shootOffArrow: fc.Arbitrary<ShootOffArrow> = fc.record({
  value: arrowValue,
  distanceMm: fc.option(fc.integer({ min: 0, max: 400 }), { nil: undefined }),
  closer: fc.boolean(),
});

/** Feeds ends one at a time while the match asks for one; then the shoot-off if it asks for it. */
function play(format: 'sets' | 'cumulative', ends: MatchEnd[], shootOff: [ShootOffArrow, ShootOffArrow]) {
  const record: { ends: MatchEnd[]; shootOff?: MatchRecord['shootOff'] } = { ends: [] };
  let state = matchState(format, record);
  for (const e of ends) {
    // Never asks for an end the rules do not allow: an end is asked for only while ends are left.
    expect(state.endsLeft + record.ends.length).toBeLessThanOrEqual(5);
    expect(state.next === 'end').toBe(state.endsLeft > 0);
    if (state.next !== 'end') break;
    record.ends.push(e);
    state = matchState(format, record);
  }
  if (state.next === 'shoot-off') {
    record.shootOff = { a: shootOff[0], b: shootOff[1] };
    state = matchState(format, record);
  }
  return { record, state };
}

describe('set system (WA Book 3, 14.2, from memory)', () => {
  it('gives 2 set points for a won set and 1 each for a tied set', () => {
    const s = matchState('sets', { ends: [end('10 9 9', '9 9 9'), end('X 9 8', '10 9 8')] });
    expect(s.ends.map((e) => e.setPoints)).toEqual([
      { a: 2, b: 0 },
      { a: 1, b: 1 },
    ]);
    expect(s.score).toEqual({ a: 3, b: 1 });
    expect(s.totals).toEqual({ a: 55, b: 54 });
    expect(s.next).toBe('end');
  });

  it('ends the match at 6 set points, before five sets if so, and refuses a further set', () => {
    const won = [end('10 10 10', '9 9 9'), end('10 10 10', '9 9 9'), end('10 10 10', '9 9 9')];
    const s = matchState('sets', { ends: won });
    expect([s.winner, s.decidedBy, s.next, s.endsLeft, s.score]).toEqual([
      'a',
      'score',
      'none',
      0,
      { a: 6, b: 0 },
    ]);
    expect(() => matchState('sets', { ends: [...won, end('9 9 9', '9 9 9')] })).toThrow(
      'The match was won after set 3; set 4 is not shot.',
    );
  });

  it('goes to a one-arrow shoot-off at 5–5 after five sets, not to a sixth set', () => {
    const ends = [
      end('10 10 10', '9 9 9'),
      end('9 9 9', '10 10 10'),
      end('10 10 10', '9 9 9'),
      end('9 9 9', '10 10 10'),
      end('9 9 9', '9 9 9'),
    ];
    const s = matchState('sets', { ends });
    expect([s.score, s.next, s.winner, s.endsLeft]).toEqual([{ a: 5, b: 5 }, 'shoot-off', null, 0]);
    expect(() => matchState('sets', { ends: [...ends, end('9 9 9', '9 9 9')] })).toThrow(ScoringError);
    const shot = matchState('sets', { ends, shootOff: { a: { value: '9' }, b: { value: '10' } } });
    expect([shot.winner, shot.decidedBy, shot.next]).toEqual(['b', 'shoot-off', 'none']);
  });

  it('refuses a shoot-off arrow before the match is level after five sets', () => {
    expect(() =>
      matchState('sets', { ends: [end('9 9 9', '9 9 9')], shootOff: { a: { value: '10' } } }),
    ).toThrow('A shoot-off arrow can only be recorded once every end is shot and the match is level.');
  });

  it('refuses an end without exactly three arrows a side', () => {
    expect(() => matchState('sets', { ends: [end('10 9', '9 9 9')] })).toThrow(
      'End 1 of a match has 3 arrows a side, not 2.',
    );
  });

  it('says what is still possible after every set', () => {
    // 4–2 after three sets: a wins with the next set; b must not lose it (a tied set gives 5–3).
    const s = matchState('sets', {
      ends: [end('10 10 10', '9 9 9'), end('9 9 9', '10 10 10'), end('10 10 10', '9 9 9')],
    });
    expect(s.outlook.a).toEqual({
      nextSet: { win: 'wins', tie: 'goes-on', lose: 'goes-on' },
      say: 'Winning the next set wins the match.',
    });
    expect(s.outlook.b).toEqual({
      nextSet: { win: 'goes-on', tie: 'goes-on', lose: 'loses' },
      say: 'Must not lose the next set.',
    });
    // 5–3: a tied set wins for a; b must win the set.
    const t = matchState('sets', {
      ends: [
        end('10 10 10', '9 9 9'),
        end('9 9 9', '10 10 10'),
        end('10 10 10', '9 9 9'),
        end('9 9 9', '9 9 9'),
      ],
    });
    expect(t.score).toEqual({ a: 5, b: 3 });
    expect(t.outlook.a.say).toBe('A tied set wins the match.');
    expect(t.outlook.b.say).toBe('Must win the next set.');
    // 4–4 after four sets: the fifth decides, a tie means a shoot-off.
    const u = matchState('sets', {
      ends: [
        end('10 10 10', '9 9 9'),
        end('9 9 9', '10 10 10'),
        end('9 9 9', '9 9 9'),
        end('9 9 9', '9 9 9'),
      ],
    });
    expect(u.outlook.a.nextSet).toEqual({ win: 'wins', tie: 'shoot-off', lose: 'loses' });
    expect(u.outlook.a.say).toBe(
      'Winning the next set wins the match. Must not lose the next set. A tied set means a shoot-off.',
    );
  });

  it('property: points sum to 2 a set, at most five sets and one shoot-off, the winner has 6 or won the shoot-off', () => {
    fc.assert(
      fc.property(
        fc.array(anyEnd, { minLength: 5, maxLength: 8 }),
        fc.tuple(shootOffArrow, shootOffArrow),
        (ends, so) => {
          const { record, state } = play('sets', ends, so);
          expect(record.ends.length).toBeLessThanOrEqual(5);
          state.ends.forEach((e) => expect(e.setPoints!.a + e.setPoints!.b).toBe(2));
          expect(state.score.a + state.score.b).toBe(2 * state.ends.length);
          if (state.winner) {
            const loser = state.winner === 'a' ? 'b' : 'a';
            if (state.decidedBy === 'score') {
              expect(state.score[state.winner]).toBeGreaterThanOrEqual(6);
              expect(record.shootOff).toBeUndefined();
            } else {
              expect(state.score).toEqual({ a: 5, b: 5 });
              expect(state.shootOff).toEqual({ winner: state.winner });
            }
            expect(state.score[loser]).toBeLessThan(6);
          } else {
            // Undecided after every set: only a shoot-off the judge still has to measure.
            expect(state.next).toBe('judge');
          }
        },
      ),
    );
  });
});

describe('cumulative (WA Book 3, 14.2, from memory)', () => {
  const five = (a: string, b: string) => Array.from({ length: 5 }, () => end(a, b));

  it('adds five ends of three arrows, the higher total wins, at most 150', () => {
    const s = matchState('cumulative', { ends: five('X 10 10', '10 10 9') });
    expect([s.totals, s.winner, s.decidedBy, s.next]).toEqual([{ a: 150, b: 145 }, 'a', 'score', 'none']);
    expect(() =>
      matchState('cumulative', { ends: [...five('9 9 9', '9 9 9'), end('9 9 9', '9 9 9')] }),
    ).toThrow('A cumulative match has 5 ends, then a shoot-off.');
  });

  it('shoots every end even when the lead cannot be caught, and says so', () => {
    const s = matchState('cumulative', { ends: [end('10 10 10', 'M M M'), end('10 10 10', 'M M M')] });
    expect([s.next, s.endsLeft, s.winner]).toEqual(['end', 3, null]);
    expect(s.outlook.b).toEqual({ outOfReach: false, say: '60 behind with 3 ends left.' });
    const t = matchState('cumulative', {
      ends: [
        end('10 10 10', 'M M M'),
        end('10 10 10', 'M M M'),
        end('10 10 10', 'M M M'),
        end('10 10 10', 'M M 1'),
      ],
    });
    expect(t.outlook.b).toEqual({ outOfReach: true, say: '119 behind with 1 end left: out of reach.' });
  });

  it('goes to a one-arrow shoot-off when level after five ends', () => {
    const s = matchState('cumulative', { ends: five('10 9 9', '9 10 9') });
    expect([s.next, s.winner]).toEqual(['shoot-off', null]);
    const half = matchState('cumulative', {
      ends: five('10 9 9', '9 10 9'),
      shootOff: { a: { value: 'X' } },
    });
    expect(half.next).toBe('shoot-off');
  });

  it('property: the winner has the higher total or won the shoot-off; never more than five ends', () => {
    fc.assert(
      fc.property(
        fc.array(anyEnd, { minLength: 5, maxLength: 7 }),
        fc.tuple(shootOffArrow, shootOffArrow),
        (ends, so) => {
          const { record, state } = play('cumulative', ends, so);
          expect(record.ends.length).toBe(5);
          expect(state.totals.a).toBeLessThanOrEqual(150);
          if (state.decidedBy === 'score') {
            const loser = state.winner === 'a' ? 'b' : 'a';
            expect(state.totals[state.winner!]).toBeGreaterThan(state.totals[loser]);
          } else if (state.decidedBy === 'shoot-off') {
            expect(state.totals.a).toBe(state.totals.b);
            expect(state.shootOff).toEqual({ winner: state.winner });
          } else {
            expect(state.next).toBe('judge');
          }
        },
      ),
    );
  });
});

describe('match shoot-off (WA Book 3, from memory; closest to centre per the December 2018 clarification)', () => {
  const level = (format: 'sets' | 'cumulative') =>
    format === 'sets'
      ? [
          end('10 10 10', '9 9 9'),
          end('9 9 9', '10 10 10'),
          end('10 10 10', '9 9 9'),
          end('9 9 9', '10 10 10'),
          end('9 9 9', '9 9 9'),
        ]
      : Array.from({ length: 5 }, () => end('9 9 9', '9 9 9'));
  const so = (a: ShootOffArrow, b: ShootOffArrow) =>
    matchState('sets', { ends: level('sets'), shootOff: { a, b } });

  it('higher value wins; X and 10 are equal values decided by the distance', () => {
    expect(so({ value: '8' }, { value: '9' }).winner).toBe('b');
    expect(so({ value: 'X', distanceMm: 12 }, { value: '10', distanceMm: 9 }).winner).toBe('b');
  });

  it('equal values: the smaller measured distance, or the arrow marked closer, wins', () => {
    expect(so({ value: '9', distanceMm: 50 }, { value: '9', distanceMm: 61 }).winner).toBe('a');
    expect(so({ value: '9' }, { value: '9', closer: true }).winner).toBe('b');
    expect(
      matchState('cumulative', {
        ends: level('cumulative'),
        shootOff: { a: { value: '7', closer: true }, b: { value: '7' } },
      }).winner,
    ).toBe('a');
  });

  it('equal values with nothing to separate them wait for the judge, never for a second arrow', () => {
    const s = so({ value: '10', distanceMm: 20 }, { value: '10', distanceMm: 20 });
    expect([s.next, s.winner, s.shootOff]).toEqual(['judge', null, { winner: null, waitingFor: 'judge' }]);
  });
});
