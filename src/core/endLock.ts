import { endRules } from './endRules';
import type { EndRules } from './ends';
import type { BowStyle } from './faces';
import type { RoundDefinition, RoundEnd } from './rounds';

/** Why a writer or a caller may no longer change an end. */
export type WriterLock = 'signed' | 'ruled' | 'closed';

/**
 * Whether a writer or a caller may still change an end: not once a judge signed it or ruled on
 * it (only a judge changes a value after that, WA Book 3), and not once the organizer closed the
 * session. The pad locks what the server would refuse, so a tap never becomes a rejection later.
 */
export function writerLock(end: {
  signed: boolean;
  ruled: boolean;
  sessionClosed: boolean;
}): WriterLock | undefined {
  if (end.signed) return 'signed';
  if (end.ruled) return 'ruled';
  if (end.sessionClosed) return 'closed';
  return undefined;
}

/**
 * The rules of one end of a round: the face's values for the bow style, and the arrows this end
 * holds (a hand-built round's last end of a distance can be shorter than its arrows per end).
 */
export function rulesForEnd(
  round: RoundDefinition,
  end: RoundEnd,
  bowStyle: BowStyle,
  options: { allowPartial?: boolean } = {},
): EndRules {
  return { ...endRules(round, end.distanceIndex, bowStyle, options), arrowsPerEnd: end.arrows };
}
