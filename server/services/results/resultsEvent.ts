import type { Db } from '../../db';
import { RESULTS_NOT_PUBLISHED } from '../../../src/contract/resultsAccess';
import { HttpError, forbidden, notFound } from '../../http/httpError';

/** What the results of an event need to know about the event itself. */
export type ResultsEvent = {
  id: number;
  name: string;
  venue: string;
  published: boolean;
  teamSize: number;
  updatedAt: string;
};

export async function findResultsEvent(db: Db, eventId: number): Promise<ResultsEvent> {
  const row = (await db('events')
    .where({ id: eventId })
    .first('id', 'name', 'venue', 'results_published', 'team_size', 'updated_at')) as
    | {
        id: number;
        name: string;
        venue: string;
        results_published: number | boolean;
        team_size: number;
        updated_at: string;
      }
    | undefined;
  if (!row) throw notFound('That event does not exist.');
  return {
    id: row.id,
    name: row.name,
    venue: row.venue,
    published: !!row.results_published,
    teamSize: row.team_size,
    updatedAt: row.updated_at,
  };
}

/**
 * Published results are for everyone. Until then only the event's organizers, judges and the
 * archers on its entry list see them.
 */
export async function requireResultsViewer(
  db: Db,
  event: ResultsEvent,
  userId: number | undefined,
): Promise<void> {
  if (event.published) return;
  // Not named: anyone can ask for any event's number, and an unpublished event's name is not theirs.
  const message = 'The results of this event are not published yet.';
  if (userId === undefined)
    throw new HttpError(
      403,
      RESULTS_NOT_PUBLISHED,
      `${message} Sign in if you organize, judge or shoot in it.`,
    );
  const [role, entry] = await Promise.all([
    db('event_roles')
      .where({ event_id: event.id, user_id: userId })
      .whereIn('role', ['organizer', 'judge'])
      .first('id'),
    db('entries').where({ event_id: event.id, user_id: userId }).first('id'),
  ]);
  if (!role && !entry)
    throw forbidden(`${message} Only its organizers, judges and archers can see them now.`);
}

/** The results printout: for everyone once published, for the event's organizers before that. */
export async function requireResultsPrinter(
  db: Db,
  event: ResultsEvent,
  userId: number | undefined,
): Promise<void> {
  if (event.published) return;
  const message =
    'The results of this event are not published yet; until then only its organizers can print them.';
  if (userId === undefined) throw forbidden(`${message} Sign in if you organize it.`);
  const role = await db('event_roles')
    .where({ event_id: event.id, user_id: userId, role: 'organizer' })
    .first('id');
  if (!role) throw forbidden(message);
}

/**
 * A tag that changes whenever the standings could: any field change of the event (writes,
 * rulings, signatures), a shoot-off arrow, the event's own settings, the entry list or the
 * target assignments. Reading it costs a few indexed lookups, so an unchanged page answers 304
 * without computing anything.
 */
export async function resultsVersion(db: Db, event: ResultsEvent): Promise<string> {
  const sessions = db('event_sessions').where({ event_id: event.id }).select('id');
  const [changes, shootOffs, entries, assignments] = await Promise.all([
    db('changes').where({ event_id: event.id }).max({ v: 'version' }).first(),
    db('shootoff_arrows').whereIn('session_id', sessions).max({ v: 'id' }).first(),
    db('entries').where({ event_id: event.id }).count({ n: 'id' }).max({ v: 'id' }).first(),
    db('target_assignments').whereIn('session_id', sessions).count({ n: 'id' }).max({ v: 'id' }).first(),
  ]);
  const parts = [
    changes?.v,
    shootOffs?.v,
    entries?.n,
    entries?.v,
    assignments?.n,
    assignments?.v,
    event.updatedAt,
  ];
  return parts.map((p) => String(p ?? 0)).join('.');
}
