import { randomUUID } from 'node:crypto';
import Database from 'better-sqlite3';
import type { EndWriteArgs } from '../../src/contract/sync';

/** One push of end writes as the raw baselines write it: the phone, its person and target, its mutations. */
export type RawBatch = {
  clientId: string;
  userId: number;
  eventId: number;
  targetNumber: number;
  mutations: { id: string; seq: number; at: string; args: EndWriteArgs }[];
};

/** The server's connection settings (server/db.ts): WAL, a disk flush at every commit, foreign keys. */
function open(file: string): Database.Database {
  const db = new Database(file);
  db.pragma('journal_mode = WAL');
  db.pragma('synchronous = FULL');
  db.pragma('foreign_keys = ON');
  return db;
}

/** Runs `write` once per batch, one transaction each, one after another; returns end writes per second. */
function timed(db: Database.Database, batches: RawBatch[], write: (batch: RawBatch) => void): number {
  const inTransaction = db.transaction(write);
  const started = performance.now();
  for (const batch of batches) inTransaction(batch);
  const seconds = (performance.now() - started) / 1000;
  db.close();
  return batches.reduce((n, b) => n + b.mutations.length, 0) / seconds;
}

/**
 * The first baseline: one row per end (like a writer's record) into a table of its own with one
 * unique index, a prepared statement, one transaction per batch. The server writes three rows
 * per end, so this is a ceiling no server could reach.
 */
export function rawOneRow(file: string, batches: RawBatch[]): number {
  const db = open(file);
  db.exec(`create table end_entries (id integer primary key autoincrement, session_id integer not null, entry_id integer not null,
    end_index integer not null, slot integer not null, arrows_json text not null, flags_json text not null, revision integer not null,
    written_by integer not null, written_at text not null, mutation_id text not null, unique (session_id, entry_id, end_index, slot))`);
  const insert =
    db.prepare(`insert into end_entries (session_id, entry_id, end_index, slot, arrows_json, flags_json, revision,
    written_by, written_at, mutation_id) values (?, ?, ?, ?, ?, ?, 1, ?, ?, ?)`);
  return timed(db, batches, (batch) => {
    for (const { args, at } of batch.mutations) {
      insert.run(
        args.sessionId,
        args.entryId,
        args.endIndex,
        args.slot,
        JSON.stringify(args.arrows),
        JSON.stringify(args.flags),
        batch.userId,
        at,
        randomUUID(),
      );
    }
  });
}

/**
 * The same rows the server writes, in the same batches, on the real schema (a migrated database
 * holding the field, so the same indexes and foreign keys): per end the writer's record (an
 * upsert), the append-only log row and the change row phones pull, and per batch the phone's
 * last seq. Prepared statements, one transaction per batch: the floor of any server that keeps
 * the log and the change feed, without HTTP, JSON, checks or query building.
 */
export function rawSameRows(file: string, batches: RawBatch[]): number {
  const db = open(file);
  const record =
    db.prepare(`insert into end_entries (session_id, entry_id, end_index, slot, arrows_json, flags_json, revision,
    written_by, written_at, mutation_id) values (?, ?, ?, ?, ?, ?, 1, ?, ?, ?)
    on conflict (session_id, entry_id, end_index, slot) do update set arrows_json = excluded.arrows_json,
    flags_json = excluded.flags_json, revision = revision + 1, written_by = excluded.written_by,
    written_at = excluded.written_at, mutation_id = excluded.mutation_id`);
  const log =
    db.prepare(`insert into mutations (mutation_uuid, client_id, seq, user_id, kind, args_json, at, received_at,
    status, reason) values (?, ?, ?, ?, 'end.write', ?, ?, ?, 'applied', null)`);
  const change = db.prepare(`insert into changes (event_id, session_id, target_number, type, record_json)
    values (?, ?, ?, 'end', ?)`);
  const lastSeq =
    db.prepare(`insert into sync_clients (client_id, user_id, last_seq, updated_at) values (?, ?, ?, ?)
    on conflict (client_id) do update set last_seq = excluded.last_seq, updated_at = excluded.updated_at`);
  return timed(db, batches, (batch) => {
    const receivedAt = new Date().toISOString();
    for (const m of batch.mutations) {
      const { args } = m;
      const arrows = JSON.stringify(args.arrows);
      const flags = JSON.stringify(args.flags);
      record.run(
        args.sessionId,
        args.entryId,
        args.endIndex,
        args.slot,
        arrows,
        flags,
        batch.userId,
        m.at,
        m.id,
      );
      log.run(m.id, batch.clientId, m.seq, batch.userId, JSON.stringify(args), m.at, receivedAt);
      change.run(
        batch.eventId,
        args.sessionId,
        batch.targetNumber,
        JSON.stringify({ ...args, revision: 1, writtenBy: batch.userId, writtenAt: m.at }),
      );
    }
    lastSeq.run(batch.clientId, batch.userId, batch.mutations.at(-1)!.seq, receivedAt);
  });
}
