import type { MatchPadDto, MatchScorerBody } from '../../../src/contract/matches';
import { roundName } from '../../../src/ui/bracketLabels';
import type { Db } from '../../db';
import { badRequest, conflict, forbidden, notFound } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { eventBrackets } from './bracketView';
import { findMatch, requireBothSides, requireOpen } from './matchRows';

/*
 * The two writers of a match at its target: the archer of each line, or the scorer the organizer
 * named for that line. Each joins with the match's join code; only those who joined write to it.
 */

type Slot = 1 | 2;
const SIDE_OF_SLOT = { 1: 'a', 2: 'b' } as const;

/** Who may write for each line: a named scorer, or else the line's archers (by account). */
async function writersAllowed(db: Db, matchId: number): Promise<Record<Slot, number[]>> {
  const [scorers, archers] = await Promise.all([
    db('match_scorers').where({ match_id: matchId }).select('slot', 'user_id') as Promise<
      { slot: Slot; user_id: number }[]
    >,
    db('match_sides as s')
      .join('match_side_archers as sa', 'sa.match_side_id', 's.id')
      .join('entries as e', 'e.id', 'sa.entry_id')
      .where({ 's.match_id': matchId })
      .whereNotNull('e.user_id')
      .select('s.side', 'e.user_id') as Promise<{ side: 'a' | 'b'; user_id: number }[]>,
  ]);
  const forSlot = (slot: Slot) => {
    const named = scorers.find((s) => Number(s.slot) === slot);
    if (named) return [named.user_id];
    return archers.filter((a) => a.side === SIDE_OF_SLOT[slot]).map((a) => a.user_id);
  };
  return { 1: forSlot(1), 2: forSlot(2) };
}

/** The organizer names a scorer for one line (by the email of their account), or takes the name back. */
export async function setMatchScorer(
  db: Db,
  eventId: number,
  matchId: number,
  body: MatchScorerBody,
  userId: number,
): Promise<void> {
  const match = await findMatch(db, eventId, matchId);
  requireOpen(match);
  await db.transaction(async (trx) => {
    await trx('match_scorers').where({ match_id: matchId, slot: body.slot }).delete();
    if (body.email !== null) {
      const user = (await trx('users').where({ email: body.email }).first('id')) as
        { id: number } | undefined;
      if (!user)
        throw badRequest(
          `No account has the email ${body.email}. Ask the scorer to create an account first.`,
        );
      await trx('match_scorers').insert({ match_id: matchId, slot: body.slot, user_id: user.id });
    }
    // Whoever wrote for that line before no longer may.
    await trx('match_writers').where({ match_id: matchId, slot: body.slot }).delete();
    await audit(trx, { userId, eventId, action: 'match.scorer', details: { matchId, slot: body.slot } });
  });
}

/** Joins a match's target as its writer 1 or 2, by the match's join code. */
export async function joinMatch(db: Db, userId: number, code: string): Promise<MatchPadDto> {
  const found = await db.transaction(async (trx) => {
    const row = (await trx('match_join_codes as c')
      .join('matches as m', 'm.id', 'c.match_id')
      .join('brackets as b', 'b.id', 'm.bracket_id')
      .where({ 'c.code': code })
      .first('m.id as matchId', 'b.event_id as eventId')) as { matchId: number; eventId: number } | undefined;
    if (!row) throw notFound(`No match has the join code ${code}. Check it with the organizer or judge.`);
    const match = await findMatch(trx, row.eventId, row.matchId);
    requireOpen(match);
    await requireBothSides(trx, row.matchId);
    const allowed = await writersAllowed(trx, row.matchId);
    const slot = ([1, 2] as const).find((s) => allowed[s].includes(userId));
    if (!slot)
      throw forbidden(
        'Only the two archers of this match, or the scorers the organizer named for it, can keep its card.',
      );
    const holder = (await trx('match_writers').where({ match_id: row.matchId, slot }).first('user_id')) as
      { user_id: number } | undefined;
    if (!holder) {
      await trx('match_writers').insert({
        match_id: row.matchId,
        slot,
        user_id: userId,
        joined_at: nowIso(),
      });
    } else if (holder.user_id !== userId) {
      throw conflict(`Writer ${slot} of this match is already kept by someone else. Ask the organizer.`);
    }
    return row;
  });
  return matchPad(db, found.eventId, found.matchId, userId);
}

/** The slot a person keeps on a match, if they joined it. */
export async function writerSlot(db: Db, matchId: number, userId: number): Promise<Slot | null> {
  const row = (await db('match_writers').where({ match_id: matchId, user_id: userId }).first('slot')) as
    { slot: Slot } | undefined;
  return row ? (Number(row.slot) as Slot) : null;
}

/** What a writer's phone shows for one match; only its writers may read it this way. */
export async function matchPad(
  db: Db,
  eventId: number,
  matchId: number,
  userId: number,
): Promise<MatchPadDto> {
  await findMatch(db, eventId, matchId);
  const slot = await writerSlot(db, matchId, userId);
  if (!slot) throw forbidden('Join this match with its join code to keep its card.');
  const event = (await db('events').where({ id: eventId }).first('name')) as { name: string };
  const bracket = (await eventBrackets(db, eventId)).find((b) => b.matches.some((m) => m.id === matchId))!;
  const match = bracket.matches.find((m) => m.id === matchId)!;
  const own = (await db('match_sides as s')
    .join('match_side_archers as sa', 'sa.match_side_id', 's.id')
    .join('entries as e', 'e.id', 'sa.entry_id')
    .where({ 's.match_id': matchId, 'e.user_id': userId })
    .first('e.id')) as { id: number } | undefined;
  return {
    eventId,
    eventName: event.name,
    divisionName: bracket.divisionName,
    roundName: match.bronze ? 'Bronze match' : roundName(match.round, bracket.rounds),
    format: bracket.format,
    slot,
    ownEntryId: own?.id ?? null,
    match,
  };
}
