import { arrowPoints } from '../arrowValue';
import type { ArrowValue } from '../arrowValue';
import { ScoringError } from '../errors';
import type { ShootOffArrow } from '../ranking';
import { other, shootOffWinner } from './shootOff';
import type { ShootOffOutcome, Side } from './shootOff';

/*
 * Individual matches (WA Book 3, match play, art. 14.2 in the editions in force since 2018, from
 * memory: check the article number in the edition you use):
 * - set system (recurve, barebow): sets of 3 arrows; the higher set total wins 2 set points, a tied
 *   set 1 each; first to 6 set points wins; 5–5 after five sets goes to a one-arrow shoot-off;
 * - cumulative (compound): 5 ends of 3 arrows, the higher total wins (at most 150); level after the
 *   fifth end goes to a one-arrow shoot-off. Every end is shot even when the lead cannot be caught.
 */

export type MatchFormat = 'sets' | 'cumulative';

export const MATCH_ARROWS_PER_END = 3;
export const MATCH_MAX_ENDS = 5;
export const SET_POINTS_TO_WIN = 6;
const MAX_END_TOTAL = MATCH_ARROWS_PER_END * 10;

export type Pair = Record<Side, number>;

/** One set (or end) as written on the match card: the three values of each side. */
export interface MatchEnd {
  a: readonly ArrowValue[];
  b: readonly ArrowValue[];
}

export interface MatchRecord {
  ends: readonly MatchEnd[];
  /** The shoot-off arrow of each side, once shot. */
  shootOff?: Partial<Record<Side, ShootOffArrow>> | undefined;
}

export interface ScoredEnd {
  totals: Pair;
  /** Set points this set gave (set system only). */
  setPoints?: Pair;
}

/** What one result of the next set does to a side: win the match, lose it, force the shoot-off or go on. */
export type SetOutcome = 'wins' | 'loses' | 'shoot-off' | 'goes-on';

export interface SideOutlook {
  /** Set system, while a set is still to shoot: what winning, tying or losing it does. */
  nextSet?: Record<'win' | 'tie' | 'lose', SetOutcome>;
  /** Cumulative: the side is so far behind that the ends left cannot make it up. */
  outOfReach?: boolean;
  /** One short sentence for the pad ("Must win the next set."), empty when nothing is at stake. */
  say: string;
}

/** What the match asks for next: another end, the shoot-off, the judge's word on the shoot-off, or nothing. */
export type MatchNext = 'end' | 'shoot-off' | 'judge' | 'none';

export interface MatchState {
  format: MatchFormat;
  ends: ScoredEnd[];
  /** Set points (set system) or running totals (cumulative). */
  score: Pair;
  totals: Pair;
  /** How many more ends the rules may still ask for (0 once the match is decided or at the shoot-off). */
  endsLeft: number;
  next: MatchNext;
  winner: Side | null;
  decidedBy: 'score' | 'shoot-off' | null;
  shootOff: ShootOffOutcome | null;
  outlook: Record<Side, SideOutlook>;
}

const SIDES: readonly Side[] = ['a', 'b'];
const pairOf = (f: (side: Side) => number): Pair => ({ a: f('a'), b: f('b') });
const sum = (values: readonly ArrowValue[]) => values.reduce((t, v) => t + arrowPoints(v), 0);

function refuse(message: string): never {
  throw new ScoringError('invalid-match', message);
}

function checkEnds(record: MatchRecord): void {
  record.ends.forEach((end, i) => {
    for (const side of SIDES) {
      if (end[side].length !== MATCH_ARROWS_PER_END) {
        refuse(`End ${i + 1} of a match has ${MATCH_ARROWS_PER_END} arrows a side, not ${end[side].length}.`);
      }
    }
  });
}

const NO_OUTLOOK: Record<Side, SideOutlook> = { a: { say: '' }, b: { say: '' } };

function setOutcome(points: Pair, side: Side, setsShot: number): SetOutcome {
  if (points[side] >= SET_POINTS_TO_WIN) return 'wins';
  if (points[other(side)] >= SET_POINTS_TO_WIN) return 'loses';
  return setsShot === MATCH_MAX_ENDS ? 'shoot-off' : 'goes-on';
}

function setOutlook(points: Pair, setsShot: number): Record<Side, SideOutlook> {
  const after = (side: Side, mine: number, theirs: number) =>
    setOutcome(
      { [side]: points[side] + mine, [other(side)]: points[other(side)] + theirs } as Pair,
      side,
      setsShot + 1,
    );
  return {
    a: sideOutlook(after('a', 2, 0), after('a', 1, 1), after('a', 0, 2)),
    b: sideOutlook(after('b', 2, 0), after('b', 1, 1), after('b', 0, 2)),
  };
}

function sideOutlook(win: SetOutcome, tie: SetOutcome, lose: SetOutcome): SideOutlook {
  const say: string[] = [];
  if (tie === 'wins') say.push('A tied set wins the match.');
  else if (win === 'wins') say.push('Winning the next set wins the match.');
  if (tie === 'loses') say.push('Must win the next set.');
  else if (lose === 'loses') say.push('Must not lose the next set.');
  if (tie === 'shoot-off') say.push('A tied set means a shoot-off.');
  return { nextSet: { win, tie, lose }, say: say.join(' ') };
}

function cumulativeOutlook(totals: Pair, endsLeft: number): Record<Side, SideOutlook> {
  const one = (side: Side): SideOutlook => {
    const behind = totals[other(side)] - totals[side];
    if (endsLeft === 0 || behind <= 0) return { outOfReach: false, say: '' };
    const reachable = behind <= endsLeft * MAX_END_TOTAL;
    const ends = endsLeft === 1 ? '1 end' : `${endsLeft} ends`;
    return {
      outOfReach: !reachable,
      say: reachable
        ? `${behind} behind with ${ends} left.`
        : `${behind} behind with ${ends} left: out of reach.`,
    };
  };
  return { a: one('a'), b: one('b') };
}

function finish(
  base: Omit<MatchState, 'next' | 'winner' | 'decidedBy' | 'shootOff' | 'outlook' | 'endsLeft'>,
  record: MatchRecord,
  leader: Side | null,
  shootOffDue: boolean,
  endsLeft: number,
  outlook: Record<Side, SideOutlook>,
): MatchState {
  const arrows = record.shootOff;
  const anyArrow = arrows !== undefined && (arrows.a !== undefined || arrows.b !== undefined);
  if (leader) {
    if (anyArrow) refuse('This match was decided without a shoot-off; no shoot-off arrow can be recorded.');
    return {
      ...base,
      endsLeft: 0,
      next: 'none',
      winner: leader,
      decidedBy: 'score',
      shootOff: null,
      outlook: NO_OUTLOOK,
    };
  }
  if (!shootOffDue) {
    if (anyArrow)
      refuse('A shoot-off arrow can only be recorded once every end is shot and the match is level.');
    return { ...base, endsLeft, next: 'end', winner: null, decidedBy: null, shootOff: null, outlook };
  }
  const shootOff = shootOffWinner(arrows?.a, arrows?.b);
  if (shootOff.winner) {
    return {
      ...base,
      endsLeft: 0,
      next: 'none',
      winner: shootOff.winner,
      decidedBy: 'shoot-off',
      shootOff,
      outlook: NO_OUTLOOK,
    };
  }
  const next = shootOff.waitingFor === 'judge' ? 'judge' : 'shoot-off';
  return { ...base, endsLeft: 0, next, winner: null, decidedBy: null, shootOff, outlook: NO_OUTLOOK };
}

function setSystemState(record: MatchRecord): MatchState {
  const points: Pair = { a: 0, b: 0 };
  const ends: ScoredEnd[] = [];
  for (const [i, end] of record.ends.entries()) {
    if (points.a >= SET_POINTS_TO_WIN || points.b >= SET_POINTS_TO_WIN) {
      refuse(`The match was won after set ${i}; set ${i + 1} is not shot.`);
    }
    if (i >= MATCH_MAX_ENDS)
      refuse(`A set-system match has at most ${MATCH_MAX_ENDS} sets, then a shoot-off.`);
    const totals = pairOf((side) => sum(end[side]));
    const setPoints = pairOf((side) => {
      const diff = totals[side] - totals[other(side)];
      return diff > 0 ? 2 : diff === 0 ? 1 : 0;
    });
    points.a += setPoints.a;
    points.b += setPoints.b;
    ends.push({ totals, setPoints });
  }
  const totals = pairOf((side) => ends.reduce((t, e) => t + e.totals[side], 0));
  const leader = points.a >= SET_POINTS_TO_WIN ? 'a' : points.b >= SET_POINTS_TO_WIN ? 'b' : null;
  // Points add up to 2 a set, so nobody at 6 after five sets means 5–5.
  const shootOffDue = !leader && ends.length === MATCH_MAX_ENDS;
  const base = { format: 'sets' as const, ends, score: { ...points }, totals };
  return finish(
    base,
    record,
    leader,
    shootOffDue,
    MATCH_MAX_ENDS - ends.length,
    setOutlook(points, ends.length),
  );
}

function cumulativeState(record: MatchRecord): MatchState {
  if (record.ends.length > MATCH_MAX_ENDS)
    refuse(`A cumulative match has ${MATCH_MAX_ENDS} ends, then a shoot-off.`);
  const ends: ScoredEnd[] = record.ends.map((end) => ({ totals: pairOf((side) => sum(end[side])) }));
  const totals = pairOf((side) => ends.reduce((t, e) => t + e.totals[side], 0));
  const complete = ends.length === MATCH_MAX_ENDS;
  const leader = !complete || totals.a === totals.b ? null : totals.a > totals.b ? 'a' : 'b';
  const endsLeft = MATCH_MAX_ENDS - ends.length;
  const base = { format: 'cumulative' as const, ends, score: { ...totals }, totals };
  return finish(base, record, leader, complete && !leader, endsLeft, cumulativeOutlook(totals, endsLeft));
}

/**
 * Reads a match card so far: the score, whether the match is decided and how, what it asks for
 * next (never an end the rules do not allow), and what is still possible for each side.
 * Refuses a card the rules cannot produce (an end after the match was won, a sixth end, a
 * shoot-off arrow before the match is level after every end).
 */
export function matchState(format: MatchFormat, record: MatchRecord): MatchState {
  checkEnds(record);
  return format === 'sets' ? setSystemState(record) : cumulativeState(record);
}
