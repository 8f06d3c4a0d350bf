import type { EventResults } from '../../../src/contract/results';
import type { Db } from '../../db';
import { heldCardCounts, type HeldCardCounts } from './heldCardCounts';
import { computeResults } from './standings';
import { resultsVersion, type ResultsEvent } from './resultsEvent';

/**
 * The latest computed results of each event with the version they were computed at: many
 * spectators polling an unchanged event cost one computation, not one each. Each event's card
 * counts are kept too, so a new version reads only the cards that changed.
 */
export function resultsCache(db: Db) {
  const held = new Map<number, { version: string; results: EventResults }>();
  const counts = new Map<number, HeldCardCounts>();
  return {
    version: (event: ResultsEvent) => resultsVersion(db, event),
    async results(event: ResultsEvent, version: string): Promise<EventResults> {
      const cached = held.get(event.id);
      if (cached?.version === version) return cached.results;
      let eventCounts = counts.get(event.id);
      if (!eventCounts) counts.set(event.id, (eventCounts = heldCardCounts()));
      const results = await computeResults(db, event, eventCounts);
      held.set(event.id, { version, results });
      return results;
    },
  };
}
export type ResultsCache = ReturnType<typeof resultsCache>;
