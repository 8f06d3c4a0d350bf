import Database from 'better-sqlite3';
import type { Mutation } from '../../src/contract/sync';

/** One push of a phone as the raw baseline writes it: the phone, its person and target, its changes. */
export type RawPush = {
  clientId: string;
  userId: number;
  eventId: number;
  targetNumber: number;
  changes: Mutation[];
};

/** The server's connection settings (server/db.ts): WAL, a disk flush at every commit, foreign keys. */
function open(file: string): Database.Database {
  const db = new Database(file);
  db.pragma('journal_mode = WAL');
  db.pragma('synchronous = FULL');
  db.pragma('foreign_keys = ON');
  return db;
}

/**
 * What any server keeping this protocol's promises must write of a day, on the real schema (a
 * migrated database holding the field, so the same indexes and foreign keys), one transaction
 * per push with the server's durability (synchronous FULL): every change's append-only log row,
 * each record the push touched once (its final state, an upsert) with one change row for phones
 * to pull, and the phone's last seq. Prepared statements, no HTTP, JSON checks, rules or query
 * building: the floor the server's rate is compared with. Returns taps (changes) per second.
 */
export function rawDay(file: string, pushes: RawPush[]): number {
  const db = open(file);
  const record =
    db.prepare(`insert into end_entries (session_id, entry_id, end_index, slot, arrows_json, flags_json, revision,
    written_by, written_at, mutation_id) values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)
    on conflict (session_id, entry_id, end_index, slot) do update set arrows_json = excluded.arrows_json,
    flags_json = excluded.flags_json, revision = revision + excluded.revision, written_by = excluded.written_by,
    written_at = excluded.written_at, mutation_id = excluded.mutation_id`);
  const log =
    db.prepare(`insert into mutations (mutation_uuid, client_id, seq, user_id, kind, args_json, at, received_at,
    status, reason) values (?, ?, ?, ?, ?, ?, ?, ?, 'applied', null)`);
  const change = db.prepare(`insert into changes (event_id, session_id, target_number, type, record_json)
    values (?, ?, ?, 'end', ?)`);
  const lastSeq =
    db.prepare(`insert into sync_clients (client_id, user_id, last_seq, updated_at) values (?, ?, ?, ?)
    on conflict (client_id) do update set last_seq = excluded.last_seq, updated_at = excluded.updated_at`);
  const write = db.transaction((push: RawPush) => {
    const receivedAt = new Date().toISOString();
    const last = new Map<string, { m: Extract<Mutation, { kind: 'end.write' }>; writes: number }>();
    for (const m of push.changes) {
      if (m.kind !== 'end.write') throw new Error('The raw baseline writes end.write changes only.');
      log.run(m.id, push.clientId, m.seq, push.userId, m.kind, JSON.stringify(m.args), m.at, receivedAt);
      const key = `${m.args.entryId}:${m.args.endIndex}:${m.args.slot}`;
      last.set(key, { m, writes: (last.get(key)?.writes ?? 0) + 1 });
    }
    for (const { m, writes } of last.values()) {
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
        writes,
        push.userId,
        m.at,
        m.id,
      );
      change.run(
        push.eventId,
        args.sessionId,
        push.targetNumber,
        JSON.stringify({ ...args, revision: writes, writtenBy: push.userId, writtenAt: m.at }),
      );
    }
    lastSeq.run(push.clientId, push.userId, push.changes.at(-1)!.seq, receivedAt);
  });
  const started = performance.now();
  for (const push of pushes) write(push);
  const seconds = (performance.now() - started) / 1000;
  db.close();
  return pushes.reduce((n, p) => n + p.changes.length, 0) / seconds;
}
