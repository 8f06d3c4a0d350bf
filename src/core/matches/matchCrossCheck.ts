import { crossCheck, type CrossCheck, type CrossCheckStatus } from '../crossCheck';
import { sortEnd } from '../ends';
import { MATCH_ARROWS_PER_END, type MatchEnd } from './matchState';

export interface MatchCrossCheck {
  /** `waiting` until both writers wrote all six arrows; then `agreed` or `mismatch`. */
  status: CrossCheckStatus;
  /** Each line compared arrow by arrow (highest first), as for a qualification end. */
  a: CrossCheck;
  b: CrossCheck;
  /** The end both wrote, highest first, once they agree. */
  agreed: MatchEnd | null;
}

const complete = (end: MatchEnd | undefined): end is MatchEnd =>
  !!end && end.a.length === MATCH_ARROWS_PER_END && end.b.length === MATCH_ARROWS_PER_END;

/**
 * Compares the two writers' records of one match end with the qualification cross-check, line by
 * line: only a complete end (three arrows each line, from both writers) is compared, and it counts
 * only when every arrow agrees. A mismatch goes to the match's judge.
 */
export function matchCrossCheck(first: MatchEnd | undefined, second: MatchEnd | undefined): MatchCrossCheck {
  if (!complete(first) || !complete(second)) {
    const waiting = crossCheck(undefined, undefined);
    return { status: 'waiting', a: waiting, b: waiting, agreed: null };
  }
  const a = crossCheck(first.a, second.a);
  const b = crossCheck(first.b, second.b);
  const agreed = a.status === 'agreed' && b.status === 'agreed';
  return {
    status: agreed ? 'agreed' : 'mismatch',
    a,
    b,
    agreed: agreed ? { a: sortEnd(first.a), b: sortEnd(first.b) } : null,
  };
}
