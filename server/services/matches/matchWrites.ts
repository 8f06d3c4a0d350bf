import type { MatchWriteArgs } from '../../../src/contract/matches';
import type { Db } from '../../db';
import { badRequest, conflict, forbidden } from '../../http/httpError';
import { nowIso } from '../../time';
import { recountEnds } from './countEnds';
import { findMatch, requireBothSides, requireOpen, type EndRow } from './matchRows';
import { writerSlot } from './matchWriters';

/*
 * Two writers score a match at its target, like a qualification end: each writer's record of an
 * end (both lines' arrows) is kept apart; the core's cross-check compares them arrow by arrow;
 * an end both wrote alike, complete, counts on the match card (the core's countedEnds, in order).
 * A mismatch waits for the match's judge, whose end (`match.end`) settles it and closes it to the
 * writers; so does the judge's signature on an end (`match.endSign`).
 */

/** Why a writer can no longer change an end, in words; null while they can. */
async function closedToWriters(db: Db, matchId: number, endIndex: number): Promise<string | null> {
  const n = endIndex + 1;
  const stored = (await db('match_ends')
    .where({ match_id: matchId, end_index: endIndex })
    .first('source', 'signed_at')) as Pick<EndRow, 'source' | 'signed_at'> | undefined;
  if (stored?.signed_at) return `The judge signed end ${n} of this match; ask the judge.`;
  if (stored?.source === 'judge')
    return `The judge settled end ${n} of this match; only the judge can change it now.`;
  // A changed end would leave the match no longer level behind the shoot-off the judge recorded.
  const shot = await db('match_shootoff_arrows').where({ match_id: matchId }).first('id');
  if (shot) return 'The judge recorded the shoot-off of this match: its ends are closed; ask the judge.';
  return null;
}

/** A writer's record of one end of a match (replacing their previous record of it). */
export async function recordMatchWrite(db: Db, args: MatchWriteArgs, userId: number): Promise<void> {
  const match = await findMatch(db, args.eventId, args.matchId);
  const slot = await writerSlot(db, match.id, userId);
  if (!slot)
    throw forbidden(
      'Only the two writers of this match can score it: its archers or named scorers, after joining it with its code.',
    );
  requireOpen(match);
  await requireBothSides(db, match.id);
  const n = args.endIndex + 1;
  const closed = await closedToWriters(db, match.id, args.endIndex);
  if (closed) throw conflict(closed);
  const own = (await db('match_end_writes')
    .where({ match_id: match.id, slot })
    .select('end_index', 'revision')) as { end_index: number; revision: number }[];
  if (args.endIndex > 0 && !own.some((w) => w.end_index === args.endIndex - 1))
    throw badRequest(`Write end ${n - 1} of this match before end ${n}.`);
  const previous = own.find((w) => w.end_index === args.endIndex);
  const row = {
    a_json: JSON.stringify(args.a),
    b_json: JSON.stringify(args.b),
    user_id: userId,
    revision: (previous?.revision ?? 0) + 1,
    written_at: nowIso(),
  };
  await db('match_end_writes')
    .insert({ match_id: match.id, end_index: args.endIndex, slot, ...row })
    .onConflict(['match_id', 'end_index', 'slot'])
    .merge(row);
  await recountEnds(db, match, userId);
}
