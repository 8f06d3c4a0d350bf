import type { BracketDto } from '../../../src/contract/matches';

/** One division's final places after its eliminations, as the exports and the mail print them. */
export type DivisionFinalPlaces = {
  divisionId: number;
  divisionName: string;
  sessionId: number;
  /** Archers seeded into the bracket. */
  entrants: number;
  places: BracketDto['places'];
};

/**
 * The final places of each bracket that has any yet (docs/matches.md: 1–4 from the final and the
 * bronze match, then by the round lost), for the whole event or the one division asked for.
 */
export function finalPlacesOf(brackets: BracketDto[], divisionId?: number): DivisionFinalPlaces[] {
  return brackets
    .filter((b) => b.places.length > 0 && (divisionId === undefined || b.divisionId === divisionId))
    .map((b) => ({
      divisionId: b.divisionId,
      divisionName: b.divisionName,
      sessionId: b.sessionId,
      entrants: b.entrants,
      places: b.places,
    }));
}
