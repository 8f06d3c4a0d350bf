import type { EventRole } from '../../../src/contract/auth';
import type {
  CreateEventInput,
  EventDetails,
  EventList,
  EventSummary,
  UpdateEventInput,
} from '../../../src/contract/events';
import type { Db } from '../../db';
import { badRequest, notFound } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { grantRole } from '../accounts';
import { listDivisions } from './divisions';
import { listSessions } from './sessions';

type EventRow = {
  id: number;
  name: string;
  venue: string;
  starts_on: string;
  ends_on: string;
  time_zone: string;
};

export const toEventDetails = (row: EventRow): EventDetails => ({
  id: row.id,
  name: row.name,
  venue: row.venue,
  startsOn: row.starts_on,
  endsOn: row.ends_on,
  timeZone: row.time_zone,
});

export async function loadEvent(db: Db, eventId: number): Promise<EventRow> {
  const row = (await db('events').where({ id: eventId }).first()) as EventRow | undefined;
  if (!row) throw notFound('That event does not exist.');
  return row;
}

/** Creates the event; the person who creates it becomes its first organizer. */
export async function createEvent(db: Db, userId: number, input: CreateEventInput): Promise<EventDetails> {
  const at = nowIso();
  const eventId = await db.transaction(async (trx) => {
    const [row] = await trx('events')
      .insert({
        name: input.name,
        venue: input.venue,
        starts_on: input.startsOn,
        ends_on: input.endsOn,
        time_zone: input.timeZone,
        created_by: userId,
        created_at: at,
        updated_at: at,
      })
      .returning('id');
    const id = (row as { id: number }).id;
    await grantRole(trx, id, userId, 'organizer');
    await audit(trx, { userId, eventId: id, action: 'event.created', details: { name: input.name } });
    return id;
  });
  return toEventDetails(await loadEvent(db, eventId));
}

export async function updateEvent(
  db: Db,
  userId: number,
  eventId: number,
  input: UpdateEventInput,
): Promise<EventDetails> {
  const current = await loadEvent(db, eventId);
  const startsOn = input.startsOn ?? current.starts_on;
  const endsOn = input.endsOn ?? current.ends_on;
  if (endsOn < startsOn) {
    throw badRequest('The last day cannot be before the first day.', [
      { path: 'endsOn', message: 'The last day cannot be before the first day.' },
    ]);
  }
  const changes: Record<string, string> = {};
  if (input.name !== undefined) changes.name = input.name;
  if (input.venue !== undefined) changes.venue = input.venue;
  if (input.startsOn !== undefined) changes.starts_on = input.startsOn;
  if (input.endsOn !== undefined) changes.ends_on = input.endsOn;
  if (input.timeZone !== undefined) changes.time_zone = input.timeZone;
  await db('events')
    .where({ id: eventId })
    .update({ ...changes, updated_at: nowIso() });
  await audit(db, { userId, eventId, action: 'event.updated', details: changes });
  return toEventDetails(await loadEvent(db, eventId));
}

/** The events a person holds any role in, newest first, with their roles. */
export async function listEventsFor(db: Db, userId: number): Promise<EventList> {
  const rows = await db('event_roles')
    .join('events', 'events.id', 'event_roles.event_id')
    .where('event_roles.user_id', userId)
    .orderBy([
      { column: 'events.starts_on', order: 'desc' },
      { column: 'events.id', order: 'desc' },
    ])
    .select('events.*', 'event_roles.role as role');
  const byId = new Map<number, EventList['events'][number]>();
  for (const row of rows as (EventRow & { role: EventRole })[]) {
    const item = byId.get(row.id) ?? { ...toEventDetails(row), roles: [] };
    item.roles.push(row.role);
    byId.set(row.id, item);
  }
  return { events: [...byId.values()] };
}

async function count(db: Db, table: string, where: Record<string, unknown>): Promise<number> {
  const row = await db(table).where(where).count<{ n: number | string }[]>({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

export async function loadEventSummary(db: Db, eventId: number, myRoles: EventRole[]): Promise<EventSummary> {
  const event = toEventDetails(await loadEvent(db, eventId));
  const divisions = await listDivisions(db, eventId);
  const sessions = await listSessions(db, eventId);
  const pending = await db('email_tokens')
    .where({ event_id: eventId, purpose: 'invite' })
    .whereNull('used_at')
    .where('expires_at', '>', nowIso())
    .count<{ n: number | string }[]>({ n: '*' })
    .first();
  return {
    event,
    myRoles,
    divisions,
    sessions,
    counts: {
      entries: await count(db, 'entries', { event_id: eventId }),
      divisions: divisions.length,
      sessions: sessions.length,
      organizers: await count(db, 'event_roles', { event_id: eventId, role: 'organizer' }),
      judges: await count(db, 'event_roles', { event_id: eventId, role: 'judge' }),
      pendingInvitations: Number(pending?.n ?? 0),
    },
  };
}
