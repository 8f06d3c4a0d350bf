import type { ResultsSettings } from '../../../src/contract/results';
import type { Db } from '../../db';
import { badRequest } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';

/**
 * Applies the organizer's results settings in one transaction: publishing, team size, each
 * division's cut, archers in or out of the team competition. Touches the event's updated_at, so
 * the results' version (and ETag) changes with them.
 */
export async function updateResultsSettings(
  db: Db,
  eventId: number,
  userId: number,
  settings: ResultsSettings,
): Promise<void> {
  await db.transaction(async (trx) => {
    const event: Record<string, unknown> = { updated_at: nowIso() };
    if (settings.published !== undefined) event.results_published = settings.published;
    if (settings.teamSize !== undefined) event.team_size = settings.teamSize;
    await trx('events').where({ id: eventId }).update(event);

    for (const { divisionId, cut } of settings.cuts ?? []) {
      const updated = await trx('divisions')
        .where({ id: divisionId, event_id: eventId })
        .update({ cut_size: cut });
      if (updated === 0) throw badRequest(`Division ${divisionId} is not a division of this event.`);
    }
    for (const { entryId, inTeam } of settings.teams ?? []) {
      const updated = await trx('entries')
        .where({ id: entryId, event_id: eventId })
        .update({ in_team: inTeam });
      if (updated === 0) throw badRequest(`Entry ${entryId} is not on this event's entry list.`);
    }
    await audit(trx, { userId, eventId, action: 'results.settings', details: settings });
  });
}
