/**
 * The field loop's server under a tournament's load, through the real HTTP app on loopback with
 * the server in a child process (phones and server never share an event loop). Figures only.
 * The phones speak JSON over node:http with kept-alive connections (support/jsonClient.ts):
 * with fetch they used about five times the CPU per request, and on a two-core machine that
 * measured the phones more than the server.
 *
 * (a) A 200-archer, 72-arrow day entered by two writers per target: 50 targets × 4 archers ×
 *     12 ends × 2 writers = 4,800 end.write mutations (28,800 arrows). Each of the 100 writer
 *     phones pushes its ends in order, all phones at once; a batch is one end of the target's
 *     four archers (4 mutations), two ends (8, after a short loss of signal) or the whole day
 *     (48, a phone that was offline all day). The server's own CPU time per end is printed too:
 *     it moves much less than the rate when other work shares the machine.
 *     Compared with raw better-sqlite3 (bench/support/rawInserts.ts), the same batches one
 *     transaction each, prepared statements, with the server's durability (synchronous FULL: a
 *     push is answered only once it is on disk, so the baselines flush every commit too):
 *     - the same rows: what the server must write per end (the writer's record, the append-only
 *       log row, the change row phones pull) and the phone's last seq per batch, on the real
 *       schema. This is the fair floor, and the ratio the goal is stated against.
 *     - one row per end into a table of its own, as this bench first compared: kept for
 *       continuity, though no server keeping a log could come near it.
 *     The server may beat a baseline: it commits pushes that arrive together as one (group
 *     commit), where the baselines flush once per batch.
 * (b) 100 phones, each pushing an end and then pulling: first with no pause at all (a closed
 *     loop: the server's ceiling, where latency is the queue), then paced as on a field, each
 *     phone syncing once at a random moment in every window of P ms. Latency p50/p99.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import type { ArrowValue } from '../src/core';
import type { Mutation, PullResponse, PushResponse } from '../src/contract/sync';
import { createBenchField, startServerChild, type BenchField, type BenchWriter } from './support/syncField';
import { jsonClient } from './support/jsonClient';
import { rawOneRow, rawSameRows, type RawBatch } from './support/rawInserts';
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
  const http = jsonClient(port);
  return {
    async push(phone: BenchPhone, mutations: Mutation[]): Promise<PushResponse> {
      const res = await http.post('/api/sync/push', phone.writer.token, {
        clientId: phone.clientId,
        mutations,
      });
      if (res.status !== 200) throw new Error(`push ${res.status}: ${JSON.stringify(res.body)}`);
      return res.body as PushResponse;
    },
    async pull(phone: BenchPhone): Promise<PullResponse> {
      const res = await http.get(`/api/sync/pull?cursor=${phone.cursor}`, phone.writer.token);
      if (res.status !== 200) throw new Error(`pull ${res.status}: ${JSON.stringify(res.body)}`);
      const body = res.body as PullResponse;
      phone.cursor = body.cursor;
      return body;
    },
    close: http.close,
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
  cpuMs: () => Promise<number>;
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
  const stop = async () => {
    api.close();
    await server.stop();
  };
  return { field, api, phones, cpuMs: server.cpuMs, stop };
}

/** (a) Every writer phone pushes its day, `endsPerBatch` ends per request, all phones at once. */
async function enterTheDay(
  endsPerBatch: number,
): Promise<{ seconds: number; mutations: number; requests: number; serverCpuMs: number }> {
  const { api, phones, cpuMs, stop } = await warmServer();
  try {
    let applied = 0;
    let requests = 0;
    const cpuBefore = await cpuMs();
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
    const serverCpuMs = (await cpuMs()) - cpuBefore;
    const expected = TARGETS * 4 * ENDS * 2;
    if (applied !== expected) throw new Error(`Expected ${expected} applied mutations, got ${applied}.`);
    return { seconds, mutations: applied, requests, serverCpuMs };
  } finally {
    await stop();
  }
}

/** The phones' pushes of `endsPerBatch` ends, in the order a server would see them (every phone's first, then second…). */
function rawBatchesOf(field: BenchField, endsPerBatch: number): RawBatch[] {
  const phones = field.writers.map((w) => phoneOf(field, w));
  const batches: RawBatch[] = [];
  for (let e = 0; e < ENDS; e += endsPerBatch) {
    for (const phone of phones) {
      batches.push({
        clientId: phone.clientId,
        userId: phone.writer.userId,
        eventId: field.eventId,
        targetNumber: phone.writer.target,
        mutations: phone.ends.slice(e, e + endsPerBatch).flat() as RawBatch['mutations'],
      });
    }
  }
  return batches;
}

/** Both raw baselines (bench/support/rawInserts.ts) on fresh files: end writes per second. */
async function rawRates(endsPerBatch: number): Promise<{ oneRow: number; sameRows: number }> {
  const file = freshFile();
  const batches = rawBatchesOf(await createBenchField(file, TARGETS), endsPerBatch);
  return { oneRow: rawOneRow(freshFile(), batches), sameRows: rawSameRows(file, batches) };
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
    const raw = await rawRates(endsPerBatch);
    const share = (of: number) => `${((rate / of) * 100).toFixed(0)} %`;
    console.log(
      `    ${endsPerBatch * 4} mutations per push (${run.requests} pushes): ${(run.seconds * 1000).toFixed(0)} ms, ${rate.toFixed(0)} ends/s ` +
        `(server CPU ${((run.serverCpuMs * 1000) / run.mutations).toFixed(0)} µs per end); raw better-sqlite3, one transaction per ${endsPerBatch * 4}: ` +
        `the same rows ${raw.sameRows.toFixed(0)} ends/s (${share(raw.sameRows)}), one row per end ${raw.oneRow.toFixed(0)} rows/s (${share(raw.oneRow)})`,
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
