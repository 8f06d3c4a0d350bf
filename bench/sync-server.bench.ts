/**
 * The field loop's server under a tournament's load, through the real HTTP app on loopback with
 * the server in a child process (phones and server never share an event loop). Figures only.
 * The phones speak JSON over node:http with kept-alive connections (support/jsonClient.ts):
 * with fetch they used about five times the CPU per request, and on a two-core machine that
 * measured the phones more than the server.
 *
 * Every phone sends what the pad sends (support/padPhone.ts): one end.write change per tap
 * carrying the end as typed so far, so six changes per archer's end; the sync loop waits for a
 * pause in typing, so one push holds one archer's end; every push is followed by a pull, as
 * `src/local/syncEngine.ts` does it (phones of this version ask for both in one round trip,
 * older phones push and then pull: both are measured).
 *
 * (a) A 200-archer, 72-arrow day entered by two writers per target: 50 targets × 4 archers ×
 *     12 ends × 2 writers × 6 taps = 28,800 changes in 4,800 pushes, all 100 phones at once with
 *     no pause (the whole day as fast as the server takes it). Wall time, the server's own CPU,
 *     and the rate against raw better-sqlite3 writing what the server must keep of the same day
 *     (support/rawInserts.ts) with the same number of commits, in the same run; and the floor of
 *     any server on this machine: a bare node:http server answering the same pushes with JSON of
 *     the same size and nothing else (support/bareServerChild.ts), in the same run.
 * (b) 100 phones syncing once a second: each phone, once at a random moment in every second,
 *     sends an archer's end (six taps) and pulls. Latency p50/p99 of each sync.
 * (c) What a pull costs: a phone that has just joined one target pulls it from the start, after
 *     one day of data and after ten (nine earlier days of other sessions in the same database).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import {
  createBenchField,
  startBareServerChild,
  startServerChild,
  type BenchField,
} from './support/syncField';
import { jsonClient } from './support/jsonClient';
import { padPhones, syncRound, type RoundTrips } from './support/padPhone';
import { rawDay, type RawPush } from './support/rawInserts';
import { addEarlierDays } from './support/earlierDays';
import { median, percentile } from './support/stats';

const TARGETS = 50;
const ENDS = 12;
const dir = mkdtempSync(join(tmpdir(), 'ringcall-sync-bench-'));
let dbCounter = 0;
const freshFile = () => join(dir, `sync-${(dbCounter += 1)}.sqlite`);

/**
 * A started server on a fresh field, warmed up (a just-started process compiles its hot paths
 * on the first few hundred requests) by the two writers of one extra target that the measured
 * phones never see.
 */
async function warmServer(prepare?: (file: string, field: BenchField) => void, bare = false) {
  const file = freshFile();
  const field = await createBenchField(file, TARGETS + 1);
  prepare?.(file, field);
  const server = bare ? await startBareServerChild() : await startServerChild(file);
  const http = jsonClient(server.port);
  const warm = padPhones(field, ENDS, (w) => w.target > TARGETS, 'warm');
  await Promise.all(
    warm.map(async (phone) => {
      for (let i = 0; i < phone.pushes.length; i += 1)
        await syncRound(http, phone, i % 2 === 0 ? 'one' : 'two');
    }),
  );
  const phones = padPhones(field, ENDS, (w) => w.target <= TARGETS, 'bench');
  const stop = async () => {
    http.close();
    await server.stop();
  };
  return { field, file, http, phones, cpuMs: server.cpuMs, stop };
}

/**
 * (a) Every phone sends its day, one archer's end per push, each push followed by a pull. With
 * `bare`, to the floor (support/bareServerChild.ts) instead of the app.
 */
async function enterTheDay(trips: RoundTrips, bare = false) {
  const { http, phones, cpuMs, stop } = await warmServer(undefined, bare);
  try {
    // Phones that have talked to the server before: their connections are open (kept alive).
    await Promise.all(phones.map((phone) => http.get('/api/sync/pull?cursor=0&limit=1', phone.writer.token)));
    let applied = 0;
    let requests = 0;
    const cpuBefore = await cpuMs();
    const started = performance.now();
    await Promise.all(
      phones.map(async (phone) => {
        for (let i = 0; i < phone.pushes.length; i += 1) {
          const round = await syncRound(http, phone, trips, i);
          applied += round.applied;
          requests += round.requests;
        }
      }),
    );
    const seconds = (performance.now() - started) / 1000;
    const serverCpuMs = (await cpuMs()) - cpuBefore;
    const expected = phones.reduce((n, p) => n + p.pushes.flat().length, 0);
    if (applied !== expected) throw new Error(`Expected ${expected} applied changes, got ${applied}.`);
    return {
      seconds,
      taps: applied,
      pushes: phones.length * phones[0]!.pushes.length,
      requests,
      serverCpuMs,
    };
  } finally {
    await stop();
  }
}

/** The same day as the raw baseline gets it: every phone's first push, then every second one… */
async function rawRate(): Promise<number> {
  const file = freshFile();
  const field = await createBenchField(file, TARGETS);
  const phones = padPhones(field, ENDS, () => true, 'raw');
  const pushes: RawPush[] = [];
  for (let i = 0; i < phones[0]!.pushes.length; i += 1) {
    for (const phone of phones)
      pushes.push({
        clientId: phone.clientId,
        userId: phone.writer.userId,
        eventId: field.eventId,
        targetNumber: phone.writer.target,
        changes: phone.pushes[i]!,
      });
  }
  return rawDay(file, pushes);
}

/** (b) Each phone syncs an archer's end once at a random moment in each second, `rounds` times. */
async function oncePerSecond(trips: RoundTrips, rounds: number) {
  const { http, phones, stop } = await warmServer();
  try {
    const syncs: number[] = [];
    const started = performance.now() + 200;
    await Promise.all(
      phones.map(async (phone) => {
        for (let i = 0; i < rounds; i += 1) {
          const at = started + i * 1000 + Math.random() * 900;
          await new Promise((r) => setTimeout(r, Math.max(0, at - performance.now())));
          const t = performance.now();
          await syncRound(http, phone, trips, i);
          syncs.push(performance.now() - t);
        }
      }),
    );
    return syncs;
  } finally {
    await stop();
  }
}

/** (c) A phone that joined target 1 pulls it from the start: ms per whole pull, median of 30. */
async function pullAfterDays(days: number) {
  const { http, phones, field, stop } = await warmServer((file, f) => addEarlierDays(file, f, days - 1));
  try {
    // Today's day, sent as the phones send it, after the earlier days.
    await Promise.all(
      phones.map(async (phone) => {
        for (let i = 0; i < phone.pushes.length; i += 1) await syncRound(http, phone, 'two', i);
      }),
    );
    const reader = field.writers.find((w) => w.target === 1)!;
    const times: number[] = [];
    let pulled = 0;
    for (let run = 0; run < 30; run += 1) {
      const t = performance.now();
      pulled = 0;
      for (let cursor = 0, more = true; more;) {
        const res = await http.get(`/api/sync/pull?cursor=${cursor}`, reader.token);
        const body = res.body as { changes: unknown[]; cursor: number; hasMore: boolean };
        pulled += body.changes.length;
        cursor = body.cursor;
        more = body.hasMore;
      }
      times.push(performance.now() - t);
    }
    return { ms: median(times), pulled };
  } finally {
    await stop();
  }
}

/**
 * `SYNC_BENCH_PARTS=a,c` runs only those parts (each takes a minute or more on a busy machine);
 * `SYNC_BENCH_TRIPS=one` only this version's phones in (a).
 */
const parts = (process.env.SYNC_BENCH_PARTS ?? 'a,b,c').split(',');
const tripsToRun = (['one', 'two'] as const).filter((t) =>
  (process.env.SYNC_BENCH_TRIPS ?? 'one,two').includes(t),
);
const ms = (n: number) => `${n.toFixed(1)} ms`;
const day = TARGETS * 4 * ENDS * 2;

try {
  if (parts.includes('a'))
    console.log(
      `(a) ${TARGETS * 4} archers × 72 arrows, two writers per target, as the pad sends it: ${day * 6} taps (one change each) ` +
        `in ${day} pushes (one archer's end each), every push followed by a pull, 100 phones at once`,
    );
  const raw = parts.includes('a') ? await rawRate() : 0;
  if (parts.includes('a')) {
    const bare = await enterTheDay('one', true);
    console.log(
      `    floor, a bare node:http server answering the same pushes (JSON of the same size, nothing else): ` +
        `${bare.requests} requests in ${(bare.seconds * 1000).toFixed(0)} ms wall; ` +
        `its CPU ${(bare.serverCpuMs / 1000).toFixed(2)} s (${((bare.serverCpuMs * 1000) / bare.pushes).toFixed(0)} µs per push)`,
    );
  }
  for (const trips of parts.includes('a') ? tripsToRun : []) {
    const run = await enterTheDay(trips);
    const rate = run.taps / run.seconds;
    console.log(
      `    ${trips === 'one' ? 'push answering the pull (one round trip, this version)' : 'push, then pull (older phones)'}: ` +
        `${run.requests} requests in ${(run.seconds * 1000).toFixed(0)} ms wall, ${rate.toFixed(0)} taps/s; ` +
        `server CPU ${(run.serverCpuMs / 1000).toFixed(2)} s (${((run.serverCpuMs * 1000) / run.pushes).toFixed(0)} µs per push); ` +
        `raw better-sqlite3, the rows the server keeps, ${run.pushes} commits: ${raw.toFixed(0)} taps/s → ${((rate / raw) * 100).toFixed(0)} % of raw`,
    );
  }

  for (const trips of parts.includes('b') ? (['one', 'two'] as const) : []) {
    const syncs = await oncePerSecond(trips, 12);
    console.log(
      `(b) 100 phones each syncing an archer's end once a second (${trips === 'one' ? 'one round trip' : 'push, then pull'}), ${syncs.length} syncs: ` +
        `p50 ${ms(percentile(syncs, 50))} p99 ${ms(percentile(syncs, 99))}`,
    );
  }

  if (parts.includes('c')) {
    const one = await pullAfterDays(1);
    const ten = await pullAfterDays(10);
    console.log(
      `(c) a phone that joined a target pulls it from the start (${one.pulled} / ${ten.pulled} changes): after 1 day ${ms(one.ms)}, ` +
        `after 10 days ${ms(ten.ms)} (median of 30)`,
    );
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}
