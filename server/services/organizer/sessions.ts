import type { EventSession, SessionInput, SessionRound, UpdateSessionInput } from '../../../src/contract/events';
import type { RoundDefinition } from '../../../src/core';
import type { Db } from '../../db';
import { refuseOverLimit } from './eventLimits';
import { badRequest, conflict, notFound } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { scoresExist } from '../fieldData';
import { resolveRound, roundSummary } from './sessionRounds';

export type SessionRow = {
  id: number;
  event_id: number;
  name: string;
  starts_at: string;
  closed_at: string | null;
};

export async function findSession(db: Db, eventId: number, sessionId: number): Promise<SessionRow> {
  const row = (await db('event_sessions').where({ id: sessionId, event_id: eventId }).first()) as
    SessionRow | undefined;
  if (!row) throw notFound('That session does not exist in this event.');
  return row;
}

/** Setup of a closed session stays as it was shot; reopening it is an explicit step. */
export function requireOpen(session: SessionRow): void {
  if (session.closed_at)
    throw conflict(`The session "${session.name}" is closed. Reopen it to change its setup.`);
}

export type SessionDivisionRow = {
  session_id: number;
  division_id: number;
  round_id: string;
  round_json: string;
  division_name: string;
  bow_style: SessionRound['bowStyle'];
};

export async function sessionDivisions(db: Db, sessionIds: number[]): Promise<SessionDivisionRow[]> {
  if (sessionIds.length === 0) return [];
  return (await db('session_divisions')
    .join('divisions', 'divisions.id', 'session_divisions.division_id')
    .whereIn('session_divisions.session_id', sessionIds)
    .orderBy('divisions.id')
    .select(
      'session_divisions.session_id',
      'session_divisions.division_id',
      'session_divisions.round_id',
      'session_divisions.round_json',
      'divisions.name as division_name',
      'divisions.bow_style',
    )) as SessionDivisionRow[];
}

export const parseRound = (json: string): RoundDefinition => JSON.parse(json) as RoundDefinition;

export async function listSessions(db: Db, eventId: number): Promise<EventSession[]> {
  const rows = (await db('event_sessions')
    .where({ event_id: eventId })
    .orderBy([{ column: 'starts_at' }, { column: 'id' }])
    .select()) as SessionRow[];
  const ids = rows.map((r) => r.id);
  const rounds = await sessionDivisions(db, ids);
  const assigned = (ids.length
    ? await db('target_assignments')
        .whereIn('session_id', ids)
        .groupBy('session_id')
        .select('session_id')
        .count({ n: '*' })
        .countDistinct({ t: 'target_number' })
    : []) as unknown as { session_id: number; n: number | string; t: number | string }[];
  const tally = new Map(assigned.map((a) => [Number(a.session_id), { n: Number(a.n), t: Number(a.t) }]));
  return rows.map((s) => ({
    id: s.id,
    name: s.name,
    startsAt: s.starts_at,
    closedAt: s.closed_at,
    rounds: rounds
      .filter((r) => r.session_id === s.id)
      .map((r) => ({
        divisionId: r.division_id,
        divisionName: r.division_name,
        bowStyle: r.bow_style,
        round: roundSummary(parseRound(r.round_json), r.round_id === 'custom'),
      })),
    assignedCount: tally.get(s.id)?.n ?? 0,
    targetCount: tally.get(s.id)?.t ?? 0,
  }));
}

async function refuseDuplicateName(db: Db, eventId: number, name: string, exceptId?: number): Promise<void> {
  const rows = await db('event_sessions').where({ event_id: eventId }).select('id', 'name');
  if (rows.some((r) => r.id !== exceptId && String(r.name).toLowerCase() === name.toLowerCase())) {
    throw conflict(`There is already a session called "${name}". Give this one another name.`);
  }
}

/** Checks every division named in the session and turns each choice into a stored round. */
async function resolveRounds(db: Db, eventId: number, rounds: SessionInput['rounds']) {
  const divisions = await db('divisions').where({ event_id: eventId }).select('id', 'name', 'bow_style');
  return rounds.map((choice, index) => {
    const division = divisions.find((d) => d.id === choice.divisionId);
    if (!division) {
      throw badRequest(
        'One of the chosen divisions is not part of this event. Reload the page and choose again.',
        [{ path: `rounds.${index}.divisionId`, message: 'Unknown division.' }],
      );
    }
    const { roundId, round } = resolveRound(choice, { name: division.name, bowStyle: division.bow_style });
    return { division_id: division.id as number, round_id: roundId, round_json: JSON.stringify(round) };
  });
}

export async function createSession(
  db: Db,
  userId: number,
  eventId: number,
  input: SessionInput,
): Promise<EventSession> {
  await refuseDuplicateName(db, eventId, input.name);
  await refuseOverLimit(db, eventId, 'sessions');
  const rounds = await resolveRounds(db, eventId, input.rounds);
  const sessionId = await db.transaction(async (trx) => {
    const [row] = await trx('event_sessions')
      .insert({ event_id: eventId, name: input.name, starts_at: input.startsAt })
      .returning('id');
    const id = (row as { id: number }).id;
    if (rounds.length) await trx('session_divisions').insert(rounds.map((r) => ({ ...r, session_id: id })));
    await audit(trx, {
      userId,
      eventId,
      action: 'session.created',
      details: { sessionId: id, name: input.name, rounds: rounds.map((r) => [r.division_id, r.round_id]) },
    });
    return id;
  });
  return (await listSessions(db, eventId)).find((s) => s.id === sessionId)!;
}

export async function updateSession(
  db: Db,
  userId: number,
  eventId: number,
  sessionId: number,
  input: UpdateSessionInput,
): Promise<EventSession> {
  const session = await findSession(db, eventId, sessionId);
  requireOpen(session);
  if (input.name !== undefined) await refuseDuplicateName(db, eventId, input.name, sessionId);
  const rounds = input.rounds ? await resolveRounds(db, eventId, input.rounds) : undefined;
  if (rounds) await refuseRoundChangesUnderScores(db, sessionId, rounds);
  await db.transaction(async (trx) => {
    const changes: Record<string, string> = {};
    if (input.name !== undefined) changes.name = input.name;
    if (input.startsAt !== undefined) changes.starts_at = input.startsAt;
    if (Object.keys(changes).length) await trx('event_sessions').where({ id: sessionId }).update(changes);
    if (rounds) {
      // Archers already on targets stay there; a division taken out of the session shows as a conflict.
      await trx('session_divisions').where({ session_id: sessionId }).delete();
      if (rounds.length)
        await trx('session_divisions').insert(rounds.map((r) => ({ ...r, session_id: sessionId })));
    }
    await audit(trx, {
      userId,
      eventId,
      action: 'session.updated',
      details: {
        sessionId,
        ...changes,
        ...(rounds ? { rounds: rounds.map((r) => [r.division_id, r.round_id]) } : {}),
      },
    });
  });
  return (await listSessions(db, eventId)).find((s) => s.id === sessionId)!;
}

/** A division whose archers have scored ends in the session keeps the round they were scored on. */
async function refuseRoundChangesUnderScores(
  db: Db,
  sessionId: number,
  rounds: { division_id: number; round_json: string }[],
): Promise<void> {
  const before = await sessionDivisions(db, [sessionId]);
  for (const old of before) {
    const now = rounds.find((r) => r.division_id === old.division_id);
    if (now && now.round_json === old.round_json) continue;
    const entryIds = (await db('entries').where({ division_id: old.division_id }).select('id')).map(
      (e) => e.id as number,
    );
    if (await scoresExist(db, { sessionId, entryIds })) {
      throw conflict(
        `${old.division_name} already have scored ends in this session, so their round cannot change or be taken out.`,
      );
    }
  }
}

export async function deleteSession(
  db: Db,
  userId: number,
  eventId: number,
  sessionId: number,
): Promise<void> {
  const session = await findSession(db, eventId, sessionId);
  requireOpen(session);
  if (await scoresExist(db, { sessionId })) {
    throw conflict(
      `Ends are already scored in "${session.name}", so it cannot be deleted. Close it instead.`,
    );
  }
  // Rounds, target assignments and join codes of the session go with it (ON DELETE CASCADE).
  await db('event_sessions').where({ id: sessionId }).delete();
  await audit(db, { userId, eventId, action: 'session.deleted', details: { sessionId, name: session.name } });
}

export async function setSessionClosed(
  db: Db,
  userId: number,
  eventId: number,
  sessionId: number,
  closed: boolean,
): Promise<EventSession> {
  const session = await findSession(db, eventId, sessionId);
  if (closed && session.closed_at) throw conflict(`The session "${session.name}" is already closed.`);
  if (!closed && !session.closed_at) throw conflict(`The session "${session.name}" is open already.`);
  await db('event_sessions')
    .where({ id: sessionId })
    .update({ closed_at: closed ? nowIso() : null });
  await audit(db, {
    userId,
    eventId,
    action: closed ? 'session.closed' : 'session.reopened',
    details: { sessionId, name: session.name },
  });
  return (await listSessions(db, eventId)).find((s) => s.id === sessionId)!;
}
