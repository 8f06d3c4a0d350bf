import { ScoringError } from './errors';

/** One arrow as written on a card. X is the inner 10; M is a miss. */
export type ArrowValue = 'X' | '10' | '9' | '8' | '7' | '6' | '5' | '4' | '3' | '2' | '1' | 'M';

/** Highest first, the order values are written on a card (WA Book 3). */
export const ARROW_VALUES: readonly ArrowValue[] = [
  'X',
  '10',
  '9',
  '8',
  '7',
  '6',
  '5',
  '4',
  '3',
  '2',
  '1',
  'M',
];

const POINTS: Readonly<Record<ArrowValue, number>> = {
  X: 10,
  '10': 10,
  '9': 9,
  '8': 8,
  '7': 7,
  '6': 6,
  '5': 5,
  '4': 4,
  '3': 3,
  '2': 2,
  '1': 1,
  M: 0,
};

// Position in ARROW_VALUES; lower rank = higher value. X ranks above 10 although both score 10.
const RANK = Object.fromEntries(ARROW_VALUES.map((v, i) => [v, i])) as Readonly<Record<ArrowValue, number>>;

export function isArrowValue(input: unknown): input is ArrowValue {
  return typeof input === 'string' && Object.hasOwn(RANK, input);
}

/**
 * Reads what a writer taps or types. Accepts the card values in either case, with surrounding
 * spaces. '0' is refused on purpose: it is what "10" becomes when a digit is lost, so reading it
 * as a miss could silently turn a 10 into 0; the writer is asked to write M instead.
 */
export function parseArrowValue(input: string): ArrowValue {
  const text = input.trim().toUpperCase();
  if (isArrowValue(text)) return text;
  if (text === '0') {
    throw new ScoringError('unknown-arrow-value', `"${input}" is not an arrow value: write M for a miss.`);
  }
  throw new ScoringError(
    'unknown-arrow-value',
    `"${input}" is not an arrow value; use X, 10 to 1, or M for a miss.`,
  );
}

/** Points an arrow adds to the total: X counts 10, M counts 0 (WA Book 3). */
export function arrowPoints(value: ArrowValue): number {
  return POINTS[value];
}

/** Sort comparator: highest first, X before 10. */
export function compareArrowValues(a: ArrowValue, b: ArrowValue): number {
  return RANK[a] - RANK[b];
}

/** A 10 for the 10s count, which includes Xs (WA Book 3 tie-break). */
export function isTen(value: ArrowValue): boolean {
  return value === '10' || value === 'X';
}

export function isX(value: ArrowValue): boolean {
  return value === 'X';
}

export function isNine(value: ArrowValue): boolean {
  return value === '9';
}

export function isHit(value: ArrowValue): boolean {
  return value !== 'M';
}
