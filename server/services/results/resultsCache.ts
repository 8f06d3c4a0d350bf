import type { EventResults } from '../../../src/contract/results';
import type { Db } from '../../db';
import { computeResults } from './standings';
import { resultsVersion, type ResultsEvent } from './resultsEvent';

/**
 * The latest computed results of each event with the version they were computed at: many
 * spectators polling an unchanged event cost one computation, not one each.
 */
export function resultsCache(db: Db) {
  const held = new Map<number, { version: string; results: EventResults }>();
  return {
    version: (event: ResultsEvent) => resultsVersion(db, event),
    async results(event: ResultsEvent, version: string): Promise<EventResults> {
      const cached = held.get(event.id);
      if (cached?.version === version) return cached.results;
      const results = await computeResults(db, event);
      held.set(event.id, { version, results });
      return results;
    },
  };
}
export type ResultsCache = ReturnType<typeof resultsCache>;
