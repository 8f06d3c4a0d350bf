import type { Trust } from './results';

/**
 * `GET /api/places/:sessionId/:entryId`: one archer's live place in their division and session,
 * and the points to the places around it. Public once the event's results are published; before
 * that only for the archer and the event's organizers and judges.
 */
export type ArcherPlace = {
  eventId: number;
  sessionId: number;
  entryId: number;
  division: string;
  /** When the standings were computed. */
  computedAt: string;
  /** Null until one of the archer's ends counts (nothing to rank yet). */
  place: number | null;
  tied: boolean;
  /** Archers of the division with at least one end that counts. */
  ranked: number;
  total: number;
  endsShot: number;
  totalEnds: number;
  trust: Trust;
  /** Points the archer needs to reach the next place up; null in first place. */
  toPlaceAbove: number | null;
  /** Points the archer leads the next place down by; null in last place. */
  leadOverBelow: number | null;
};
