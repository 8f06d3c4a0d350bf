import { ScoringError } from '../errors';
import { matchCrossCheck } from './matchCrossCheck';
import { matchState, type MatchEnd, type MatchFormat } from './matchState';

/** Who made an end count: the two writers agreeing on it, or a judge entering or settling it. */
export type EndCountedBy = 'writers' | 'judge';

/** One end of a match as it stands on record. */
export interface EndOnRecord {
  /**
   * An end the writers can no longer change: a judge entered or settled it, or a judge signed it.
   * It counts as it is.
   */
  closed?: MatchEnd & { by: EndCountedBy };
  /** Each writer's own record of the end (writer 1, writer 2), compared by the cross-check. */
  writers?: readonly [MatchEnd | undefined, MatchEnd | undefined];
}

export type CountedEnd = MatchEnd & { by: EndCountedBy };

/**
 * The ends that count on a match card, in order (docs/matches.md): an end counts when it is closed
 * (a judge's, or signed) or when both writers agree on it; the first end that does not count stops
 * the count, so a counted end one writer changes afterwards leaves the count at once, and every end
 * after it with it, until the writers agree again or a judge settles it. An end the rules refuse
 * after the ends before it (an end after the match was won) stops the count too.
 */
export function countedEnds(format: MatchFormat, ends: readonly (EndOnRecord | undefined)[]): CountedEnd[] {
  const counted: CountedEnd[] = [];
  for (const end of ends) {
    const agreed = end?.writers && matchCrossCheck(end.writers[0], end.writers[1]).agreed;
    const next = end?.closed ?? (agreed ? { ...agreed, by: 'writers' as const } : null);
    if (!next) break;
    try {
      matchState(format, { ends: [...counted, next] });
    } catch (error) {
      if (error instanceof ScoringError) break;
      throw error;
    }
    counted.push(next);
  }
  return counted;
}
