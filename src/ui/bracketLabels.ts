import { endTotal } from '../core';
import type { MatchDto } from '../contract/matches';

/** A round's name by how many matches it has: the final, the semi-finals, then "1/8" and so on. */
export function roundName(round: number, rounds: number): string {
  const fromFinal = rounds - 1 - round;
  if (fromFinal === 0) return 'Final';
  if (fromFinal === 1) return 'Semi-finals';
  if (fromFinal === 2) return 'Quarter-finals';
  return `1/${2 ** fromFinal} round`;
}

/** Where a match stands, in words: a bye, who went through and how, or what it waits for. */
export function matchStatus(m: MatchDto): string {
  if (m.decidedBy === 'bye') return 'Bye';
  if (m.decidedBy === 'withdrawal' || m.decidedBy === 'no-show') return `Walkover (${m.decidedBy})`;
  if (m.decidedBy) return m.decidedBy === 'shoot-off' ? 'Signed, won in the shoot-off' : 'Signed';
  if (!m.state) return 'Waiting for the earlier matches';
  if (m.state.winner) return 'Match over, waiting for the judge’s signature';
  const next = m.state.next;
  if (next === 'shoot-off') return 'Shoot-off next';
  if (next === 'judge') return 'Shoot-off: the judge decides which arrow is closer';
  return m.ends.length === 0 ? 'Not started' : `End ${m.ends.length + 1} next`;
}

/** One line of a match as the screens show it: the side's seed and archers, its score once shot, whether it won. */
export function matchLine(
  m: MatchDto,
  side: 'a' | 'b',
): { seed: number | null; name: string; score?: number; won: boolean } {
  const s = m.sides[side];
  const winner = m.winner ?? m.state?.winner ?? null;
  return {
    seed: s ? s.seed : null,
    name: s ? s.archers.map((a) => a.name).join(', ') : m.decidedBy === 'bye' ? 'bye' : 'to be decided',
    // A walkover or bye has no score to show.
    score: m.ends.length > 0 ? m.state?.score[side] : undefined,
    won: winner === side,
  };
}

/**
 * The score of a match with each end's totals, for the printed bracket: "6–4 (28-27, 26-29, …)",
 * and the shoot-off arrows when there were some. Empty before the first end.
 */
export function matchEndsLine(m: MatchDto): string {
  if (m.ends.length === 0 || !m.state) return '';
  const ends = m.ends.map((e) => `${endTotal(e.a)}-${endTotal(e.b)}`);
  const { a, b } = m.shootOff;
  if (a && b) ends.push(`shoot-off ${a.value}-${b.value}`);
  return `${m.state.score.a}–${m.state.score.b} (${ends.join(', ')})`;
}

/** "Countersigned by A and B": the archers who countersigned the card after the judge, or ''. */
export function countersignedLine(m: MatchDto): string {
  const names = (['a', 'b'] as const)
    .flatMap((s) => m.sides[s]?.archers ?? [])
    .filter((a) => m.countersignedBy.includes(a.entryId))
    .map((a) => a.name);
  return names.length === 0 ? '' : `Countersigned by ${names.join(' and ')}.`;
}
