// Round definitions: WA Book 3, target rounds (article numbers not given: check against the
// edition in use), as summarised in the product brief. The 1440 distances and faces are from memory.
import { describe, expect, it } from 'vitest';
import {
  ROUND_CATALOG,
  ScoringError,
  defineCustomRound,
  endsOfRound,
  getRound,
  roundArrowCount,
  roundEndCount,
  roundMaxScore,
} from '../../src/core';

function invalidRoundProblems(input: unknown): readonly string[] {
  try {
    defineCustomRound(input);
  } catch (error) {
    expect(error).toBeInstanceOf(ScoringError);
    expect((error as ScoringError).code).toBe('invalid-round');
    return (error as ScoringError).problems;
  }
  throw new Error('expected the round to be refused');
}

describe('round catalog', () => {
  it('70 m round: 72 arrows (2 × 36) on 122 cm, ends of 6, 4 min, max 720 (WA Book 3)', () => {
    const round = getRound('70m');
    expect(roundArrowCount(round)).toBe(72);
    expect(roundMaxScore(round)).toBe(720);
    expect(roundEndCount(round)).toBe(12);
    expect(
      round.distances.map((d) => [d.distanceM, d.faceId, d.arrows, d.arrowsPerEnd, d.secondsPerEnd]),
    ).toEqual([
      [70, 'full-122', 36, 6, 240],
      [70, 'full-122', 36, 6, 240],
    ]);
    expect(round.bowStyles).toEqual(['recurve']);
  });

  it('50 m compound round: 72 arrows on the 80 cm six-ring face, max 720 (WA Book 3)', () => {
    const round = getRound('50m-compound');
    expect(roundMaxScore(round)).toBe(720);
    expect(round.distances.every((d) => d.faceId === 'sixring-80' && d.distanceM === 50)).toBe(true);
    expect(round.bowStyles).toEqual(['compound']);
  });

  it('50 m barebow round: 72 arrows on the 122 cm face (WA Book 3)', () => {
    const round = getRound('50m-barebow');
    expect(roundArrowCount(round)).toBe(72);
    expect(round.distances.every((d) => d.faceId === 'full-122' && d.distanceM === 50)).toBe(true);
    expect(round.bowStyles).toEqual(['barebow']);
  });

  it('1440 rounds: four distances × 36 arrows, max 1440 (distances and faces from memory)', () => {
    const men = getRound('1440-men');
    const women = getRound('1440-women');
    expect(men.distances.map((d) => [d.distanceM, d.faceId])).toEqual([
      [90, 'full-122'],
      [70, 'full-122'],
      [50, 'full-80'],
      [30, 'full-80'],
    ]);
    expect(women.distances.map((d) => [d.distanceM, d.faceId])).toEqual([
      [70, 'full-122'],
      [60, 'full-122'],
      [50, 'full-80'],
      [30, 'full-80'],
    ]);
    for (const round of [men, women]) {
      expect(roundMaxScore(round)).toBe(1440);
      expect(round.distances.every((d) => d.arrows === 36)).toBe(true);
      // Ends of 6 (4 min) at the long distances, of 3 (2 min) at the short ones: from memory.
      expect(round.distances.map((d) => [d.arrowsPerEnd, d.secondsPerEnd])).toEqual([
        [6, 240],
        [6, 240],
        [3, 120],
        [3, 120],
      ]);
      expect(roundEndCount(round)).toBe(36);
    }
  });

  it('18 m indoor round: 60 arrows in ends of 3 on 40 cm, 2 min an end, max 600 (WA Book 3)', () => {
    const round = getRound('18m');
    expect(round.venue).toBe('indoor');
    expect(roundArrowCount(round)).toBe(60);
    expect(roundEndCount(round)).toBe(20);
    expect(roundMaxScore(round)).toBe(600);
    expect(
      round.distances.every((d) => d.faceId === 'full-40' && d.arrowsPerEnd === 3 && d.secondsPerEnd === 120),
    ).toBe(true);
  });

  it('18 m triple-face variant is for recurve and compound only (product brief)', () => {
    const round = getRound('18m-triple');
    expect(round.bowStyles).toEqual(['recurve', 'compound']);
    expect(round.distances.every((d) => d.faceId === 'triple-40')).toBe(true);
    expect(roundMaxScore(round)).toBe(600);
  });

  it('has unique ids, and every catalog round passes the custom-round checks', () => {
    expect(new Set(ROUND_CATALOG.map((r) => r.id)).size).toBe(ROUND_CATALOG.length);
    for (const round of ROUND_CATALOG) {
      expect(defineCustomRound({ ...round, id: `copy-of-${round.id}` })).toEqual({
        ...round,
        id: `copy-of-${round.id}`,
      });
    }
  });

  it('refuses an unknown round id', () => {
    expect(() => getRound('90m')).toThrowError('"90m" is not a round in the catalog.');
  });
});

describe('endsOfRound', () => {
  it('lists every end in shooting order with its distance', () => {
    const ends = endsOfRound(getRound('1440-men'));
    expect(ends).toHaveLength(36);
    expect(ends.map((e) => e.index)).toEqual(ends.map((_, i) => i));
    expect(ends[0]).toEqual({ index: 0, distanceIndex: 0, indexInDistance: 0, arrows: 6 });
    expect(ends[11]).toEqual({ index: 11, distanceIndex: 1, indexInDistance: 5, arrows: 6 });
    expect(ends[12]).toEqual({ index: 12, distanceIndex: 2, indexInDistance: 0, arrows: 3 });
    expect(ends[35]).toEqual({ index: 35, distanceIndex: 3, indexInDistance: 11, arrows: 3 });
  });

  it('adds up to the round arrow count for every catalog round', () => {
    for (const round of ROUND_CATALOG) {
      expect(endsOfRound(round).reduce((sum, e) => sum + e.arrows, 0)).toBe(roundArrowCount(round));
      expect(endsOfRound(round)).toHaveLength(roundEndCount(round));
    }
  });
});

describe('defineCustomRound', () => {
  const valid = {
    id: ' club-30m ',
    name: ' Club 30 m ',
    venue: 'outdoor',
    distances: [
      { label: '30 m', distanceM: 30, faceId: 'full-80', arrows: 36, arrowsPerEnd: 6, secondsPerEnd: 240 },
    ],
    bowStyles: ['recurve', 'barebow'],
  };

  it('accepts a well-formed round and trims its names', () => {
    const round = defineCustomRound(valid);
    expect(round.id).toBe('club-30m');
    expect(round.name).toBe('Club 30 m');
    expect(roundMaxScore(round)).toBe(360);
  });

  it('reports every problem at once, in words', () => {
    const problems = invalidRoundProblems({
      id: '',
      name: 'Odd',
      venue: 'moon',
      distances: [
        { label: '', distanceM: -5, faceId: 'full-100', arrows: 2.5, arrowsPerEnd: 0, secondsPerEnd: 0 },
        { label: '20 m', distanceM: 20, faceId: 'full-80', arrows: 20, arrowsPerEnd: 6, secondsPerEnd: 240 },
      ],
      bowStyles: ['longbow', 'recurve', 'recurve'],
    });
    expect(problems).toEqual([
      'The round needs an id.',
      'Venue must be outdoor or indoor.',
      'Distance 1 needs a label.',
      'Distance 1: distance must be a number of metres above 0 and at most 150.',
      'Distance 1: "full-100" is not a known target face.',
      'Distance 1: arrows must be a whole number from 1 to 216 (at most 36 ends).',
      'Distance 1: arrows per end must be a whole number from 1 to 6.',
      'Distance 1: seconds per end must be a whole number from 1 to 600.',
      'Distance 2: 20 arrows do not split into ends of 6.',
      '"longbow" is not a bow style.',
      'A bow style is listed twice.',
    ]);
  });

  it('refuses an id that belongs to a catalog round', () => {
    expect(invalidRoundProblems({ ...valid, id: '70m' })).toEqual([
      'The id "70m" belongs to a catalog round.',
    ]);
  });

  it('refuses a round without distances or bow styles', () => {
    expect(invalidRoundProblems({ ...valid, distances: [], bowStyles: [] })).toEqual([
      'The round needs at least one distance.',
      'The round needs at least one bow style.',
    ]);
    expect(invalidRoundProblems(null)).toEqual(['A custom round must be an object.']);
    expect(invalidRoundProblems({ ...valid, distances: [42] })).toEqual([
      'Distance 1 must be an object with label, distanceM, faceId, arrows, arrowsPerEnd and secondsPerEnd.',
    ]);
  });

  // Common practice (see ROUND_LIMITS): ends of at most 6, 36 ends a distance, a double 1440 at most.
  it('refuses rounds larger than any the sport shoots', () => {
    const distance = valid.distances[0]!;
    expect(invalidRoundProblems({ ...valid, distances: [{ ...distance, arrows: 360_000_000 }] })).toEqual([
      'Distance 1: arrows must be a whole number from 1 to 216 (at most 36 ends).',
    ]);
    expect(
      invalidRoundProblems({ ...valid, distances: [{ ...distance, arrows: 37 * 3, arrowsPerEnd: 3 }] }),
    ).toEqual(['Distance 1: arrows must be a whole number from 1 to 108 (at most 36 ends).']);
    expect(invalidRoundProblems({ ...valid, distances: [{ ...distance, arrowsPerEnd: 12 }] })).toEqual([
      'Distance 1: arrows per end must be a whole number from 1 to 6.',
    ]);
    expect(invalidRoundProblems({ ...valid, distances: Array.from({ length: 9 }, () => distance) })).toEqual([
      'A round has at most 8 distances.',
    ]);
    expect(
      invalidRoundProblems({
        ...valid,
        distances: Array.from({ length: 3 }, () => ({ ...distance, arrows: 120 })),
      }),
    ).toEqual(['A round has at most 288 arrows; this one has 360.']);
    expect(invalidRoundProblems({ ...valid, name: 'x'.repeat(121) })).toEqual([
      "Use at most 120 characters for the round's name.",
    ]);
  });

  it('never calls a value’s own toString when quoting it', () => {
    const hostile = { toString: 1 };
    expect(
      invalidRoundProblems({
        ...valid,
        bowStyles: [hostile],
        distances: [{ ...valid.distances[0]!, faceId: hostile }],
      }),
    ).toEqual(['Distance 1: That is not a known target face.', 'That is not a bow style.']);
  });

  it('puts a single problem in the message itself', () => {
    expect(() => defineCustomRound({ ...valid, name: '   ' })).toThrowError(/^The round needs a name\.$/);
  });
});
