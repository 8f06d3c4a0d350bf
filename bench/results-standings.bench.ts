/**
 * Standings for a 1,000-archer event (70 m round, 72 arrows each, both writers' records stored),
 * recomputed after a judge signs one end: with the card counts the server holds between changes,
 * and, for comparison, with every card read again. Also the cost of answering "nothing changed"
 * (the version read behind a 304). Each run checks that both give the same rows. Figures only;
 * written straight into a fresh database.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { getRound, type ArrowValue } from '../src/core';
import { migrate, openDb } from '../server/db';
import { heldCardCounts } from '../server/services/results/heldCardCounts';
import { computeResults } from '../server/services/results/standings';
import { findResultsEvent, resultsVersion } from '../server/services/results/resultsEvent';
import { percentile } from './support/stats';

const ARCHERS = 1_000;
const RUNS = 20;
const dir = mkdtempSync(join(tmpdir(), 'ringcall-bench-'));
const db = openDb(join(dir, 'bench.sqlite'));
await migrate(db);

const now = new Date().toISOString();
const [user] = await db('users')
  .insert({ email: 'b@x.example', display_name: 'Bench', created_at: now })
  .returning('id');
const userId = (user as { id: number }).id;
const [event] = await db('events')
  .insert({
    name: 'Bench',
    starts_on: '2026-12-12',
    ends_on: '2026-12-12',
    created_by: userId,
    created_at: now,
    updated_at: now,
  })
  .returning('id');
const eventId = (event as { id: number }).id;
const [session] = await db('event_sessions')
  .insert({ event_id: eventId, name: 'Q', starts_at: '2026-12-12T09:00' })
  .returning('id');
const sessionId = (session as { id: number }).id;
const [division] = await db('divisions')
  .insert({ event_id: eventId, bow_style: 'recurve', class_name: 'M', name: 'Recurve Men' })
  .returning('id');
const divisionId = (division as { id: number }).id;
await db('session_divisions').insert({
  session_id: sessionId,
  division_id: divisionId,
  round_id: '70m',
  round_json: JSON.stringify(getRound('70m')),
});

const values: ArrowValue[] = ['X', '10', '9', '8', '7', '6'];
const endOf = (i: number, e: number) => values.map((_, k) => values[(i + e + k) % values.length]!);
for (let i = 0; i < ARCHERS; i += 1) {
  const [entry] = await db('entries')
    .insert({
      event_id: eventId,
      division_id: divisionId,
      name: `Archer ${i}`,
      club: `Club ${i % 40}`,
      created_at: now,
    })
    .returning('id');
  const entryId = (entry as { id: number }).id;
  await db('target_assignments').insert({
    session_id: sessionId,
    entry_id: entryId,
    target_number: Math.floor(i / 4) + 1,
    position: 'ABCD'[i % 4],
  });
  const rows = Array.from({ length: 12 }, (_, e) =>
    [1, 2].map((slot) => ({
      session_id: sessionId,
      entry_id: entryId,
      end_index: e,
      slot,
      arrows_json: JSON.stringify(endOf(i, e)),
      flags_json: '[]',
      revision: 1,
      written_by: userId,
      written_at: now,
      mutation_id: `${entryId}-${e}-${slot}`,
    })),
  ).flat();
  await db('end_entries').insert(rows);
}

const entryIds = (await db('entries').where({ event_id: eventId }).orderBy('id').pluck('id')) as number[];
const held = heldCardCounts();
const resultsEvent = await findResultsEvent(db, eventId);
// The server's state before the first change: the event's counts already held once.
await computeResults(db, resultsEvent, held);

const heldMs: number[] = [];
// CPU time of the process too: on a machine shared with other work, wall time mostly measures the wait for a core.
const heldCpuMs: number[] = [];
const fullMs: number[] = [];
const versionMs: number[] = [];
for (let run = 0; run < RUNS + 2; run += 1) {
  // A judge signs one end (a different archer each run): the signature and its change-log row,
  // as the sync push writes them, so the version moves and that target's cards must be read again.
  const i = (run * 37) % ARCHERS;
  const endIndex = run % 12;
  await db('end_signatures').insert({
    session_id: sessionId,
    entry_id: entryIds[i],
    end_index: endIndex,
    arrows_json: JSON.stringify(endOf(i, endIndex)),
    content_hash: '0'.repeat(64),
    jws: 'bench',
    signed_by: userId,
    signed_at: now,
    mutation_id: `sign-${run}`,
  });
  await db('changes').insert({
    event_id: eventId,
    session_id: sessionId,
    target_number: Math.floor(i / 4) + 1,
    type: 'signature',
    record_json: '{}',
  });
  let t = performance.now();
  await resultsVersion(db, resultsEvent);
  const v = performance.now() - t;
  t = performance.now();
  const cpu = process.cpuUsage();
  const results = await computeResults(db, resultsEvent, held);
  const h = performance.now() - t;
  const hCpu = (({ user, system }) => (user + system) / 1000)(process.cpuUsage(cpu));
  t = performance.now();
  const full = await computeResults(db, resultsEvent);
  const f = performance.now() - t;
  const rows = results.sessions[0]!.divisions[0]!.rows;
  if (rows.length !== ARCHERS) throw new Error('bench: wrong field size');
  if (JSON.stringify(rows) !== JSON.stringify(full.sessions[0]!.divisions[0]!.rows))
    throw new Error('bench: the held counts disagree with a full recomputation');
  if (run >= 2) {
    heldMs.push(h);
    heldCpuMs.push(hCpu);
    fullMs.push(f);
    versionMs.push(v);
  }
}
const figures = (ms: number[], digits = 1) =>
  `p50 ${percentile(ms, 50).toFixed(digits)} ms, p95 ${percentile(ms, 95).toFixed(digits)} ms`;
console.log(`results: ${ARCHERS} archers × 72 arrows, ${RUNS} runs, one end signed before each`);
console.log(`  standings after one signed end, counts held:  ${figures(heldMs)} (goal p95 ≤ 20 ms)`);
console.log(`  the same, CPU time of the process:           ${figures(heldCpuMs)}`);
console.log(`  the same, every card read again (compared to): ${figures(fullMs)}`);
console.log(`  version read behind a 304:                    ${figures(versionMs, 2)}`);
await db.destroy();
rmSync(dir, { recursive: true, force: true });
