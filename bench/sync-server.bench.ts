/**
 * The field loop's server under a tournament's load, through the real HTTP app on loopback with
 * the server in a child process (phones and server never share an event loop). Figures only.
 *
 * (a) A 200-archer, 72-arrow day entered by two writers per target: 50 targets × 4 archers ×
 *     12 ends × 2 writers = 4,800 end.write mutations (28,800 arrows). Each of the 100 writer
 *     phones pushes its ends in order, all phones at once; a batch is one end of the target's
 *     four archers (4 mutations), two ends (8, after a short loss of signal) or the whole day
 *     (48, a phone that was offline all day). Compared with raw better-sqlite3: the same number
 *     of similar rows, a prepared statement, one transaction per batch. The server writes three
 *     rows per end (the writer's record, the append-only log, the change log) and commits each
 *     push with the database's full durability, so the ratio is bounded well below 1.
 * (b) 100 phones, each pushing an end and then pulling: first with no pause at all (a closed
 *     loop: the server's ceiling, where latency is the queue), then paced as on a field, each
 *     phone syncing once at a random moment in every window of P ms. Latency p50/p99.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import Database from 'better-sqlite3';
import type { ArrowValue } from '../src/core';
import type { Mutation, PullResponse, PushResponse } from '../src/contract/sync';
import { createBenchField, startServerChild, type BenchField, type BenchWriter } from './support/syncField';
import { percentile } from './support/stats';

const TARGETS = 50;
const ENDS = 12;
const dir = mkdtempSync(join(tmpdir(), 'ringcall-sync-bench-'));
let dbCounter = 0;
const freshFile = () => join(dir, `sync-${(dbCounter += 1)}.sqlite`);

const END: ArrowValue[] = ['X', '10', '9', '9', '8', '7'];

/** One writer phone: its end.write mutations in seq order, end by end for the target's four archers. */
function phoneOf(field: BenchField, writer: BenchWriter) {
  const archers = field.archers.filter((a) => a.target === writer.target);
  const ends: Mutation[][] = [];
  let seq = 0;
  for (let endIndex = 0; endIndex < ENDS; endIndex += 1) {
    ends.push(
      archers.map((a) => ({
        id: randomUUID(),
        seq: (seq += 1),
        at: new Date().toISOString(),
        kind: 'end.write' as const,
        args: {
          sessionId: field.sessionId,
          entryId: a.entryId,
          endIndex,
          slot: writer.slot,
          arrows: END,
          flags: [],
        },
      })),
    );
  }
  return { writer, clientId: `bench-${writer.target}-${writer.slot}`, ends, cursor: 0 };
}
type BenchPhone = ReturnType<typeof phoneOf>;

function client(port: number) {
  const base = `http://127.0.0.1:${port}/api`;
  return {
    async push(phone: BenchPhone, mutations: Mutation[]): Promise<PushResponse> {
      const res = await fetch(`${base}/sync/push`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', authorization: `Bearer ${phone.writer.token}` },
        body: JSON.stringify({ clientId: phone.clientId, mutations }),
      });
      if (res.status !== 200) throw new Error(`push ${res.status}: ${await res.text()}`);
      return (await res.json()) as PushResponse;
    },
    async pull(phone: BenchPhone): Promise<PullResponse> {
      const res = await fetch(`${base}/sync/pull?cursor=${phone.cursor}`, {
        headers: { authorization: `Bearer ${phone.writer.token}` },
      });
      if (res.status !== 200) throw new Error(`pull ${res.status}: ${await res.text()}`);
      const body = (await res.json()) as PullResponse;
      phone.cursor = body.cursor;
      return body;
    },
  };
}

/**
 * A started server on a fresh field, warmed up (a just-started process compiles its hot paths
 * on the first few hundred requests) by the two writers of one extra target that the measured
 * phones never see.
 */
async function warmServer(): Promise<{
  field: BenchField;
  api: ReturnType<typeof client>;
  phones: BenchPhone[];
  stop: () => Promise<void>;
}> {
  const file = freshFile();
  const field = await createBenchField(file, TARGETS + 1);
  const server = await startServerChild(file);
  const api = client(server.port);
  await Promise.all(
    field.writers
      .filter((w) => w.target > TARGETS)
      .map(async (writer) => {
        for (let round = 0; round < 5; round += 1) {
          const phone = { ...phoneOf(field, writer), clientId: `warm-${writer.slot}-${round}` };
          for (const end of phone.ends) {
            await api.push(phone, end);
            await api.pull(phone);
          }
        }
      }),
  );
  const phones = field.writers.filter((w) => w.target <= TARGETS).map((w) => phoneOf(field, w));
  // Phones that have already talked to the server: their connections are open (kept alive).
  await Promise.all(phones.map((phone) => api.pull(phone).then(() => (phone.cursor = 0))));
  return { field, api, phones, stop: server.stop };
}

/** (a) Every writer phone pushes its day, `endsPerBatch` ends per request, all phones at once. */
async function enterTheDay(
  endsPerBatch: number,
): Promise<{ seconds: number; mutations: number; requests: number }> {
  const { api, phones, stop } = await warmServer();
  try {
    let applied = 0;
    let requests = 0;
    const started = performance.now();
    await Promise.all(
      phones.map(async (phone) => {
        for (let e = 0; e < phone.ends.length; e += endsPerBatch) {
          const res = await api.push(phone, phone.ends.slice(e, e + endsPerBatch).flat());
          requests += 1;
          applied += res.results.filter((r) => r.status === 'applied').length;
        }
      }),
    );
    const seconds = (performance.now() - started) / 1000;
    const expected = TARGETS * 4 * ENDS * 2;
    if (applied !== expected) throw new Error(`Expected ${expected} applied mutations, got ${applied}.`);
    return { seconds, mutations: applied, requests };
  } finally {
    await stop();
  }
}

/** Raw better-sqlite3: the same number of similar rows, one prepared statement, one transaction per batch. */
function rawInserts(rows: number, perBatch: number): number {
  const db = new Database(freshFile());
  db.pragma('journal_mode = WAL');
  db.exec(`create table end_entries (id integer primary key autoincrement, session_id integer not null, entry_id integer not null,
    end_index integer not null, slot integer not null, arrows_json text not null, flags_json text not null, revision integer not null,
    written_by integer not null, written_at text not null, mutation_id text not null, unique (session_id, entry_id, end_index, slot))`);
  const insert =
    db.prepare(`insert into end_entries (session_id, entry_id, end_index, slot, arrows_json, flags_json, revision, written_by, written_at, mutation_id)
    values (?, ?, ?, ?, ?, ?, 1, ?, ?, ?)`);
  const batch = db.transaction((first: number) => {
    for (let i = first; i < Math.min(rows, first + perBatch); i += 1) {
      insert.run(
        1,
        Math.floor(i / 24),
        i % 12,
        i % 24 < 12 ? 1 : 2,
        JSON.stringify(END),
        '[]',
        1 + (i % 100),
        new Date().toISOString(),
        randomUUID(),
      );
    }
  });
  const started = performance.now();
  for (let first = 0; first < rows; first += perBatch) batch(first);
  const seconds = (performance.now() - started) / 1000;
  db.close();
  return rows / seconds;
}

/** (b) 100 phones each pushing an end and pulling after it; with `windowMs`, once at a random moment in each window. */
async function phonesAtOnce(windowMs: number): Promise<{ push: number[]; pull: number[]; seconds: number }> {
  const { api, phones, stop } = await warmServer();
  try {
    const push: number[] = [];
    const pull: number[] = [];
    const started = performance.now();
    await Promise.all(
      phones.map(async (phone) => {
        for (const [i, end] of phone.ends.entries()) {
          if (windowMs > 0) {
            const at = started + i * windowMs + Math.random() * windowMs * 0.9;
            await new Promise((r) => setTimeout(r, Math.max(0, at - performance.now())));
          }
          let t = performance.now();
          await api.push(phone, end);
          push.push(performance.now() - t);
          for (let more = true; more;) {
            t = performance.now();
            more = (await api.pull(phone)).hasMore;
            pull.push(performance.now() - t);
          }
        }
      }),
    );
    return { push, pull, seconds: (performance.now() - started) / 1000 };
  } finally {
    await stop();
  }
}

const ms = (n: number) => `${n.toFixed(1)} ms`;

try {
  console.log(
    `(a) ${TARGETS * 4} archers × 72 arrows, two writers per target: ${TARGETS * 4 * ENDS * 2} end.write mutations (${TARGETS * 4 * ENDS * 2 * 6} arrows), 100 phones at once`,
  );
  for (const endsPerBatch of [1, 2, ENDS]) {
    const run = await enterTheDay(endsPerBatch);
    const rate = run.mutations / run.seconds;
    const raw = rawInserts(run.mutations, endsPerBatch * 4);
    console.log(
      `    ${endsPerBatch * 4} mutations per push (${run.requests} pushes): ${(run.seconds * 1000).toFixed(0)} ms, ${rate.toFixed(0)} ends/s; ` +
        `raw better-sqlite3 ${raw.toFixed(0)} rows/s (one transaction per ${endsPerBatch * 4}); ${((rate / raw) * 100).toFixed(0)} % of raw`,
    );
  }

  for (const [label, windowMs] of [
    ['no pause (closed loop, the ceiling)', 0],
    ['each phone once every 1 s', 1000],
    ['each phone once every 2 s', 2000],
  ] as const) {
    const run = await phonesAtOnce(windowMs);
    const all = [...run.push, ...run.pull];
    console.log(
      `(b) 100 phones, push an end then pull, ${label}: ${all.length} requests in ${run.seconds.toFixed(1)} s (${(all.length / run.seconds).toFixed(0)} req/s); ` +
        `push p50 ${ms(percentile(run.push, 50))} p99 ${ms(percentile(run.push, 99))}; pull p50 ${ms(percentile(run.pull, 50))} p99 ${ms(percentile(run.pull, 99))}; ` +
        `all p50 ${ms(percentile(all, 50))} p99 ${ms(percentile(all, 99))}`,
    );
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}
