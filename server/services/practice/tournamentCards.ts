import type { TournamentCard } from '../../../src/contract/myCards';
import type { Db } from '../../db';
import { isFinal, readCard } from '../judging/cardData';

/**
 * The person's own tournament cards, for their practice log (read-only there): every session of
 * an entry linked to their account, with the ends a judge signed (what stands on the card), each
 * at its own distance and face. Cards with no signed end yet are left out.
 */
export async function tournamentCards(db: Db, userId: number): Promise<TournamentCard[]> {
  const rows = (await db('entries')
    .join('divisions', 'divisions.id', 'entries.division_id')
    .join('target_assignments', 'target_assignments.entry_id', 'entries.id')
    .where('entries.user_id', userId)
    .select(
      'entries.id as entryId',
      'target_assignments.session_id as sessionId',
      'divisions.bow_style as bowStyle',
    )) as { entryId: number; sessionId: number; bowStyle: TournamentCard['bowStyle'] }[];
  const cards: TournamentCard[] = [];
  for (const row of rows) {
    const card = await readCard(db, row.sessionId, row.entryId);
    const ends = card.ends.flatMap(({ endIndex, distanceIndex }) => {
      const signed = card.facts.ends[endIndex];
      const distance = card.round.distances[distanceIndex];
      return signed && distance
        ? [
            {
              index: endIndex,
              distanceM: distance.distanceM,
              faceId: distance.faceId,
              values: [...signed.arrows],
            },
          ]
        : [];
    });
    if (ends.length === 0) continue;
    cards.push({
      sessionId: row.sessionId,
      entryId: row.entryId,
      eventName: card.event.name,
      sessionName: card.session.name,
      startedAt: card.session.startsAt,
      bowStyle: row.bowStyle,
      final: isFinal(card),
      ends,
    });
  }
  return cards.sort((a, b) => a.startedAt.localeCompare(b.startedAt));
}
