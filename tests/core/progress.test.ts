// Practice progress: average per arrow per week, by distance and face, with the best session.
// Points follow the card (WA Book 3: X counts 10, M counts 0; on the triple face one arrow a spot
// counts, see src/core/plotting.ts). Weeks run Monday to Sunday (ISO 8601), taken in UTC. Grouping
// by week and the "best session" are common practice in training logs, no published source.
// Every expected value below is worked by hand in the comment beside it.
import { describe, expect, it } from 'vitest';
import { practiceTally, type PracticeArrow } from '../../src/core/practice';
import { partsTally } from '../../src/core/practice/progressParts';
import {
  practiceProgress,
  progressChoices,
  progressParts,
  weekStartOf,
} from '../../src/core/practice/progress';
import type { ProgressSession } from '../../src/core/practice/progress';
import type { ArrowValue, BowStyle, FaceId } from '../../src/core';

const typed = (...values: ArrowValue[]): PracticeArrow[] => values.map((value) => ({ value }));
const session = (
  id: string,
  startedAt: string,
  bowStyle: BowStyle,
  ...ends: [number, FaceId, PracticeArrow[]][]
): ProgressSession => ({
  id,
  startedAt,
  bowStyle,
  parts: progressParts(ends.map(([distanceM, faceId, arrows]) => ({ distanceM, faceId, arrows }))),
});

describe('weekStartOf (ISO weeks, Monday first, UTC)', () => {
  it('finds the Monday of the week', () => {
    // 2026-12-03 is a Thursday (calendar): its Monday is 2026-11-30, three days before.
    expect(weekStartOf('2026-12-03T17:20:00.000Z')).toBe('2026-11-30');
    // A Monday at midnight starts its own week.
    expect(weekStartOf('2026-11-30T00:00:00.000Z')).toBe('2026-11-30');
    // The Sunday a minute before belongs to the week before (Monday 2026-11-23).
    expect(weekStartOf('2026-11-29T23:59:00.000Z')).toBe('2026-11-23');
    // Across a year's end: Thursday 2026-01-01's Monday is 2025-12-29.
    expect(weekStartOf('2026-01-01T10:00:00.000Z')).toBe('2025-12-29');
  });
});

// Three weeks of practice (worked below):
// a  Tue 2026-11-24 recurve 18 m 40 cm: 10,9,8 | 9,9,M      total 45, 6 arrows → 7.5
// b  Thu 2026-11-26 recurve 18 m 40 cm: X,10,9              total 29, 3 arrows → 9.666…
// c  Tue 2026-12-01 recurve 18 m 40 cm: 10,10,9,9,8,8       total 54, 6 arrows → 9.0
// d  Wed 2026-12-02 compound 18 m 40 cm: 10,10,10           total 30, 3 arrows → 10.0
// e  Wed 2026-12-02 recurve, a round: 70 m 122 cm 9,7,5 (21 → 7.0); 60 m 122 cm 10,8,6 (24 → 8.0)
// One session a line, as in the worked table above.
// prettier-ignore
const log: ProgressSession[] = [
  session('a', '2026-11-24T18:00:00.000Z', 'recurve', [18, 'full-40', typed('10', '9', '8')], [18, 'full-40', typed('9', '9', 'M')]),
  session('b', '2026-11-26T18:00:00.000Z', 'recurve', [18, 'full-40', typed('X', '10', '9')]),
  session('c', '2026-12-01T18:00:00.000Z', 'recurve', [18, 'full-40', typed('10', '10', '9', '9', '8', '8')]),
  session('d', '2026-12-02T18:00:00.000Z', 'compound', [18, 'full-40', typed('10', '10', '10')]),
  session('e', '2026-12-02T09:00:00.000Z', 'recurve', [70, 'full-122', typed('9', '7', '5')], [60, 'full-122', typed('10', '8', '6')]),
];

describe('practiceProgress', () => {
  it('averages per arrow per week, one series per distance and face, shortest first', () => {
    const series = practiceProgress(log, { bowStyle: 'recurve' });
    expect(series.map((s) => `${s.distanceM} ${s.faceId}`)).toEqual([
      '18 full-40',
      '60 full-122',
      '70 full-122',
    ]);
    const [indoor] = series;
    // Week of 2026-11-23: a and b, 45 + 29 = 74 over 6 + 3 = 9 arrows → 8.222…
    // Week of 2026-11-30: c alone (d is compound, filtered out), 54 / 6 = 9.0.
    expect(indoor?.weeks).toEqual([
      { weekStart: '2026-11-23', sessions: 2, arrows: 9, total: 74, averagePerArrow: 74 / 9 },
      { weekStart: '2026-11-30', sessions: 1, arrows: 6, total: 54, averagePerArrow: 9 },
    ]);
    // Best: b's 9.666… beats c's 9.0 and a's 7.5.
    expect(indoor?.best).toEqual({
      sessionId: 'b',
      startedAt: '2026-11-26T18:00:00.000Z',
      weekStart: '2026-11-23',
      arrows: 3,
      averagePerArrow: 29 / 3,
    });
    // A round's ends count at their own distance: 60 m 24/3 = 8.0, 70 m 21/3 = 7.0, both week 11-30.
    expect(series[1]?.weeks).toEqual([
      { weekStart: '2026-11-30', sessions: 1, arrows: 3, total: 24, averagePerArrow: 8 },
    ]);
    expect(series[2]?.best).toMatchObject({ sessionId: 'e', averagePerArrow: 7 });
  });

  it('without a bow filter takes every bow: the compound 10.0 becomes the best', () => {
    const [indoor] = practiceProgress(log);
    // Week of 2026-11-30: c and d, 54 + 30 = 84 over 6 + 3 = 9 arrows → 9.333…
    expect(indoor?.weeks[1]).toEqual({
      weekStart: '2026-11-30',
      sessions: 2,
      arrows: 9,
      total: 84,
      averagePerArrow: 84 / 9,
    });
    expect(indoor?.best).toMatchObject({ sessionId: 'd', averagePerArrow: 10 });
  });

  it('filters by distance', () => {
    const series = practiceProgress(log, { distanceM: 70 });
    expect(series).toHaveLength(1);
    expect(series[0]).toMatchObject({ distanceM: 70, faceId: 'full-122' });
    expect(practiceProgress(log, { bowStyle: 'barebow' })).toEqual([]);
  });

  it('breaks a tie for best by more arrows, then the earlier session', () => {
    // f: 9,9,9 = 27/3 = 9.0; g: 10,8,10,8,9,9 = 54/6 = 9.0 → g, the longer one.
    // h: 9,9,9 = 9.0, 3 arrows like f but a day later → f keeps it over h.
    const tie = [
      session('f', '2026-10-05T10:00:00.000Z', 'barebow', [30, 'full-80', typed('9', '9', '9')]),
      session('h', '2026-10-06T10:00:00.000Z', 'barebow', [30, 'full-80', typed('9', '9', '9')]),
    ];
    expect(practiceProgress(tie)[0]?.best.sessionId).toBe('f');
    const withG = [
      ...tie,
      session('g', '2026-10-07T10:00:00.000Z', 'barebow', [
        30,
        'full-80',
        typed('10', '8', '10', '8', '9', '9'),
      ]),
    ];
    expect(practiceProgress(withG)[0]?.best.sessionId).toBe('g');
  });

  it('counts one arrow a spot on the triple face, and leaves out empty ends', () => {
    // Spot 0 holds a 10 and a 9: only the lowest (9) counts, the 10 scores M; spot 1 an 8.
    // Total 0 + 9 + 8 = 17 over 3 arrows → 5.666…
    const triple = session(
      't',
      '2026-11-10T19:00:00.000Z',
      'compound',
      [
        18,
        'triple-40',
        [
          { value: '10', xMm: 0, yMm: -160, spot: 0 },
          { value: '9', xMm: 5, yMm: -160, spot: 0 },
          { value: '8', xMm: 0, yMm: 10, spot: 1 },
        ],
      ],
      [25, 'full-60', []],
    );
    const series = practiceProgress([triple]);
    expect(series).toHaveLength(1);
    expect(series[0]?.weeks).toEqual([
      { weekStart: '2026-11-09', sessions: 1, arrows: 3, total: 17, averagePerArrow: 17 / 3 },
    ]);
    expect(practiceProgress([])).toEqual([]);
  });
});

describe('progressChoices', () => {
  it('lists the bow styles and the distances shot, shortest first', () => {
    expect(progressChoices(log)).toEqual({ bowStyles: ['recurve', 'compound'], distances: [18, 60, 70] });
  });
});

describe('tournament cards in progress', () => {
  it('counts a tournament card as a session of its week, marks the week, and names it when it is the best', () => {
    const practice = session('p', '2026-11-30T10:00:00.000Z', 'recurve', [
      70,
      'full-122',
      typed('9', '8', '7'),
    ]);
    const tournament = {
      ...session('t', '2026-12-02T10:00:00.000Z', 'recurve', [70, 'full-122', typed('10', '9', '9')]),
      tournament: 'Club Shoot, Saturday',
    };
    const [series] = practiceProgress([practice, tournament]);
    // One week (Monday 30 Nov): 24 + 28 = 52 points over 6 arrows.
    expect(series!.weeks).toEqual([
      { weekStart: '2026-11-30', sessions: 2, arrows: 6, total: 52, averagePerArrow: 52 / 6, tournaments: 1 },
    ]);
    // The tournament's 28 / 3 ≈ 9.33 beats practice's 24 / 3 = 8.
    expect(series!.best).toMatchObject({ sessionId: 't', tournament: 'Club Shoot, Saturday' });
    // Practice alone: no mark on the week or the best session.
    const [alone] = practiceProgress([practice]);
    expect(alone!.weeks[0]).not.toHaveProperty('tournaments');
    expect(alone!.best).not.toHaveProperty('tournament');
  });
});

describe('partsTally (the log line of a session, from its parts)', () => {
  it('adds arrows and points over every distance and face, and matches the tally of the arrows themselves', () => {
    // 70 m: 9 + 8 + 7 = 24 over 3; 50 m: X (10) + M (0) = 10 over 2 → 34 over 5 = 6.8 an arrow.
    const { parts } = session(
      'p',
      '2026-11-30T10:00:00.000Z',
      'recurve',
      [70, 'full-122', typed('9', '8', '7')],
      [50, 'full-80', typed('X', 'M')],
    );
    expect(partsTally(parts)).toEqual({ arrows: 5, total: 34, averagePerArrow: 6.8 });
    const { total, arrows, averagePerArrow } = practiceTally(['9', '8', '7', 'X', 'M']);
    expect(partsTally(parts)).toEqual({ arrows, total, averagePerArrow });
    expect(partsTally([])).toEqual({ arrows: 0, total: 0, averagePerArrow: 0 });
  });
});
