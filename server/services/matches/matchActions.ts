import { other } from '../../../src/core/matches';
import type { MatchEndBody, MatchShootOffBody, MatchWalkover } from '../../../src/contract/matches';
import type { Db } from '../../db';
import { badRequest, conflict } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { advance } from './advance';
import { recountEnds } from './countEnds';
import { signCountedEnds } from './endSignatures';
import { findMatch, loadRecords, readMatch, requireBothSides, requireOpen, type MatchRow } from './matchRows';

/*
 * What judges and organizers do to one match. Every change is read by the core first, so a card
 * the rules cannot produce (an end after the match was won, a shoot-off before it is level) is
 * refused with the core's reason and nothing is stored.
 */

async function openMatch(db: Db, eventId: number, matchId: number): Promise<MatchRow> {
  const match = await findMatch(db, eventId, matchId);
  requireOpen(match);
  await requireBothSides(db, matchId);
  return match;
}

/** A judge records (or corrects, or settles the writers' mismatch on, until the match is signed) one end of both sides. */
export async function recordMatchEnd(
  db: Db,
  eventId: number,
  matchId: number,
  endIndex: number,
  body: MatchEndBody,
  userId: number,
): Promise<void> {
  const match = await openMatch(db, eventId, matchId);
  const record = (await loadRecords(db, [matchId])).get(matchId)!;
  if (endIndex > record.ends.length) {
    throw badRequest(`Record end ${record.ends.length + 1} of this match first.`);
  }
  const ends = [...record.ends];
  ends[endIndex] = body;
  readMatch(match.format, { ends, shootOff: record.shootOff });
  const row = {
    a_json: JSON.stringify(body.a),
    b_json: JSON.stringify(body.b),
    // The judge's end settles any mismatch of the writers and closes the end to them.
    source: 'judge',
    recorded_by: userId,
    recorded_at: nowIso(),
    // The judge's own correction of a signed end replaces it: the end waits for a new signature.
    signed_by: null,
    signed_at: null,
  };
  await db('match_ends')
    .insert({ match_id: matchId, end_index: endIndex, ...row })
    .onConflict(['match_id', 'end_index'])
    .merge(row);
  // Ends the writers agree on after an end that stopped the count count again once it is settled.
  await recountEnds(db, match, userId);
}

/** A judge records the shoot-off arrow of each side (again, to add a measurement or "closer"). */
export async function recordMatchShootOff(
  db: Db,
  eventId: number,
  matchId: number,
  body: MatchShootOffBody,
  userId: number,
): Promise<void> {
  const match = await openMatch(db, eventId, matchId);
  const record = (await loadRecords(db, [matchId])).get(matchId)!;
  readMatch(match.format, { ends: record.ends, shootOff: body });
  await db.transaction(async (trx) => {
    for (const side of ['a', 'b'] as const) {
      const arrow = body[side];
      const row = {
        value: arrow.value,
        distance_mm: arrow.distanceMm ?? null,
        closer: arrow.closer,
        recorded_by: userId,
        recorded_at: nowIso(),
      };
      await trx('match_shootoff_arrows')
        .insert({ match_id: matchId, side, ...row })
        .onConflict(['match_id', 'side'])
        .merge(row);
    }
  });
}

/**
 * Stores a match's winner only while it has none: a second signature or walkover racing this one
 * (both checked the match open before either wrote) is refused, and its transaction undone.
 */
async function decideOnce(trx: Db, matchId: number, decision: Record<string, unknown>): Promise<void> {
  const decided = await trx('matches').where({ id: matchId }).whereNull('winner_side').update(decision);
  if (decided === 0) throw conflict('This match was decided a moment ago; it cannot change any more.');
}

/** A judge signs a decided match (and its counted ends not signed yet): its winner is stored and the bracket moves on. */
export async function signMatch(db: Db, eventId: number, matchId: number, userId: number): Promise<void> {
  const match = await openMatch(db, eventId, matchId);
  const state = readMatch(match.format, (await loadRecords(db, [matchId])).get(matchId)!);
  if (!state.winner) {
    const waiting = {
      end: 'more ends are to shoot',
      'shoot-off': 'the shoot-off arrows are not recorded',
      judge: 'the shoot-off arrows are level: record the measured distance or which arrow is closer',
      none: 'it has no winner',
    }[state.next];
    throw conflict(`This match is not decided yet: ${waiting}.`);
  }
  await db.transaction(async (trx) => {
    await decideOnce(trx, matchId, {
      winner_side: state.winner,
      decided_by: state.decidedBy,
      signed_by: userId,
      signed_at: nowIso(),
    });
    await signCountedEnds(trx, matchId, state.ends.length, userId);
    await advance(trx, match, state.winner!);
    await audit(trx, { userId, eventId, action: 'match.sign', details: { matchId, winner: state.winner } });
  });
}

/** The organizer records a withdrawal or a no-show: the other side goes through. */
export async function recordWalkover(
  db: Db,
  eventId: number,
  matchId: number,
  body: MatchWalkover,
  userId: number,
): Promise<void> {
  const match = await openMatch(db, eventId, matchId);
  const winner = other(body.side);
  await db.transaction(async (trx) => {
    await decideOnce(trx, matchId, {
      winner_side: winner,
      decided_by: body.reason,
      signed_by: userId,
      signed_at: nowIso(),
    });
    await advance(trx, match, winner);
    await audit(trx, { userId, eventId, action: 'match.walkover', details: { matchId, ...body } });
  });
}

/** The organizer places a match on a target (null takes it off), or moves it, until it is decided. */
export async function placeMatch(
  db: Db,
  eventId: number,
  matchId: number,
  targetNumber: number | null,
): Promise<void> {
  const match = await findMatch(db, eventId, matchId);
  requireOpen(match);
  if (targetNumber !== null) {
    const taken = (await db('matches as m')
      .join('brackets as b', 'b.id', 'm.bracket_id')
      .where({ 'b.event_id': eventId, 'm.target_number': targetNumber })
      .whereNull('m.winner_side')
      .whereNot('m.id', matchId)
      .first('m.id')) as { id: number } | undefined;
    if (taken) throw conflict(`Target ${targetNumber} already holds another open match.`);
  }
  await db('matches').where({ id: matchId }).update({ target_number: targetNumber });
}
