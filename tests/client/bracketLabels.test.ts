import { describe, expect, it } from 'vitest';
import type { BracketDto, MatchDto } from '../../src/contract/matches';
import { matchEndsLine } from '../../src/ui/bracketLabels';
import { fieldBracketPages } from '../../src/features/results/fieldBracketPages';
import { matchDto, side, v } from './matchFixtures';

/* Each end's score on the printed bracket; places on the field screen as soon as they are known. */

const match = (id: number, round: number, ends: MatchDto['ends'], extra: Partial<MatchDto> = {}) =>
  matchDto({ id, round, sides: { a: side(1), b: side(2) }, ends, targetNumber: null, ...extra }, true);

describe('matchEndsLine', () => {
  it('gives set points with each set’s totals', () => {
    const m = match(1, 0, [
      { a: v('10 9 9'), b: v('9 9 9') },
      { a: v('9 9 8'), b: v('10 10 9') },
      { a: v('10 10 10'), b: v('9 9 9') },
    ]);
    expect(matchEndsLine(m)).toBe('4–2 (28-27, 26-29, 30-27)');
  });

  it('adds the shoot-off arrows and is empty before the first end', () => {
    expect(matchEndsLine(match(1, 0, []))).toBe('');
    const level = Array.from({ length: 5 }, () => ({ a: v('9 9 9'), b: v('9 9 9') }));
    const m = match(1, 0, level, { shootOff: { a: { value: '10' }, b: { value: '9' } } });
    expect(matchEndsLine(m)).toBe('5–5 (27-27, 27-27, 27-27, 27-27, 27-27, shoot-off 10-9)');
  });
});

describe('fieldBracketPages', () => {
  const bracket = (matches: MatchDto[], places: BracketDto['places']): BracketDto => ({
    id: 1,
    divisionId: 1,
    divisionName: 'Recurve',
    sessionId: 1,
    format: 'sets',
    alternate: 'never',
    entrants: 8,
    size: 8,
    rounds: 3,
    matches,
    places,
  });
  const place = (n: number) => ({ place: n, entryId: n, name: `Archer ${n}`, club: '', seed: n });

  it('shows the places decided so far after the current round, before every match is decided', () => {
    const open = match(5, 1, []);
    const done = { ...match(1, 0, []), winner: 'a' as const, decidedBy: 'score' as const };
    const pages = fieldBracketPages([bracket([done, open], [place(5), place(6)])], 10);
    expect(pages.map((p) => [p.kind, p.subtitle])).toEqual([
      ['matches', 'Semi-finals · set points'],
      ['places', 'Places decided so far'],
    ]);
    expect(pages[1]!.kind === 'places' && pages[1]!.places.map((p) => p.place)).toEqual([5, 6]);
  });

  it('shows only the final places once every match is decided', () => {
    const done = { ...match(1, 2, []), winner: 'a' as const, decidedBy: 'score' as const };
    const pages = fieldBracketPages([bracket([done], [place(1), place(2)])], 10);
    expect(pages.map((p) => [p.kind, p.subtitle])).toEqual([['places', 'Final places']]);
  });
});
