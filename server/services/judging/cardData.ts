import { endView, endsOfRound, type EndView, type RoundDefinition } from '../../../src/core';
import type { Position } from '../../../src/contract/events';
import type { Db } from '../../db';
import { forbidden, notFound } from '../../http/httpError';
import type { CardSignatureRow } from '../sync/fieldRows';
import { paperWords } from '../signing/cardContent';
import type { CardFacts } from '../signing/cardContent';
import { loadEndRecords, type StoredEnd } from './endRecords';

/** A card signature with the name it shows (the archer's, for one made on paper) and its paper label. */
export type LoadedCardSignature = CardSignatureRow & { id: number; name: string; onPaper?: string };

/**
 * One archer's card in a session, as stored now: what the card views, the PDF and verification
 * read. `StoredCard` is any archer's card, also one no longer on a target (verification still
 * checks it); `CardData` is the card of an archer on a target.
 */
export type StoredCard<Target = number | null, Place = Position | null> = {
  event: { id: number; name: string; venue: string; timeZone: string; startsOn: string; endsOn: string };
  session: { id: number; name: string; startsAt: string; closed: boolean };
  archer: {
    entryId: number;
    name: string;
    club: string;
    email: string | null;
    userId: number | null;
    division: string;
    targetNumber: Target;
    position: Place;
  };
  round: RoundDefinition;
  ends: { endIndex: number; distanceIndex: number; view: EndView; stored: StoredEnd }[];
  /** Current (not superseded) card signatures by role. */
  signatures: Partial<Record<'archer' | 'scorer', LoadedCardSignature>>;
  /** The card as its signatures cover it: every end's current judge signature. */
  facts: CardFacts;
};
export type CardData = StoredCard<number, Position>;

export const isFinal = (card: StoredCard): boolean => !!card.signatures.archer && !!card.signatures.scorer;

type CardRow = {
  event_id: number;
  event_name: string;
  venue: string;
  time_zone: string;
  starts_on: string;
  ends_on: string;
  session_name: string;
  starts_at: string;
  closed_at: string | null;
  name: string;
  club: string;
  email: string | null;
  user_id: number | null;
  division: string;
  target_number: number | null;
  position: Position | null;
  round_json: string | null;
};

/** Reads an archer's card; 404 when the archer has no place (or no round) in the session. */
export async function loadCard(db: Db, sessionId: number, entryId: number): Promise<CardData> {
  const card = await readCard(db, sessionId, entryId);
  const { targetNumber, position } = card.archer;
  if (targetNumber === null || position === null) throw notFound('That archer has no card in this session.');
  return { ...card, archer: { ...card.archer, targetNumber, position } };
}

/**
 * Reads an archer's card in a session of the archer's event, whether or not the archer still has
 * a target there; 404 when the entry is not of that event or its division has no round in it.
 */
export async function readCard(db: Db, sessionId: number, entryId: number): Promise<StoredCard> {
  const row = (await db('event_sessions as s')
    .join('events as ev', 'ev.id', 's.event_id')
    .join('entries as e', (j) => j.on('e.event_id', 's.event_id').andOnVal('e.id', entryId))
    .join('divisions as d', 'd.id', 'e.division_id')
    .leftJoin('target_assignments as ta', (j) => j.on('ta.session_id', 's.id').andOn('ta.entry_id', 'e.id'))
    .leftJoin('session_divisions as sd', (j) =>
      j.on('sd.session_id', 's.id').andOn('sd.division_id', 'e.division_id'),
    )
    .where('s.id', sessionId)
    .first(
      'ev.id as event_id',
      'ev.name as event_name',
      'ev.venue',
      'ev.time_zone',
      'ev.starts_on',
      'ev.ends_on',
      's.name as session_name',
      's.starts_at',
      's.closed_at',
      'e.name',
      'e.club',
      'e.email',
      'e.user_id',
      'd.name as division',
      'ta.target_number',
      'ta.position',
      'sd.round_json',
    )) as CardRow | undefined;
  if (!row) throw notFound('That archer has no card in this session.');
  if (!row.round_json)
    throw notFound(
      `${row.name}'s division has no round in the session "${row.session_name}", so there is no card.`,
    );
  const round = JSON.parse(row.round_json) as RoundDefinition;

  const stored = await loadEndRecords(db, sessionId, [entryId]);
  const ends = endsOfRound(round).map((end) => ({
    endIndex: end.index,
    distanceIndex: end.distanceIndex,
    view: endView(stored.facts(entryId, end.index)),
    stored: stored.end(entryId, end.index),
  }));

  const signatures: CardData['signatures'] = {};
  const signed = (await db('card_signatures as c')
    .join('users as u', 'u.id', 'c.user_id')
    .where({ 'c.session_id': sessionId, 'c.entry_id': entryId })
    .whereNull('c.superseded_at')
    .orderBy('c.id')
    .select('c.*', 'u.display_name as signer')) as (CardSignatureRow & { id: number; signer: string })[];
  for (const { signer, ...s } of signed)
    signatures[s.role] = s.on_paper
      ? { ...s, name: row.name, onPaper: paperWords(signer) }
      : { ...s, name: signer };

  const place =
    row.target_number === null || row.position === null
      ? null
      : { targetNumber: row.target_number, position: row.position };
  const card: StoredCard = {
    event: {
      id: row.event_id,
      name: row.event_name,
      venue: row.venue,
      timeZone: row.time_zone,
      startsOn: row.starts_on,
      endsOn: row.ends_on,
    },
    session: { id: sessionId, name: row.session_name, startsAt: row.starts_at, closed: !!row.closed_at },
    archer: {
      entryId,
      name: row.name,
      club: row.club,
      email: row.email,
      userId: row.user_id,
      division: row.division,
      targetNumber: row.target_number,
      position: row.position,
    },
    round,
    ends,
    signatures,
    facts: {
      eventId: row.event_id,
      sessionId,
      entryId,
      event: { name: row.event_name, startsOn: row.starts_on, endsOn: row.ends_on },
      session: { name: row.session_name, startsAt: row.starts_at },
      archer: { name: row.name, club: row.club, division: row.division },
      place,
      round,
      ends: ends.map(
        ({ stored: s }) => s.signature && { arrows: s.signature.arrows, hash: s.signature.contentHash },
      ),
    },
  };
  return card;
}

/** How the person stands to a card: the archer, a member of the target's group, staff — or no one. */
export async function cardRelation(
  db: Db,
  userId: number,
  card: CardData,
): Promise<{ archer: boolean; task: string | undefined; staff: boolean; judge: boolean }> {
  const member = await db('target_members')
    .where({ session_id: card.session.id, target_number: card.archer.targetNumber, user_id: userId })
    .first('task');
  const roles = (await db('event_roles')
    .where({ event_id: card.event.id, user_id: userId })
    .whereIn('role', ['organizer', 'judge'])
    .pluck('role')) as string[];
  return {
    archer: card.archer.userId === userId,
    task: member?.task,
    staff: roles.length > 0,
    judge: roles.includes('judge'),
  };
}

/** The archer, the target's group, the judges and the organizers may see a card; nobody else. */
export async function requireCardViewer(db: Db, userId: number, card: CardData) {
  const relation = await cardRelation(db, userId, card);
  if (!relation.archer && !relation.task && !relation.staff)
    throw forbidden(
      `Only ${card.archer.name}, the group of target ${card.archer.targetNumber}, the judges and the organizers can see this card.`,
    );
  return relation;
}
