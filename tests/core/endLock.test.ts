import { describe, expect, it } from 'vitest';
import { endsOfRound, getRound, rulesForEnd, writerLock } from '../../src/core';
import { UNEVEN_ROUND } from '../support/rounds';

describe('writerLock: may a writer or caller still change an end', () => {
  it('is open only while the end is neither signed nor ruled and the session is open', () => {
    // WA Book 3: once a judge has decided or signed a value, only a judge changes it.
    expect(writerLock({ signed: false, ruled: false, sessionClosed: false })).toBeUndefined();
    expect(writerLock({ signed: true, ruled: false, sessionClosed: false })).toBe('signed');
    expect(writerLock({ signed: false, ruled: true, sessionClosed: false })).toBe('ruled');
    expect(writerLock({ signed: false, ruled: false, sessionClosed: true })).toBe('closed');
  });

  it('names the strongest reason when several hold: signed, then ruled, then closed', () => {
    expect(writerLock({ signed: true, ruled: true, sessionClosed: true })).toBe('signed');
    expect(writerLock({ signed: false, ruled: true, sessionClosed: true })).toBe('ruled');
  });
});

describe('ends of a round, one count for the phone and the server', () => {
  it('the 1440 round has ends of six at the long distances and of three at the short ones', () => {
    // Source: from memory (see ROUND_CATALOG); the judge desk once drew six boxes for these.
    const ends = endsOfRound(getRound('1440-men'));
    expect(ends).toHaveLength(6 + 6 + 12 + 12);
    expect(ends[11]!.arrows).toBe(6);
    expect(ends[12]!.arrows).toBe(3);
    expect(rulesForEnd(getRound('1440-men'), ends[12]!, 'recurve').arrowsPerEnd).toBe(3);
  });

  it('a hand-built distance whose arrows do not divide evenly ends with a shorter end, not a lost one', () => {
    const round = UNEVEN_ROUND;
    const ends = endsOfRound(round);
    expect(ends.map((e) => e.arrows)).toEqual([6, 4]);
    expect(rulesForEnd(round, ends[1]!, 'recurve', { allowPartial: true })).toMatchObject({
      arrowsPerEnd: 4,
      allowPartial: true,
    });
  });
});
