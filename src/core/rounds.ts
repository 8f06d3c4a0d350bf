import { cleanText } from './cleanText';
import { ScoringError } from './errors';
import { BOW_STYLES, VENUES, isFaceId } from './faces';
import type { BowStyle, FaceId, Venue } from './faces';

export interface RoundDistance {
  readonly label: string;
  readonly distanceM: number;
  readonly faceId: FaceId;
  readonly arrows: number;
  readonly arrowsPerEnd: number;
  readonly secondsPerEnd: number;
}

export interface RoundDefinition {
  readonly id: string;
  readonly name: string;
  readonly venue: Venue;
  readonly distances: readonly RoundDistance[];
  readonly bowStyles: readonly BowStyle[];
}

/** One end of a round, in shooting order. */
export interface RoundEnd {
  /** Position among all ends of the round, from 0. */
  index: number;
  distanceIndex: number;
  /** Position within its distance, from 0. */
  indexInDistance: number;
  arrows: number;
}

/** Highest points one arrow can score on any face. */
export const MAX_ARROW_POINTS = 10;

/** A single-distance round shot as two equal halves, as the 70 m, 50 m and 18 m rounds are. */
function halves(
  distanceM: number,
  faceId: FaceId,
  arrowsEach: number,
  arrowsPerEnd: number,
  secondsPerEnd: number,
): RoundDistance[] {
  return [1, 2].map((half) => ({
    label: `${distanceM} m (${half})`,
    distanceM,
    faceId,
    arrows: arrowsEach,
    arrowsPerEnd,
    secondsPerEnd,
  }));
}

function stage(distanceM: number, faceId: FaceId, arrowsPerEnd: 3 | 6): RoundDistance {
  // Four minutes for an end of six, two for an end of three (WA Book 3 time limits).
  const secondsPerEnd = arrowsPerEnd === 6 ? 240 : 120;
  return { label: `${distanceM} m`, distanceM, faceId, arrows: 36, arrowsPerEnd, secondsPerEnd };
}

/**
 * The rounds offered when an event is set up. The 70 m, 50 m and 18 m rounds follow the product
 * brief (WA Book 3 round definitions). The 1440 distances and faces are from memory (men 90, 70,
 * 50, 30 m; women 70, 60, 50, 30 m; 122 cm at the two longer distances, 80 cm at the two shorter)
 * as is shooting the two shorter distances in ends of three; they are offered to recurve and
 * compound, the styles that usually shoot them.
 */
export const ROUND_CATALOG: readonly RoundDefinition[] = [
  {
    id: '70m',
    name: '70 m round',
    venue: 'outdoor',
    distances: halves(70, 'full-122', 36, 6, 240),
    bowStyles: ['recurve'],
  },
  {
    id: '50m-compound',
    name: '50 m compound round',
    venue: 'outdoor',
    distances: halves(50, 'sixring-80', 36, 6, 240),
    bowStyles: ['compound'],
  },
  {
    id: '50m-barebow',
    name: '50 m barebow round',
    venue: 'outdoor',
    distances: halves(50, 'full-122', 36, 6, 240),
    bowStyles: ['barebow'],
  },
  {
    id: '1440-men',
    name: '1440 round (men)',
    venue: 'outdoor',
    distances: [
      stage(90, 'full-122', 6),
      stage(70, 'full-122', 6),
      stage(50, 'full-80', 3),
      stage(30, 'full-80', 3),
    ],
    bowStyles: ['recurve', 'compound'],
  },
  {
    id: '1440-women',
    name: '1440 round (women)',
    venue: 'outdoor',
    distances: [
      stage(70, 'full-122', 6),
      stage(60, 'full-122', 6),
      stage(50, 'full-80', 3),
      stage(30, 'full-80', 3),
    ],
    bowStyles: ['recurve', 'compound'],
  },
  {
    id: '18m',
    name: '18 m indoor round',
    venue: 'indoor',
    distances: halves(18, 'full-40', 30, 3, 120),
    bowStyles: ['recurve', 'compound', 'barebow'],
  },
  {
    id: '18m-triple',
    name: '18 m indoor round, triple face',
    venue: 'indoor',
    distances: halves(18, 'triple-40', 30, 3, 120),
    bowStyles: ['recurve', 'compound'],
  },
];

export function getRound(id: string): RoundDefinition {
  const round = ROUND_CATALOG.find((r) => r.id === id);
  if (!round) throw new ScoringError('unknown-round', `"${id}" is not a round in the catalog.`);
  return round;
}

export function roundArrowCount(round: RoundDefinition): number {
  return round.distances.reduce((sum, d) => sum + d.arrows, 0);
}

export function roundEndCount(round: RoundDefinition): number {
  return round.distances.reduce((sum, d) => sum + Math.ceil(d.arrows / d.arrowsPerEnd), 0);
}

export function roundMaxScore(round: RoundDefinition): number {
  return roundArrowCount(round) * MAX_ARROW_POINTS;
}

export function endsOfRound(round: RoundDefinition): RoundEnd[] {
  const ends: RoundEnd[] = [];
  round.distances.forEach((d, distanceIndex) => {
    // The last end of a distance is shorter when its arrows do not divide evenly (hand-built rounds).
    for (let shot = 0, indexInDistance = 0; shot < d.arrows; shot += d.arrowsPerEnd, indexInDistance += 1) {
      ends.push({
        index: ends.length,
        distanceIndex,
        indexInDistance,
        arrows: Math.min(d.arrowsPerEnd, d.arrows - shot),
      });
    }
  });
  return ends;
}

/*
 * Limits of a hand-built round, from what the sport shoots (common practice, no single rule):
 * target archery shoots ends of 3 or 6 arrows (WA Book 3), so 6 per end is the ceiling; the
 * longest common distance is 36 ends of 3 (a 1440 distance); the longest common round is a double
 * 1440 (8 distances, 288 arrows). Beyond these a round is a mistake or an attack, and an unbounded
 * one would make every card, pad and printout of it unboundedly large.
 */
export const ROUND_LIMITS = {
  arrowsPerEnd: 6,
  endsPerDistance: 36,
  distances: 8,
  arrowsPerRound: 288,
  /** Metres; the longest outdoor distance is 90 m. */
  distanceM: 150,
  /** Four minutes for six arrows is the usual limit; twice that leaves room for para classes. */
  secondsPerEnd: 600,
  /** Characters of the round's id, name and each distance's label. */
  id: 60,
  name: 120,
  label: 60,
} as const;

function isWholeAbove0(n: unknown): n is number {
  return typeof n === 'number' && Number.isInteger(n) && n > 0;
}

function text(value: unknown): string | undefined {
  const clean = typeof value === 'string' ? cleanText(value).trim() : '';
  return clean !== '' ? clean : undefined;
}

/** A value from the network quoted in a message: never calls the value's own toString. */
function quoted(value: unknown): string {
  return typeof value === 'string'
    ? `"${value.slice(0, 40)}"`
    : typeof value === 'number'
      ? String(value)
      : 'That';
}

function checkDistance(raw: unknown, where: string, problems: string[]): RoundDistance | undefined {
  if (typeof raw !== 'object' || raw === null) {
    problems.push(
      `${where} must be an object with label, distanceM, faceId, arrows, arrowsPerEnd and secondsPerEnd.`,
    );
    return undefined;
  }
  const d = raw as Record<string, unknown>;
  const before = problems.length;
  const label = text(d.label);
  if (label === undefined) problems.push(`${where} needs a label.`);
  else if (label.length > ROUND_LIMITS.label)
    problems.push(`${where}: use at most ${ROUND_LIMITS.label} characters for the label.`);
  const { distanceM, faceId, arrows, arrowsPerEnd, secondsPerEnd } = d;
  if (
    typeof distanceM !== 'number' ||
    !Number.isFinite(distanceM) ||
    distanceM <= 0 ||
    distanceM > ROUND_LIMITS.distanceM
  ) {
    problems.push(
      `${where}: distance must be a number of metres above 0 and at most ${ROUND_LIMITS.distanceM}.`,
    );
  }
  if (!isFaceId(faceId)) problems.push(`${where}: ${quoted(faceId)} is not a known target face.`);
  const perEnd = ROUND_LIMITS.arrowsPerEnd;
  const maxArrows =
    ROUND_LIMITS.endsPerDistance * (isWholeAbove0(arrowsPerEnd) ? Math.min(arrowsPerEnd, perEnd) : perEnd);
  if (!isWholeAbove0(arrows) || arrows > maxArrows)
    problems.push(
      `${where}: arrows must be a whole number from 1 to ${maxArrows} (at most ${ROUND_LIMITS.endsPerDistance} ends).`,
    );
  if (!isWholeAbove0(arrowsPerEnd) || arrowsPerEnd > perEnd) {
    problems.push(`${where}: arrows per end must be a whole number from 1 to ${perEnd}.`);
  } else if (isWholeAbove0(arrows) && arrows % arrowsPerEnd !== 0) {
    problems.push(`${where}: ${arrows} arrows do not split into ends of ${arrowsPerEnd}.`);
  }
  if (!isWholeAbove0(secondsPerEnd) || secondsPerEnd > ROUND_LIMITS.secondsPerEnd)
    problems.push(
      `${where}: seconds per end must be a whole number from 1 to ${ROUND_LIMITS.secondsPerEnd}.`,
    );
  if (problems.length > before) return undefined;
  return {
    label: label as string,
    distanceM: distanceM as number,
    faceId: faceId as FaceId,
    arrows: arrows as number,
    arrowsPerEnd: arrowsPerEnd as number,
    secondsPerEnd: secondsPerEnd as number,
  };
}

/**
 * Checks a round an organizer made up (a club's practice round, a junior distance). Input may
 * come straight from a form or the network, so every field is checked and every problem is
 * reported at once; the ScoringError carries them in `problems`.
 */
export function defineCustomRound(input: unknown): RoundDefinition {
  if (typeof input !== 'object' || input === null) {
    throw new ScoringError('invalid-round', 'A custom round must be an object.');
  }
  const raw = input as Record<string, unknown>;
  const problems: string[] = [];

  const id = text(raw.id);
  if (id === undefined) problems.push('The round needs an id.');
  else if (id.length > ROUND_LIMITS.id)
    problems.push(`Use at most ${ROUND_LIMITS.id} characters for the round's id.`);
  else if (ROUND_CATALOG.some((r) => r.id === id))
    problems.push(`The id "${id}" belongs to a catalog round.`);

  const name = text(raw.name);
  if (name === undefined) problems.push('The round needs a name.');
  else if (name.length > ROUND_LIMITS.name)
    problems.push(`Use at most ${ROUND_LIMITS.name} characters for the round's name.`);

  const venue = raw.venue;
  if (!VENUES.includes(venue as Venue)) problems.push(`Venue must be ${VENUES.join(' or ')}.`);

  const distances: RoundDistance[] = [];
  if (!Array.isArray(raw.distances) || raw.distances.length === 0) {
    problems.push('The round needs at least one distance.');
  } else if (raw.distances.length > ROUND_LIMITS.distances) {
    problems.push(`A round has at most ${ROUND_LIMITS.distances} distances.`);
  } else {
    raw.distances.forEach((d: unknown, i) => {
      const checked = checkDistance(d, `Distance ${i + 1}`, problems);
      if (checked) distances.push(checked);
    });
    const arrows = distances.reduce((sum, d) => sum + d.arrows, 0);
    if (arrows > ROUND_LIMITS.arrowsPerRound)
      problems.push(`A round has at most ${ROUND_LIMITS.arrowsPerRound} arrows; this one has ${arrows}.`);
  }

  const bowStyles = raw.bowStyles;
  if (!Array.isArray(bowStyles) || bowStyles.length === 0) {
    problems.push('The round needs at least one bow style.');
  } else if (bowStyles.length > BOW_STYLES.length) {
    problems.push(`A round lists at most ${BOW_STYLES.length} bow styles.`);
  } else {
    for (const style of bowStyles) {
      if (!BOW_STYLES.includes(style as BowStyle)) problems.push(`${quoted(style)} is not a bow style.`);
    }
    if (new Set(bowStyles).size !== bowStyles.length) problems.push('A bow style is listed twice.');
  }

  if (problems.length > 0) {
    const summary =
      problems.length === 1
        ? (problems[0] as string)
        : `The round has ${problems.length} problems: ${problems.join(' ')}`;
    throw new ScoringError('invalid-round', summary, problems);
  }
  return {
    id: id as string,
    name: name as string,
    venue: venue as Venue,
    distances,
    bowStyles: [...(bowStyles as BowStyle[])],
  };
}
