import type { Db } from '../db';

/** The field loop's tables that refer to sessions and entries (without cascading deletes). */
const SCORE_TABLES = [
  'end_entries',
  'end_settlements',
  'end_rulings',
  'end_signatures',
  'card_signatures',
  'card_mailings',
] as const;

/**
 * Whether any end has been written in a session, or for given entries. Setup changes that would
 * orphan or re-home scores are refused with a message instead of failing on a foreign key.
 */
export async function scoresExist(
  db: Db,
  where: { sessionId?: number; entryIds?: number[] },
): Promise<boolean> {
  if (where.entryIds && where.entryIds.length === 0) return false;
  for (const table of SCORE_TABLES) {
    const query = db(table).first('id');
    if (where.sessionId !== undefined) query.where({ session_id: where.sessionId });
    if (where.entryIds) query.whereIn('entry_id', where.entryIds);
    if (await query) return true;
  }
  return false;
}
