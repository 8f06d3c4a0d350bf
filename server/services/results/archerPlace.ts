import type { ArcherPlace } from '../../../src/contract/archerPlace';
import type { EventResults } from '../../../src/contract/results';
import { notFound } from '../../http/httpError';

/** One archer's row of the standings with the gaps to the places around it. */
export function archerPlace(results: EventResults, sessionId: number, entryId: number): ArcherPlace {
  const session = results.sessions.find((s) => s.sessionId === sessionId);
  const division = session?.divisions.find((d) => d.rows.some((r) => r.entryId === entryId));
  const row = division?.rows.find((r) => r.entryId === entryId);
  if (!division || !row) throw notFound('This archer has no place in that session.');
  // Archers with no end that counts yet are not in the race: no place, and no gap to them.
  const ranked = division.rows.filter((r) => r.endsShot > 0).sort((a, b) => a.place - b.place);
  const shooting = row.endsShot > 0;
  const above = ranked.filter((r) => r.place < row.place).at(-1);
  const below = ranked.find((r) => r.place > row.place);
  return {
    eventId: results.event.id,
    sessionId,
    entryId,
    division: division.name,
    computedAt: results.computedAt,
    place: shooting ? row.place : null,
    tied: shooting && row.tied,
    ranked: ranked.length,
    total: row.total,
    endsShot: row.endsShot,
    totalEnds: row.totalEnds,
    trust: row.trust,
    toPlaceAbove: shooting && above ? above.total - row.total : null,
    leadOverBelow: shooting && below ? row.total - below.total : null,
  };
}
