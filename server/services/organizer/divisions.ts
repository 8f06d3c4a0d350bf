import type { BowStyleName, Division, DivisionInput } from '../../../src/contract/events';
import type { RoundDefinition } from '../../../src/core';
import type { Db } from '../../db';
import { refuseOverLimit } from './eventLimits';
import { conflict, notFound } from '../../http/httpError';
import { audit } from '../audit';

type DivisionRow = {
  id: number;
  event_id: number;
  bow_style: BowStyleName;
  class_name: string;
  name: string;
};

const BOW_STYLE_WORDS: Record<BowStyleName, string> = {
  recurve: 'Recurve',
  compound: 'Compound',
  barebow: 'Barebow',
};

/** A division's name is its bow style and class: "Recurve Women", "Barebow Under 18". */
export const divisionName = (bowStyle: BowStyleName, className: string): string =>
  `${BOW_STYLE_WORDS[bowStyle]} ${className}`;

export async function listDivisions(db: Db, eventId: number): Promise<Division[]> {
  const rows = (await db('divisions').where({ event_id: eventId }).orderBy('id').select()) as DivisionRow[];
  const counts = (await db('entries')
    .where({ event_id: eventId })
    .groupBy('division_id')
    .select('division_id')
    .count({ n: '*' })) as unknown as {
    division_id: number;
    n: number | string;
  }[];
  const countOf = new Map(counts.map((c) => [Number(c.division_id), Number(c.n)]));
  return rows.map((r) => ({
    id: r.id,
    bowStyle: r.bow_style,
    className: r.class_name,
    name: r.name,
    entryCount: countOf.get(r.id) ?? 0,
  }));
}

export async function findDivision(db: Db, eventId: number, divisionId: number): Promise<DivisionRow> {
  const row = (await db('divisions').where({ id: divisionId, event_id: eventId }).first()) as
    DivisionRow | undefined;
  if (!row) throw notFound('That division does not exist in this event.');
  return row;
}

async function refuseDuplicateName(db: Db, eventId: number, name: string, exceptId?: number): Promise<void> {
  const query = db('divisions')
    .where({ event_id: eventId })
    .whereRaw('lower(name) = ?', [name.toLowerCase()]);
  if (exceptId) query.whereNot({ id: exceptId });
  if (await query.first('id')) throw conflict(`There is already a division called ${name}.`);
}

export async function createDivision(
  db: Db,
  userId: number,
  eventId: number,
  input: DivisionInput,
): Promise<Division> {
  const name = divisionName(input.bowStyle, input.className);
  await refuseDuplicateName(db, eventId, name);
  await refuseOverLimit(db, eventId, 'divisions');
  const [row] = await db('divisions')
    .insert({ event_id: eventId, bow_style: input.bowStyle, class_name: input.className, name })
    .returning('id');
  const id = (row as { id: number }).id;
  await audit(db, { userId, eventId, action: 'division.created', details: { divisionId: id, name } });
  return { id, bowStyle: input.bowStyle, className: input.className, name, entryCount: 0 };
}

export async function updateDivision(
  db: Db,
  userId: number,
  eventId: number,
  divisionId: number,
  input: DivisionInput,
): Promise<Division> {
  const current = await findDivision(db, eventId, divisionId);
  const name = divisionName(input.bowStyle, input.className);
  await refuseDuplicateName(db, eventId, name, divisionId);
  if (input.bowStyle !== current.bow_style) {
    // A round chosen for this division must still be one its bow style shoots.
    const rounds = await db('session_divisions')
      .join('event_sessions', 'event_sessions.id', 'session_divisions.session_id')
      .where('session_divisions.division_id', divisionId)
      .select('session_divisions.round_json', 'event_sessions.name as session_name');
    for (const r of rounds) {
      const round = JSON.parse(r.round_json) as RoundDefinition;
      if (!round.bowStyles.includes(input.bowStyle)) {
        throw conflict(
          `The ${round.name} chosen for this division in the session "${r.session_name}" is not shot with ${input.bowStyle}. Change that round first.`,
        );
      }
    }
  }
  await db('divisions')
    .where({ id: divisionId })
    .update({ bow_style: input.bowStyle, class_name: input.className, name });
  await audit(db, { userId, eventId, action: 'division.updated', details: { divisionId, name } });
  return (await listDivisions(db, eventId)).find((d) => d.id === divisionId)!;
}

export async function deleteDivision(
  db: Db,
  userId: number,
  eventId: number,
  divisionId: number,
): Promise<void> {
  const current = await findDivision(db, eventId, divisionId);
  const entries = await db('entries')
    .where({ division_id: divisionId })
    .count<{ n: number | string }[]>({ n: '*' })
    .first();
  const n = Number(entries?.n ?? 0);
  if (n > 0) {
    throw conflict(
      `${current.name} still has ${n} ${n === 1 ? 'entry' : 'entries'}. Move them to another division or remove them first.`,
    );
  }
  await db('divisions').where({ id: divisionId }).delete();
  await audit(db, {
    userId,
    eventId,
    action: 'division.deleted',
    details: { divisionId, name: current.name },
  });
}
