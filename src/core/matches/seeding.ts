import { ScoringError } from '../errors';

/*
 * Bracket seeding (WA Book 3, appendix of elimination bracket charts, from memory; the order is
 * that of the 1/32 bracket published with World Archery's Olympic and World Championship results,
 * also from memory): in the first round the two seeds of a match add up to the bracket size + 1;
 * each half of the bracket is the mirror image of the other, so seeds 1 and 2 meet only in the
 * final, 1–4 only from the semi-finals, 1–8 only from the quarter-finals. A number of archers
 * between two bracket sizes fills the next size, the missing lowest seeds giving byes to the top
 * seeds (common practice; the rule book's own 104-archer bracket, where the top 8 skip two
 * rounds, is not modelled).
 */

export const MIN_BRACKET_ENTRANTS = 4;
export const MAX_BRACKET_ENTRANTS = 128;

/** One first-round match, in bracket order: `a` the better seed, `b` null for a bye. */
export interface FirstRoundMatch {
  a: number;
  b: number | null;
}

function refuse(message: string): never {
  throw new ScoringError('invalid-bracket', message);
}

/** The bracket size for a number of archers: the smallest power of two that holds them. */
export function bracketSize(entrants: number): number {
  if (!Number.isInteger(entrants) || entrants < MIN_BRACKET_ENTRANTS || entrants > MAX_BRACKET_ENTRANTS) {
    refuse(`A bracket takes ${MIN_BRACKET_ENTRANTS} to ${MAX_BRACKET_ENTRANTS} archers, not ${entrants}.`);
  }
  let size = 2;
  while (size < entrants) size *= 2;
  return size;
}

/** Seeds line by line from the top of a bracket of `size` (a power of two). */
export function seedLines(size: number): number[] {
  let lines = [1, 2];
  while (lines.length < size) {
    const next = lines.length * 2 + 1;
    // Each seed meets (next − seed); alternate sides so each half mirrors the other.
    lines = lines.flatMap((seed, i) => (i % 2 === 0 ? [seed, next - seed] : [next - seed, seed]));
  }
  return lines;
}

/** The first round for `entrants` archers seeded 1…entrants, top of the bracket first. */
export function firstRound(entrants: number): FirstRoundMatch[] {
  const lines = seedLines(bracketSize(entrants));
  const matches: FirstRoundMatch[] = [];
  for (let i = 0; i < lines.length; i += 2) {
    const a = Math.min(lines[i]!, lines[i + 1]!);
    const b = Math.max(lines[i]!, lines[i + 1]!);
    matches.push({ a, b: b > entrants ? null : b });
  }
  return matches;
}

/** How many rounds a bracket for `entrants` archers has (the final is the last, the bronze match beside it). */
export const bracketRounds = (entrants: number): number => Math.log2(bracketSize(entrants));
