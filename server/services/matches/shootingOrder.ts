import type { AlternateFrom } from '../../../src/core';
import { alternates } from '../../../src/core/matches';
import type { MatchFirstShooterArgs } from '../../../src/contract/matches';
import { roundName } from '../../../src/ui/bracketLabels';
import type { Db } from '../../db';
import { rolesInEvent } from '../../auth/eventRoles';
import { conflict, forbidden, notFound } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { findMatch, requireBothSides, requireOpen } from './matchRows';
import { writerSlot } from './matchWriters';

/*
 * Alternate shooting in the finals: the organizer sets which matches of a bracket alternate; a
 * writer of the match or a judge records who shoots first in the first end. The order after that
 * follows from the score (core `nextArrow`), so nothing else is stored.
 */

/** Those of these matches with arrows on their card or a writer's record (of one end, when given). */
async function matchesWithArrows(db: Db, matchIds: number[], endIndex?: number): Promise<Set<number>> {
  const oneEnd = endIndex === undefined ? {} : { end_index: endIndex };
  const [ends, writes] = await Promise.all([
    db('match_ends').whereIn('match_id', matchIds).where(oneEnd).distinct('match_id') as Promise<
      { match_id: number }[]
    >,
    db('match_end_writes')
      .whereIn('match_id', matchIds)
      .where(oneEnd)
      .select('match_id', 'a_json', 'b_json') as Promise<
      { match_id: number; a_json: string; b_json: string }[]
    >,
  ]);
  // A record emptied by undoing every arrow holds no arrow.
  const written = writes.filter((w) => w.a_json !== '[]' || w.b_json !== '[]');
  return new Set([...ends, ...written].map((r) => r.match_id));
}

/**
 * The organizer sets which matches of a bracket alternate. Refused when that would change how an
 * open match already under way is shot: its order cannot change half-way.
 */
export async function setBracketAlternation(
  db: Db,
  eventId: number,
  bracketId: number,
  alternate: AlternateFrom,
  userId: number,
): Promise<void> {
  const bracket = (await db('brackets')
    .where({ id: bracketId, event_id: eventId })
    .first('alternate', 'size')) as { alternate: AlternateFrom; size: number } | undefined;
  if (!bracket) throw notFound('That bracket does not exist in this event.');
  const rounds = Math.log2(bracket.size);
  const open = (await db('matches')
    .where({ bracket_id: bracketId })
    .whereNull('winner_side')
    .select('id', 'round', 'bronze')) as { id: number; round: number; bronze: number | boolean }[];
  const changing = open.filter(
    (m) => alternates(bracket.alternate, m, rounds) !== alternates(alternate, m, rounds),
  );
  const underWay = await matchesWithArrows(
    db,
    changing.map((m) => m.id),
  );
  const started = changing.find((m) => underWay.has(m.id));
  if (started) {
    const name = started.bronze
      ? 'The bronze match'
      : `A match of the ${roundName(started.round, rounds).toLowerCase()}`;
    throw conflict(
      `${name} is under way: whether it is shot alternately cannot change now. Change the setting before its first arrow, or after it is signed.`,
    );
  }
  await db('brackets').where({ id: bracketId }).update({ alternate });
  await audit(db, { userId, eventId, action: 'bracket.alternate', details: { bracketId, alternate } });
}

/**
 * Who shoots first in the first end of an alternating match: recorded by a writer of the match or
 * a judge of the event, until end 1 has an arrow (then the order is under way). The same choice
 * again changes nothing; another one before end 1 corrects it.
 */
export async function recordFirstShooter(db: Db, args: MatchFirstShooterArgs, userId: number): Promise<void> {
  const match = await findMatch(db, args.eventId, args.matchId);
  const judge = (await rolesInEvent(db, userId, args.eventId)).includes('judge');
  if (!judge && !(await writerSlot(db, match.id, userId)))
    throw forbidden(
      'Only the writers of this match (after joining it with its code) or a judge of the event record who shoots first.',
    );
  requireOpen(match);
  await requireBothSides(db, match.id);
  const bracket = (await db('brackets').where({ id: match.bracket_id }).first('alternate')) as {
    alternate: AlternateFrom;
  };
  if (!alternates(bracket.alternate, match, Math.log2(match.size)))
    throw conflict(
      'This match is not shot alternately: both archers shoot their end at once. The organizer sets which matches alternate.',
    );
  if ((await matchesWithArrows(db, [match.id], 0)).size > 0)
    throw conflict('End 1 of this match has arrows already: who shoots first cannot change any more.');
  await db('matches')
    .where({ id: match.id })
    .update({ first_shooter: args.side, first_shooter_by: userId, first_shooter_at: nowIso() });
}
