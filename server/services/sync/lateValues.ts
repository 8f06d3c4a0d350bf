import { randomUUID } from 'node:crypto';
import type { LateDecisionDto, LateValueDto } from '../../../src/contract/lateValues';
import type { EndSettleArgs, EndWriteArgs, FieldMutation, Mutation } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { conflict, notFound } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { applyMutation } from './applyMutation';
import { FieldBatch } from './fieldBatch';
import type { Placement } from './fieldPlacements';

/*
 * Values that arrive after their session was closed (see src/contract/lateValues.ts). The push
 * holds them instead of refusing them; a judge then accepts one (it is applied by the same
 * rules as any push, as if the session were open) or rejects it with a reason for the phone.
 */

/** A change the push held (its `late_values` row is written by storeHeld). */
export type Held = { m: Mutation; userId: number; placement: Placement; receivedAt: string };

const sameEnd = (h: {
  session_id: number;
  entry_id: number;
  end_index: number;
  user_id: number;
  kind: string;
  slot: number;
}) => `${h.session_id}:${h.entry_id}:${h.end_index}:${h.user_id}:${h.kind}:${h.slot}`;

/**
 * Stores the late values of one commit. A phone sends the whole end at every tap, so a later
 * value of the same end, kind and slot from the same person replaces a waiting one: only the
 * latest waits for a judge, and the phone hears that the others were replaced.
 */
export async function storeHeld(trx: Db, held: readonly Held[]): Promise<void> {
  if (held.length === 0) return;
  const rows = held.map(({ m, userId, placement, receivedAt }) => {
    const args = m.args as EndWriteArgs | EndSettleArgs;
    return {
      mutation_uuid: m.id,
      event_id: placement.session.eventId,
      session_id: placement.session.id,
      target_number: placement.targetNumber,
      entry_id: placement.entryId,
      end_index: args.endIndex,
      user_id: userId,
      kind: m.kind,
      slot: 'slot' in args ? args.slot : 0,
      received_at: receivedAt,
      status: 'waiting' as LateValueDto['status'],
    };
  });
  const latest = new Map(rows.map((r) => [sameEnd(r), r]));
  for (const r of rows) if (latest.get(sameEnd(r)) !== r) r.status = 'replaced';
  const earlier = (await trx('late_values')
    .where({ status: 'waiting' })
    .whereIn('session_id', [...new Set(rows.map((r) => r.session_id))])
    .whereIn('entry_id', [...new Set(rows.map((r) => r.entry_id))])
    .select(
      'id',
      'mutation_uuid',
      'event_id',
      'session_id',
      'target_number',
      'entry_id',
      'end_index',
      'user_id',
      'kind',
      'slot',
    )) as ((typeof rows)[number] & { id: number })[];
  const replacedEarlier = earlier.filter((r) => latest.has(sameEnd(r)));
  if (replacedEarlier.length > 0)
    await trx('late_values')
      .whereIn(
        'id',
        replacedEarlier.map((r) => r.id),
      )
      .update({ status: 'replaced' });
  for (let i = 0; i < rows.length; i += 200) await trx('late_values').insert(rows.slice(i, i + 200));
  const replaced = [...replacedEarlier, ...rows.filter((r) => r.status === 'replaced')];
  const changes = replaced.map((r) => ({
    event_id: r.event_id,
    session_id: r.session_id,
    target_number: r.target_number,
    type: 'late-value',
    record_json: JSON.stringify({
      mutationId: r.mutation_uuid,
      sessionId: r.session_id,
      entryId: r.entry_id,
      endIndex: r.end_index,
      status: 'replaced',
      reason: null,
      decidedByName: null,
      decidedAt: held[0]!.receivedAt,
    } satisfies LateDecisionDto),
  }));
  for (let i = 0; i < changes.length; i += 200) await trx('changes').insert(changes.slice(i, i + 200));
}

type LateRow = {
  id: number;
  mutation_uuid: string;
  event_id: number;
  session_id: number;
  target_number: number;
  entry_id: number;
  end_index: number;
  user_id: number;
  received_at: string;
  status: LateValueDto['status'];
  reason: string | null;
  decided_by: number | null;
  decided_at: string | null;
  kind: 'end.write' | 'end.settle';
  args_json: string;
  seq: number;
  at: string;
  archer_name: string;
  by_name: string;
  decided_by_name: string | null;
};

const lateRows = (db: Db) =>
  db('late_values as l')
    .join('mutations as m', 'm.mutation_uuid', 'l.mutation_uuid')
    .join('entries as e', 'e.id', 'l.entry_id')
    .join('users as u', 'u.id', 'l.user_id')
    .leftJoin('users as d', 'd.id', 'l.decided_by')
    .select(
      'l.*',
      'm.kind',
      'm.args_json',
      'm.seq',
      'm.at',
      'e.name as archer_name',
      'u.display_name as by_name',
      'd.display_name as decided_by_name',
    );

function toDto(r: LateRow): LateValueDto {
  const args = JSON.parse(r.args_json) as EndWriteArgs | EndSettleArgs;
  return {
    id: r.id,
    mutationId: r.mutation_uuid,
    sessionId: r.session_id,
    targetNumber: r.target_number,
    entryId: r.entry_id,
    archerName: r.archer_name,
    endIndex: r.end_index,
    kind: r.kind,
    ...('slot' in args ? { slot: args.slot } : {}),
    arrows: args.arrows,
    flags: 'flags' in args ? args.flags : [],
    byName: r.by_name,
    at: r.at,
    receivedAt: r.received_at,
    status: r.status,
    reason: r.reason,
    decidedByName: r.decided_by_name,
    decidedAt: r.decided_at,
  };
}

/** The session's late values (not those replaced): those waiting first, then the decided ones, oldest first. */
export async function listLateValues(db: Db, sessionId: number): Promise<LateValueDto[]> {
  const rows = (await lateRows(db)
    .where('l.session_id', sessionId)
    .whereNot('l.status', 'replaced')
    .orderByRaw("case when l.status = 'waiting' then 0 else 1 end")
    .orderBy('l.id')) as LateRow[];
  return rows.map(toDto);
}

async function waitingLate(trx: Db, eventId: number, lateId: number): Promise<LateRow> {
  const row = (await lateRows(trx).where({ 'l.id': lateId, 'l.event_id': eventId }).first()) as
    LateRow | undefined;
  if (!row) throw notFound('There is no such late value in this event.');
  if (row.status !== 'waiting')
    throw conflict(
      `${row.decided_by_name ?? 'A judge'} has already ${row.status} this value. Reload the judge desk.`,
    );
  return row;
}

/**
 * Records a judge's decision: in the log (a `late.accept` / `late.reject` row of its own, one per
 * late value, so the log replays it), on the late value, and as a change the phone pulls.
 */
async function decide(
  trx: Db,
  judgeId: number,
  row: LateRow,
  status: 'accepted' | 'rejected',
  reason: string | null,
): Promise<void> {
  const at = nowIso();
  await trx('mutations').insert({
    mutation_uuid: randomUUID(),
    client_id: `late:${row.mutation_uuid}`,
    seq: 1,
    user_id: judgeId,
    kind: status === 'accepted' ? 'late.accept' : 'late.reject',
    args_json: JSON.stringify({ mutationId: row.mutation_uuid }),
    at,
    received_at: at,
    status: 'applied',
    reason,
  });
  await trx('late_values')
    .where({ id: row.id })
    .update({ status, reason, decided_by: judgeId, decided_at: at });
  const judge = (await trx('users').where({ id: judgeId }).first('display_name')) as { display_name: string };
  const record: LateDecisionDto = {
    mutationId: row.mutation_uuid,
    sessionId: row.session_id,
    entryId: row.entry_id,
    endIndex: row.end_index,
    status,
    reason,
    decidedByName: judge.display_name,
    decidedAt: at,
  };
  await trx('changes').insert({
    event_id: row.event_id,
    session_id: row.session_id,
    target_number: row.target_number,
    type: 'late-value',
    record_json: JSON.stringify(record),
  });
  await audit(trx, {
    userId: judgeId,
    eventId: row.event_id,
    action: `late_value.${status}`,
    details: { lateValueId: row.id, mutationId: row.mutation_uuid, ...(reason ? { reason } : {}) },
  });
}

/**
 * A judge accepts a late value: it is applied by the same rules as a push in time (the person
 * still keeps the task, the end is not ruled or signed, the values fit the face…), as made by
 * its author at its own time. A rule it now breaks is answered 409 with the reason, and nothing
 * changes: the judge rejects it or rules on the end instead.
 */
export async function acceptLateValue(
  db: Db,
  judgeId: number,
  eventId: number,
  lateId: number,
): Promise<void> {
  await db.transaction(async (trx) => {
    const row = await waitingLate(trx, eventId, lateId);
    const m = {
      id: row.mutation_uuid,
      seq: row.seq,
      at: row.at,
      kind: row.kind,
      args: JSON.parse(row.args_json),
    };
    const batch = await FieldBatch.load(trx, [m as FieldMutation], [row.user_id]);
    batch.acceptingLate = true;
    const refused = await applyMutation(
      batch,
      m as FieldMutation,
      {
        userId: row.user_id,
        at: row.at,
        mutationId: row.mutation_uuid,
      },
      undefined,
    );
    if (refused !== null)
      throw conflict(
        `This value cannot take effect: ${refused} Reject it with a reason, or rule on the end.`,
      );
    await batch.flush(trx);
    await decide(trx, judgeId, row, 'accepted', null);
  });
}

/** A judge rejects a late value; the reason reaches the phone that sent it. */
export async function rejectLateValue(
  db: Db,
  judgeId: number,
  eventId: number,
  lateId: number,
  reason: string,
): Promise<void> {
  await db.transaction(async (trx) => {
    await decide(trx, judgeId, await waitingLate(trx, eventId, lateId), 'rejected', reason);
  });
}
