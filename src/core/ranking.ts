import { arrowPoints } from './arrowValue';
import type { ArrowValue } from './arrowValue';
import { ScoringError } from './errors';
import type { Venue } from './faces';

/** One shoot-off arrow: its value and, for equal values, how close to the centre it was. */
export interface ShootOffArrow {
  value: ArrowValue;
  /** Measured distance from the centre of the face, in mm (the judge's measurement). */
  distanceMm?: number | undefined;
  /** The judge saw this arrow closer to the centre than the others of equal value (no measurement). */
  closer?: boolean | undefined;
}

export interface RankInput {
  id: string;
  total: number;
  /** 10s including Xs. */
  tens: number;
  xs: number;
  nines: number;
  /** False while the archer still has ends to shoot: a tie is only shot off once the round is over. */
  complete?: boolean | undefined;
  /** Shoot-off arrows in the order shot; used only while a tie decides the cut or a medal. */
  shootOff?: readonly ShootOffArrow[] | undefined;
}

export interface Placing {
  /** Standard competition ranking: equal archers share a place and the next place is skipped. */
  place: number;
  /** Another archer shares this place. */
  tied: boolean;
  /** The tie decides the cut or a medal and no shoot-off has settled it yet. */
  shootOff: boolean;
  /** A shoot-off separated the archers whose equal totals decided the cut or a medal. */
  decidedByShootOff: boolean;
}

export interface RankOptions {
  /** Indoor ties count 9s after 10s, outdoor ties count Xs (default outdoor). */
  venue?: Venue;
  /** How many archers go through to the eliminations; absent when there are none. */
  cut?: number;
  /** Places that win a medal when there are no eliminations (default 3). */
  medalPlaces?: number;
}

type Tier<T> = T[];

const byId = <T extends RankInput>(a: T, b: T) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);

/** Splits archers into runs that share a key, best key first; each run sorted by id. */
function partition<T extends RankInput>(rows: readonly T[], key: (row: T) => number): Tier<T>[] {
  const keys = [...new Set(rows.map(key))].sort((a, b) => b - a);
  return keys.map((k) => rows.filter((r) => key(r) === k).sort(byId));
}

function countBack<T extends RankInput>(rows: readonly T[], venue: Venue): Tier<T>[] {
  const second = venue === 'indoor' ? (r: T) => r.nines : (r: T) => r.xs;
  return partition(rows, (r) => r.tens).flatMap((tier) => partition(tier, second));
}

/**
 * Orders archers whose equal totals decide a place by their shoot-off arrows, one arrow at a
 * time: the higher value wins; equal values go to the arrow closer to the centre (measured, or
 * the judge's "closer"); archers still level shoot the next arrow. A group in which someone has
 * not shot the arrow yet stays level.
 */
function shootOffTiers<T extends RankInput>(group: readonly T[], arrow = 0): Tier<T>[] {
  if (group.length < 2) return [[...group]];
  const shots = group.map((r) => r.shootOff?.[arrow]);
  if (shots.some((s) => s === undefined)) return [[...group].sort(byId)];
  const shot = (r: T) => r.shootOff![arrow]!;
  return partition(group, (r) => arrowPoints(shot(r).value)).flatMap((sameValue) => {
    if (sameValue.length < 2) return [sameValue];
    const measured = sameValue.every((r) => shot(r).distanceMm !== undefined);
    const closer = partition(sameValue, (r) =>
      measured ? -(shot(r).distanceMm as number) : shot(r).closer ? 1 : 0,
    );
    return closer.flatMap((level) => shootOffTiers(level, arrow + 1));
  });
}

function checkInput(rows: readonly RankInput[], opts: RankOptions): void {
  for (const [name, n] of [
    ['cut', opts.cut],
    ['number of medal places', opts.medalPlaces],
  ] as const) {
    if (n !== undefined && !(Number.isInteger(n) && n >= 0)) {
      throw new ScoringError('invalid-ranking', `A ${name} of ${n} is not a whole number of archers.`);
    }
  }
  for (const row of rows) {
    // A NaN would make the order arbitrary rather than fail, so refuse it here.
    if (![row.total, row.tens, row.xs, row.nines].every(Number.isFinite)) {
      throw new ScoringError(
        'invalid-ranking',
        `Archer ${row.id} has a total, 10s, Xs or 9s count that is not a number.`,
      );
    }
  }
}

/**
 * Ranks archers (WA Book 3, chapter 14 "Scoring", art. 14.5, ties; see tests/core/ranking.test.ts
 * for the edition and what is from memory): by total; equal totals by most 10s (X included), then
 * most Xs outdoors or most 9s indoors; archers still level share the place. Equal totals that
 * decide the cut into the eliminations, or a medal place when there are none, are not counted
 * back: a shoot-off decides them, and until it does they share the place, flagged.
 * The result depends only on the archers, never on their order in the input.
 */
export function rankArchers<T extends RankInput>(
  rows: readonly T[],
  opts: RankOptions = {},
): (T & Placing)[] {
  checkInput(rows, opts);
  const { venue = 'outdoor', cut, medalPlaces = 3 } = opts;
  // A tie across positions start … end-1 (from 0) decides something when it straddles the cut or,
  // with no eliminations, reaches into the medal places.
  const decides = (start: number, size: number) =>
    size > 1 && (cut !== undefined ? start < cut && cut < start + size : start < medalPlaces);

  const ranked: (T & Placing)[] = [];
  for (const sameTotal of partition(rows, (r) => r.total)) {
    const start = ranked.length;
    // While someone in the tie still has ends to shoot, the tie is counted back for now.
    const shootOffDecides = decides(start, sameTotal.length) && sameTotal.every((r) => r.complete !== false);
    const tiers = shootOffDecides ? shootOffTiers(sameTotal) : countBack(sameTotal, venue);
    for (const tier of tiers) {
      const tierStart = ranked.length;
      for (const row of tier) {
        // Object.assign, not a spread with extra keys: V8 builds the spread form ~20× slower
        // (15 ms for 1,000 archers, most of a standings update).
        ranked.push(
          Object.assign({}, row, {
            place: tierStart + 1,
            tied: tier.length > 1,
            shootOff: shootOffDecides && decides(tierStart, tier.length),
            decidedByShootOff: shootOffDecides && tiers.length > 1,
          }),
        );
      }
    }
  }
  return ranked;
}

export interface TeamMemberInput extends RankInput {
  club: string;
  /** The organizer took the archer out of the team competition. */
  inTeam?: boolean | undefined;
}

export interface TeamResult {
  /** The club's name, which is also the team's id. */
  id: string;
  club: string;
  /** Ids of the archers whose scores count, best first. */
  members: string[];
  total: number;
  tens: number;
  xs: number;
  nines: number;
}

/**
 * Team places within one division (common practice, also the shape of WA team qualification:
 * a team's score is the sum of its members'): the best `teamSize` archers of each club, summed,
 * ranked with the same tie rules as archers. A club with fewer eligible archers has no team.
 */
export function rankTeams(
  archers: readonly TeamMemberInput[],
  opts: RankOptions & { teamSize?: number } = {},
): (TeamResult & Placing)[] {
  const { teamSize = 3, ...rankOpts } = opts;
  if (!(Number.isInteger(teamSize) && teamSize >= 1)) {
    throw new ScoringError('invalid-ranking', `A team of ${teamSize} archers is not possible.`);
  }
  const eligible = archers.filter((a) => a.inTeam !== false && a.club.trim() !== '');
  const clubs = [...new Set(eligible.map((a) => a.club))];
  const teams: TeamResult[] = clubs.flatMap((club) => {
    const best = countBack(
      eligible.filter((a) => a.club === club),
      rankOpts.venue ?? 'outdoor',
    )
      .flat()
      .sort((a, b) => b.total - a.total)
      .slice(0, teamSize);
    if (best.length < teamSize) return [];
    const sum = (key: 'total' | 'tens' | 'xs' | 'nines') => best.reduce((s, a) => s + a[key], 0);
    return [
      {
        id: club,
        club,
        members: best.map((a) => a.id),
        total: sum('total'),
        tens: sum('tens'),
        xs: sum('xs'),
        nines: sum('nines'),
      },
    ];
  });
  return rankArchers(teams, rankOpts);
}
