import { endsOfRound, type RoundDefinition, type RoundEnd } from '../../../src/core';
import type { BowStyleName } from '../../../src/contract/events';
import type { EndRecordDto, Mutation, SettlementDto, Task } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { END_ENTRY_COLUMNS, type EndEntryRow, type SettlementRow } from './fieldRows';

export type FieldSession = { id: number; eventId: number; name: string; closed: boolean };

/** Where an archer shoots in a session, what, and the pushing person's task on that target. */
export type Placement = {
  session: FieldSession;
  entryId: number;
  archerName: string;
  targetNumber: number;
  bowStyle: BowStyleName;
  /** Null when the archer's division has no round in the session. */
  round: RoundDefinition | null;
  ends: RoundEnd[];
  /** The pushing person's task on the archer's target, if they are in its group. */
  task: Task | undefined;
};

export type ChangeRecord =
  { type: 'end'; record: EndRecordDto } | { type: 'settlement'; record: SettlementDto };

const endKey = (sessionId: number, entryId: number, endIndex: number) =>
  `${sessionId}:${entryId}:${endIndex}`;

// Rounds are stored as JSON snapshots; the same few strings come back on every push.
const rounds = new Map<string, { round: RoundDefinition; ends: RoundEnd[] }>();
function parseRound(json: string): { round: RoundDefinition; ends: RoundEnd[] } {
  let parsed = rounds.get(json);
  if (!parsed) {
    const round = JSON.parse(json) as RoundDefinition;
    parsed = { round, ends: endsOfRound(round) };
    if (rounds.size > 200) rounds.clear();
    rounds.set(json, parsed);
  }
  return parsed;
}

/**
 * One push as a unit of work: everything its mutations are checked against is read up front
 * (a few queries whatever the batch size), the mutations are applied in order to this
 * in-memory state by the rules, and `flush` writes the outcome back with multi-row statements.
 * It lives inside the push's transaction, so what it read stays true until it writes.
 */
export class FieldBatch {
  private readonly sessions = new Map<number, FieldSession>();
  private readonly placements = new Map<string, Placement>();
  private readonly records = new Map<string, EndEntryRow>();
  private readonly touchedRecords = new Set<string>();
  private readonly settlements = new Map<string, SettlementRow>();
  /** Applied effects in order, for the change log. */
  readonly changes: { placement: Placement; change: ChangeRecord }[] = [];

  private constructor(readonly userId: number) {}

  static async load(trx: Db, userId: number, mutations: readonly Mutation[]): Promise<FieldBatch> {
    const batch = new FieldBatch(userId);
    if (mutations.length === 0) return batch;
    const sessionIds = [...new Set(mutations.map((m) => m.args.sessionId))];
    const entryIds = [...new Set(mutations.map((m) => m.args.entryId))];
    const endIndexes = [...new Set(mutations.map((m) => m.args.endIndex))];

    // Sessions, the archers' places and rounds, and this person's task on each archer's target: one query.
    const rows = (await trx('event_sessions as s')
      .leftJoin('target_assignments as ta', (j) =>
        j.on('ta.session_id', 's.id').andOnIn('ta.entry_id', entryIds),
      )
      .leftJoin('entries as e', 'e.id', 'ta.entry_id')
      .leftJoin('divisions as d', 'd.id', 'e.division_id')
      .leftJoin('session_divisions as sd', (j) =>
        j.on('sd.session_id', 's.id').andOn('sd.division_id', 'e.division_id'),
      )
      .leftJoin('target_members as tm', (j) =>
        j
          .on('tm.session_id', 's.id')
          .andOn('tm.target_number', 'ta.target_number')
          .andOnVal('tm.user_id', '=', userId),
      )
      .whereIn('s.id', sessionIds)
      .select(
        's.id as session_id',
        's.event_id',
        's.name as session_name',
        's.closed_at',
        'ta.entry_id',
        'ta.target_number',
        'e.name as archer_name',
        'd.bow_style',
        'sd.round_json',
        'tm.task',
      )) as {
      session_id: number;
      event_id: number;
      session_name: string;
      closed_at: string | null;
      entry_id: number | null;
      target_number: number | null;
      archer_name: string | null;
      bow_style: BowStyleName | null;
      round_json: string | null;
      task: Task | null;
    }[];
    for (const r of rows) {
      let session = batch.sessions.get(r.session_id);
      if (!session) {
        session = { id: r.session_id, eventId: r.event_id, name: r.session_name, closed: !!r.closed_at };
        batch.sessions.set(session.id, session);
      }
      if (r.entry_id === null) continue;
      const parsed = r.round_json ? parseRound(r.round_json) : null;
      batch.placements.set(`${r.session_id}:${r.entry_id}`, {
        session,
        entryId: r.entry_id,
        archerName: r.archer_name!,
        targetNumber: Number(r.target_number),
        bowStyle: r.bow_style!,
        round: parsed?.round ?? null,
        ends: parsed?.ends ?? [],
        task: r.task ?? undefined,
      });
    }

    // The writers' current records of every end the batch names (a superset; filtered by key).
    const near = (table: string, columns: readonly string[]) =>
      trx(table)
        .whereIn('session_id', sessionIds)
        .whereIn('entry_id', entryIds)
        .whereIn('end_index', endIndexes)
        .select(columns);
    for (const r of (await near('end_entries', END_ENTRY_COLUMNS)) as EndEntryRow[]) {
      batch.records.set(`${endKey(r.session_id, r.entry_id, r.end_index)}:${r.slot}`, r);
    }
    return batch;
  }

  session(sessionId: number): FieldSession | undefined {
    return this.sessions.get(sessionId);
  }

  placement(session: FieldSession, entryId: number): Placement | undefined {
    return this.placements.get(`${session.id}:${entryId}`);
  }

  record(sessionId: number, entryId: number, endIndex: number, slot: 1 | 2): EndEntryRow | undefined {
    return this.records.get(`${endKey(sessionId, entryId, endIndex)}:${slot}`);
  }

  putRecord(placement: Placement, row: EndEntryRow, record: EndRecordDto): void {
    const key = `${endKey(row.session_id, row.entry_id, row.end_index)}:${row.slot}`;
    this.records.set(key, row);
    this.touchedRecords.add(key);
    this.changes.push({ placement, change: { type: 'end', record } });
  }

  putSettlement(placement: Placement, row: SettlementRow, record: SettlementDto): void {
    this.settlements.set(endKey(row.session_id, row.entry_id, row.end_index), row);
    this.changes.push({ placement, change: { type: 'settlement', record } });
  }

  /**
   * Writes the batch's effects: the final record of each end it touched, the settlements, and
   * one change-log row per applied effect in the order applied. Change versions follow commit
   * order because SQLite has a single writer; a PostgreSQL deployment would need pushes to lock
   * the log (or hand out versions at commit) to keep that true.
   */
  async flush(trx: Db): Promise<void> {
    const chunks = <T>(rows: T[], size: number) =>
      Array.from({ length: Math.ceil(rows.length / size) }, (_, i) => rows.slice(i * size, (i + 1) * size));
    const records = [...this.touchedRecords].map((k) => this.records.get(k)!);
    for (const part of chunks(records, 200)) {
      await trx('end_entries')
        .insert(part)
        .onConflict(['session_id', 'entry_id', 'end_index', 'slot'])
        .merge();
    }
    for (const part of chunks([...this.settlements.values()], 200)) {
      await trx('end_settlements').insert(part).onConflict(['session_id', 'entry_id', 'end_index']).merge();
    }
    const changeRows = this.changes.map(({ placement, change }) => ({
      event_id: placement.session.eventId,
      session_id: placement.session.id,
      target_number: placement.targetNumber,
      type: change.type,
      record_json: JSON.stringify(change.record),
    }));
    for (const part of chunks(changeRows, 200)) await trx('changes').insert(part);
  }
}
