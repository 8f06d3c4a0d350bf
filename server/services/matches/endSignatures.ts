import type { Db } from '../../db';
import { conflict } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { findMatch, loadRecords, requireBothSides, requireOpen } from './matchRows';

/*
 * The judge signs each set (set system) or end (cumulative) of a match as it comes to count, not
 * only the whole match: a signed end is closed to the writers; the judge's own correction of it
 * (`match.end`) replaces it and drops the signature.
 */

/** Signs the first `count` ends of a match (the ones that count) that are not signed yet. */
export async function signCountedEnds(db: Db, matchId: number, count: number, userId: number): Promise<void> {
  await db('match_ends')
    .where({ match_id: matchId })
    .where('end_index', '<', count)
    .whereNull('signed_at')
    .update({ signed_by: userId, signed_at: nowIso() });
}

/** A judge signs one end of a match that counts, once. */
export async function signMatchEnd(
  db: Db,
  eventId: number,
  matchId: number,
  endIndex: number,
  userId: number,
): Promise<void> {
  const match = await findMatch(db, eventId, matchId);
  requireOpen(match);
  await requireBothSides(db, matchId);
  const n = endIndex + 1;
  const end = (await loadRecords(db, [matchId])).get(matchId)!.ends[endIndex];
  if (!end)
    throw conflict(
      `End ${n} of this match does not count yet: the two writers have not agreed on it (or on an end before it) and no judge has settled it.`,
    );
  const alreadySigned = () => conflict(`End ${n} of this match is already signed.`);
  if (end.signed) throw alreadySigned();
  // Only while still unsigned: a second judge's signature racing this one is refused, never written over it.
  const signed = await db('match_ends')
    .where({ match_id: matchId, end_index: endIndex })
    .whereNull('signed_at')
    .update({ signed_by: userId, signed_at: nowIso() });
  if (signed === 0) throw alreadySigned();
  await audit(db, { userId, eventId, action: 'match.endSign', details: { matchId, endIndex } });
}
