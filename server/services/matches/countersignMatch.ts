import type { Db } from '../../db';
import { conflict, forbidden } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { findMatch } from './matchRows';

/**
 * An archer of a match countersigns its card, like the qualification card: only after the judge
 * signed it (a walkover or bye has no card to sign), once per archer.
 */
export async function countersignMatch(
  db: Db,
  eventId: number,
  matchId: number,
  userId: number,
): Promise<void> {
  const match = await findMatch(db, eventId, matchId);
  const entry = (await db('match_sides as s')
    .join('match_side_archers as sa', 'sa.match_side_id', 's.id')
    .join('entries as e', 'e.id', 'sa.entry_id')
    .where({ 's.match_id': matchId, 'e.user_id': userId })
    .first('e.id')) as { id: number } | undefined;
  if (!entry) throw forbidden('Only the archers of this match countersign its card.');
  if (!match.signed_at || (match.decided_by !== 'score' && match.decided_by !== 'shoot-off'))
    throw conflict(
      'The judge has not signed this match card yet. Countersign it after the judge’s signature.',
    );
  const already = await db('match_countersignatures')
    .where({ match_id: matchId, entry_id: entry.id })
    .first('id');
  if (already) throw conflict('You have already countersigned this match card.');
  await db('match_countersignatures').insert({
    match_id: matchId,
    entry_id: entry.id,
    user_id: userId,
    signed_at: nowIso(),
  });
  await audit(db, { userId, eventId, action: 'match.countersign', details: { matchId, entryId: entry.id } });
}
