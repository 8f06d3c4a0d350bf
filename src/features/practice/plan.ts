import { endsOfRound, getFace, getRound } from '../../core';
import type { FaceId } from '../../core';
import { PRACTICE_MAX_ENDS } from '../../core/practice/limits';
import type { PracticeEndRow, PracticeSessionRow } from '../../local/db';

/** What one end of a practice session is shot at. */
export type EndSetup = { distanceM: number; faceId: FaceId; arrows: number };

/** The ends a session plans, in order; undefined when it is open-ended. */
export function plannedEnds(session: PracticeSessionRow): EndSetup[] | undefined {
  if (session.roundId) {
    const round = getRound(session.roundId);
    return endsOfRound(round).map((end) => {
      const d = round.distances[end.distanceIndex];
      return { distanceM: d?.distanceM ?? 0, faceId: d?.faceId ?? session.faceId, arrows: end.arrows };
    });
  }
  if (session.plannedEnds === null) return undefined;
  return Array.from({ length: session.plannedEnds }, () => free(session));
}

const free = (s: PracticeSessionRow): EndSetup => ({
  distanceM: s.distanceM,
  faceId: s.faceId,
  arrows: s.arrowsPerEnd,
});

/**
 * The setup of end `index` (from 0); open-ended sessions repeat their one setup up to the
 * most ends a session keeps (the account refuses more).
 */
export function endSetup(session: PracticeSessionRow, index: number): EndSetup | undefined {
  const plan = plannedEnds(session);
  if (plan) return plan[index];
  return index < PRACTICE_MAX_ENDS ? free(session) : undefined;
}

/** The end the next arrow goes to, or undefined when every planned end is full. */
export function nextEndIndex(
  session: PracticeSessionRow,
  ends: readonly PracticeEndRow[],
): number | undefined {
  const last = ends[ends.length - 1];
  if (last && last.arrows.length < (endSetup(session, last.index)?.arrows ?? 0)) return last.index;
  const next = last ? last.index + 1 : 0;
  return endSetup(session, next) ? next : undefined;
}

/** "70 m round", or "Free practice, 18 m, 40 cm face". */
export function sessionTitle(session: PracticeSessionRow): string {
  if (session.roundId) return getRound(session.roundId).name;
  return `Free practice, ${session.distanceM} m, ${getFace(session.faceId).label}`;
}

export const BOW_STYLE_LABELS = { recurve: 'Recurve', compound: 'Compound', barebow: 'Barebow' } as const;
