// Bracket seeding. Source: World Archery Book 3 (Target Archery), appendix of elimination
// bracket charts, editions in force since 2018 — FROM MEMORY. The chart orders below are as
// remembered from WA's published brackets: the 1/32 bracket of Olympic results opens
// 1–64, 32–33, 17–48, 16–49, 9–56, 24–41, 25–40, 8–57 and closes with 2–63; the 8, 16 and 32
// charts are the same pattern (each half the mirror image of the other). Byes to the top seeds
// when the archers do not fill a bracket: common practice (WA's 104-archer bracket is not modelled).
// Final places after the medals ordered by the round lost, then the qualification rank: the
// organizer's brief (the rule book may let archers of one round share a place; from memory).
import { describe, expect, it } from 'vitest';
import { ScoringError } from '../../src/core';
import { bracketRounds, bracketSize, finalPlaces, firstRound, seedLines } from '../../src/core/matches';

const pairs = (entrants: number) => firstRound(entrants).map((m) => [m.a, m.b]);

describe('bracket charts (WA Book 3 appendix, from memory)', () => {
  it('8 archers: the quarter-finals in chart order', () => {
    expect(pairs(8)).toEqual([
      [1, 8],
      [4, 5],
      [3, 6],
      [2, 7],
    ]);
  });

  it('16 archers: the 1/8 round in chart order', () => {
    expect(pairs(16)).toEqual([
      [1, 16],
      [8, 9],
      [5, 12],
      [4, 13],
      [3, 14],
      [6, 11],
      [7, 10],
      [2, 15],
    ]);
  });

  it('32 archers: the 1/16 round in chart order', () => {
    expect(pairs(32)).toEqual([
      [1, 32],
      [16, 17],
      [9, 24],
      [8, 25],
      [5, 28],
      [12, 21],
      [13, 20],
      [4, 29],
      [3, 30],
      [14, 19],
      [11, 22],
      [6, 27],
      [7, 26],
      [10, 23],
      [15, 18],
      [2, 31],
    ]);
  });

  it('64 archers: opens as the published 1/32 bracket does and closes with 2–63', () => {
    const p = pairs(64);
    expect(p.slice(0, 8)).toEqual([
      [1, 64],
      [32, 33],
      [17, 48],
      [16, 49],
      [9, 56],
      [24, 41],
      [25, 40],
      [8, 57],
    ]);
    expect(p.at(-1)).toEqual([2, 63]);
  });

  it('fills the next size with byes for the top seeds: 5 archers, seeds 1–3 have byes', () => {
    expect(pairs(5)).toEqual([
      [1, null],
      [4, 5],
      [3, null],
      [2, null],
    ]);
  });

  it('refuses fewer than 4 or more than 128 archers', () => {
    expect(() => firstRound(3)).toThrow(ScoringError);
    expect(() => firstRound(129)).toThrow('A bracket takes 4 to 128 archers, not 129.');
  });
});

describe('bracket invariants for every size from 4 to 128', () => {
  const sizes = Array.from({ length: 125 }, (_, i) => i + 4);

  it('each seed once; first-round seeds add up to size + 1; byes only for the top seeds', () => {
    for (const n of sizes) {
      const size = bracketSize(n);
      expect(size).toBeGreaterThanOrEqual(n);
      expect(size / 2).toBeLessThan(n);
      const lines = seedLines(size);
      expect([...lines].sort((x, y) => x - y)).toEqual(Array.from({ length: size }, (_, i) => i + 1));
      const matches = firstRound(n);
      expect(matches).toHaveLength(size / 2);
      for (const m of matches) {
        expect(m.a).toBeLessThanOrEqual(n);
        if (m.b === null) expect(m.a).toBeLessThanOrEqual(size - n);
        else expect(m.a + m.b).toBe(size + 1);
      }
      expect(matches.filter((m) => m.b === null)).toHaveLength(size - n);
    }
  });

  it('seeds 1…2^k sit in different 1/2^k parts of the bracket: 1 and 2 meet only in the final, 1–4 from the semi-finals', () => {
    for (const n of sizes) {
      const lines = seedLines(bracketSize(n));
      for (let parts = 2; parts <= lines.length; parts *= 2) {
        const width = lines.length / parts;
        const part = (seed: number) => Math.floor(lines.indexOf(seed) / width);
        const top = Array.from({ length: parts }, (_, i) => part(i + 1));
        expect(new Set(top).size).toBe(parts);
      }
    }
  });

  it('a bracket has log2(size) rounds', () => {
    expect([bracketRounds(8), bracketRounds(9), bracketRounds(128)]).toEqual([3, 4, 7]);
  });
});

describe('final places (1–4 from the medal matches, then by round lost and qualification rank)', () => {
  it('an 8-archer bracket: medals, then the quarter-final losers by seed', () => {
    const places = finalPlaces(
      [
        { id: 'q6', seed: 6, lostInRound: 0 },
        { id: 'q8', seed: 8, lostInRound: 0 },
        { id: 'q4', seed: 4, lostInRound: 0 },
        { id: 'q7', seed: 7, lostInRound: 0 },
        { id: 'gold', seed: 3, medal: 1, lostInRound: undefined },
        { id: 'silver', seed: 1, medal: 2, lostInRound: 2 },
        { id: 'bronze', seed: 5, medal: 3, lostInRound: 1 },
        { id: 'fourth', seed: 2, medal: 4, lostInRound: 1 },
      ],
      3,
    );
    expect(places).toEqual([
      { id: 'q6', place: 6 },
      { id: 'q8', place: 8 },
      { id: 'q4', place: 5 },
      { id: 'q7', place: 7 },
      { id: 'gold', place: 1 },
      { id: 'silver', place: 2 },
      { id: 'bronze', place: 3 },
      { id: 'fourth', place: 4 },
    ]);
  });

  it('later rounds place above earlier ones; archers still in, or waiting for a medal match, have none', () => {
    const places = finalPlaces(
      [
        { id: 'r0', seed: 2, lostInRound: 0 },
        { id: 'r1', seed: 9, lostInRound: 1 },
        { id: 'semi', seed: 3, lostInRound: 2 },
        { id: 'in', seed: 1 },
      ],
      4,
    );
    expect(places).toEqual([
      { id: 'r0', place: 6 },
      { id: 'r1', place: 5 },
      { id: 'semi', place: null },
      { id: 'in', place: null },
    ]);
    expect(() => finalPlaces([{ id: 'x', seed: 1, lostInRound: 4 }], 4)).toThrow(ScoringError);
  });
});
