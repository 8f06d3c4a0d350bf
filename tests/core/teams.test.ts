// Team places: the best three archers (a count the event sets) of a club within a division,
// summed — common practice, and the shape of WA team qualification (WA Book 3, art. 14.5 ties
// apply to teams too; from memory). A club short of a full team has no team: common practice.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ScoringError } from '../../src/core';
import { rankTeams } from '../../src/core/ranking';

const archer = (id: string, club: string, total: number, tens = 0, xs = 0, inTeam?: boolean) => ({
  id,
  club,
  total,
  tens,
  xs,
  nines: 0,
  ...(inTeam === undefined ? {} : { inTeam }),
});

describe('rankTeams', () => {
  it('sums the best three of each club and ranks the sums', () => {
    const teams = rankTeams(
      [
        archer('a1', 'Alder', 600, 10),
        archer('a2', 'Alder', 590, 8),
        archer('a3', 'Alder', 580, 7),
        archer('a4', 'Alder', 100),
        archer('b1', 'Birch', 610, 20),
        archer('b2', 'Birch', 600, 20),
        archer('b3', 'Birch', 590, 20),
      ],
      { medalPlaces: 0 },
    );
    expect(teams.map((t) => [t.club, t.total, t.tens, t.members, t.place])).toEqual([
      ['Birch', 1800, 60, ['b1', 'b2', 'b3'], 1],
      ['Alder', 1770, 25, ['a1', 'a2', 'a3'], 2],
    ]);
  });

  it('leaves out archers marked not in a team, and clubs short of a full team', () => {
    const teams = rankTeams([
      archer('a1', 'Alder', 600),
      archer('a2', 'Alder', 590, 0, 0, false),
      archer('a3', 'Alder', 580),
      archer('a4', 'Alder', 100),
      archer('c1', 'Cedar', 700),
      archer('c2', 'Cedar', 700),
      archer('x1', '', 700),
      archer('x2', '', 700),
      archer('x3', '', 700),
    ]);
    expect(teams.map((t) => [t.club, t.total, t.members])).toEqual([['Alder', 1280, ['a1', 'a3', 'a4']]]);
  });

  it('breaks equal team totals by the team’s 10s, then Xs, and shares places still level', () => {
    const club = (name: string, tens: number, xs: number) =>
      [1, 2].map((n) => archer(`${name}${n}`, name, 300, tens, xs));
    const teams = rankTeams(
      [...club('A', 5, 1), ...club('B', 6, 0), ...club('C', 5, 2), ...club('D', 5, 2)],
      {
        teamSize: 2,
        medalPlaces: 0,
      },
    );
    expect(teams.map((t) => [t.club, t.place, t.tied])).toEqual([
      ['B', 1, false],
      ['C', 2, true],
      ['D', 2, true],
      ['A', 4, false],
    ]);
  });

  it('flags equal team totals on a medal place for a shoot-off', () => {
    const teams = rankTeams([archer('a', 'A', 300, 9), archer('b', 'B', 300, 1)], { teamSize: 1 });
    expect(teams.map((t) => [t.club, t.place, t.shootOff])).toEqual([
      ['A', 1, true],
      ['B', 1, true],
    ]);
  });

  it('refuses a team size that is not a whole number from 1', () => {
    expect(() => rankTeams([], { teamSize: 0 })).toThrowError(ScoringError);
  });

  it('the order of the archers never changes the team places (property)', () => {
    const archersArb = fc.uniqueArray(
      fc.record({
        id: fc.string({ minLength: 1, maxLength: 3 }),
        club: fc.constantFrom('A', 'B', 'C'),
        total: fc.integer({ min: 0, max: 20 }),
        tens: fc.integer({ min: 0, max: 2 }),
        xs: fc.integer({ min: 0, max: 1 }),
        nines: fc.integer({ min: 0, max: 1 }),
        inTeam: fc.boolean(),
      }),
      { maxLength: 20, selector: (a) => a.id },
    );
    fc.assert(
      fc.property(
        archersArb.chain((rows) =>
          fc.tuple(
            fc.constant(rows),
            fc.shuffledSubarray(rows, { minLength: rows.length, maxLength: rows.length }),
          ),
        ),
        ([rows, reordered]) => {
          expect(rankTeams(reordered, { teamSize: 2 })).toEqual(rankTeams(rows, { teamSize: 2 }));
        },
      ),
    );
  });
});
