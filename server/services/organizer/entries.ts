import { archerKey } from '../../../src/contract/entryImport';
import type { Entry, EntryInput, EntryList, UpdateEntryInput } from '../../../src/contract/events';
import type { Db } from '../../db';
import { refuseOverLimit } from './eventLimits';
import { conflict, notFound } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { grantRole } from '../accounts';
import { findDivision } from './divisions';
import { scoresExist } from '../fieldData';

type EntryRow = {
  id: number;
  event_id: number;
  division_id: number;
  user_id: number | null;
  name: string;
  club: string;
  email: string | null;
};

export async function listEntries(db: Db, eventId: number): Promise<EntryList> {
  const rows = await db('entries')
    .join('divisions', 'divisions.id', 'entries.division_id')
    .where('entries.event_id', eventId)
    .orderBy([{ column: 'divisions.id' }, { column: 'entries.name' }])
    .select('entries.*', 'divisions.name as division_name', 'divisions.bow_style');
  return {
    entries: rows.map((r) => ({
      id: r.id,
      name: r.name,
      club: r.club,
      email: r.email ?? '',
      divisionId: r.division_id,
      divisionName: r.division_name,
      bowStyle: r.bow_style,
      className: r.class_name,
      linked: r.user_id !== null,
    })),
  };
}

async function findEntry(db: Db, eventId: number, entryId: number): Promise<EntryRow> {
  const row = (await db('entries').where({ id: entryId, event_id: eventId }).first()) as EntryRow | undefined;
  if (!row) throw notFound('That entry does not exist in this event.');
  return row;
}

async function refuseDuplicate(
  db: Db,
  eventId: number,
  name: string,
  divisionId: number,
  exceptId?: number,
): Promise<void> {
  const key = archerKey(name, divisionId);
  const rows = await db('entries').where({ event_id: eventId, division_id: divisionId }).select('id', 'name');
  if (rows.some((r) => r.id !== exceptId && archerKey(r.name, divisionId) === key)) {
    const division = await db('divisions').where({ id: divisionId }).first('name');
    throw conflict(`${name} is already entered in ${division?.name ?? 'this division'}.`);
  }
}

/** A verified account with the entry's address: the entry is theirs, and they become an archer in the event. */
export async function linkEntryToAccount(
  db: Db,
  entry: { id: number; event_id: number; email: string | null },
): Promise<void> {
  if (!entry.email) return;
  const user = await db('users').where({ email: entry.email }).whereNotNull('email_verified_at').first('id');
  if (!user) return;
  await db('entries').where({ id: entry.id }).update({ user_id: user.id });
  await grantRole(db, entry.event_id, user.id, 'archer');
}

/** Takes the archer role back when the person has no entry left in the event. */
async function dropArcherRoleIfNoEntries(db: Db, eventId: number, userId: number | null): Promise<void> {
  if (!userId) return;
  const other = await db('entries').where({ event_id: eventId, user_id: userId }).first('id');
  if (!other) await db('event_roles').where({ event_id: eventId, user_id: userId, role: 'archer' }).delete();
}

const toEntry = async (db: Db, eventId: number, id: number): Promise<Entry> =>
  (await listEntries(db, eventId)).entries.find((e) => e.id === id)!;

export async function createEntry(
  db: Db,
  userId: number,
  eventId: number,
  input: EntryInput,
): Promise<Entry> {
  await findDivision(db, eventId, input.divisionId);
  await refuseDuplicate(db, eventId, input.name, input.divisionId);
  await refuseOverLimit(db, eventId, 'entries');
  const id = await db.transaction(async (trx) => {
    const [row] = await trx('entries')
      .insert({
        event_id: eventId,
        division_id: input.divisionId,
        name: input.name,
        club: input.club,
        email: input.email || null,
        class_name: input.className,
        created_at: nowIso(),
      })
      .returning('id');
    const entryId = (row as { id: number }).id;
    await linkEntryToAccount(trx, { id: entryId, event_id: eventId, email: input.email || null });
    await audit(trx, {
      userId,
      eventId,
      action: 'entry.created',
      details: { entryId, name: input.name, divisionId: input.divisionId },
    });
    return entryId;
  });
  return toEntry(db, eventId, id);
}

export async function updateEntry(
  db: Db,
  userId: number,
  eventId: number,
  entryId: number,
  input: UpdateEntryInput,
): Promise<Entry> {
  const current = await findEntry(db, eventId, entryId);
  const divisionId = input.divisionId ?? current.division_id;
  const name = input.name ?? current.name;
  if (input.divisionId !== undefined) await findDivision(db, eventId, input.divisionId);
  await refuseDuplicate(db, eventId, name, divisionId, entryId);
  await db.transaction(async (trx) => {
    const changes: Record<string, unknown> = { name, division_id: divisionId };
    if (input.club !== undefined) changes.club = input.club;
    if (input.className !== undefined) changes.class_name = input.className;
    const emailChanged = input.email !== undefined && (input.email || null) !== current.email;
    if (emailChanged) {
      changes.email = input.email || null;
      changes.user_id = null;
    }
    await trx('entries').where({ id: entryId }).update(changes);
    if (emailChanged) {
      await dropArcherRoleIfNoEntries(trx, eventId, current.user_id);
      await linkEntryToAccount(trx, { id: entryId, event_id: eventId, email: input.email || null });
    }
    await audit(trx, { userId, eventId, action: 'entry.updated', details: { entryId, ...input } });
  });
  return toEntry(db, eventId, entryId);
}

export async function deleteEntry(db: Db, userId: number, eventId: number, entryId: number): Promise<void> {
  const current = await findEntry(db, eventId, entryId);
  if (await scoresExist(db, { entryIds: [entryId] })) {
    throw conflict(
      `${current.name} already has scored ends, so the entry stays on the list with its scores.`,
    );
  }
  await db.transaction(async (trx) => {
    // Its target assignments go with it (ON DELETE CASCADE).
    await trx('entries').where({ id: entryId }).delete();
    await dropArcherRoleIfNoEntries(trx, eventId, current.user_id);
    await audit(trx, { userId, eventId, action: 'entry.deleted', details: { entryId, name: current.name } });
  });
}
