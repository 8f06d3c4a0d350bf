/**
 * Standings for a 1,000-archer event (70 m round, 72 arrows each, both writers' records stored),
 * recomputed after one end changes, and the cost of answering "nothing changed" (the version
 * read behind a 304). Figures only; written straight into a fresh database.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { getRound, type ArrowValue } from '../src/core';
import { migrate, openDb } from '../server/db';
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

const computeMs: number[] = [];
const versionMs: number[] = [];
for (let run = 0; run < RUNS + 2; run += 1) {
  // One end changes (as a signed end does), so the version moves and the standings are computed.
  await db('changes').insert({
    event_id: eventId,
    session_id: sessionId,
    target_number: 1,
    type: 'end',
    record_json: '{}',
  });
  const resultsEvent = await findResultsEvent(db, eventId);
  let t = performance.now();
  await resultsVersion(db, resultsEvent);
  const v = performance.now() - t;
  t = performance.now();
  const results = await computeResults(db, resultsEvent);
  const c = performance.now() - t;
  if (results.sessions[0]!.divisions[0]!.rows.length !== ARCHERS) throw new Error('bench: wrong field size');
  if (run >= 2) {
    computeMs.push(c);
    versionMs.push(v);
  }
}
console.log(`results: ${ARCHERS} archers × 72 arrows, ${RUNS} runs`);
console.log(
  `  standings recomputed after one change: p50 ${percentile(computeMs, 50).toFixed(1)} ms, p95 ${percentile(computeMs, 95).toFixed(1)} ms (goal ≤ 20 ms)`,
);
console.log(
  `  version read behind a 304:            p50 ${percentile(versionMs, 50).toFixed(2)} ms, p95 ${percentile(versionMs, 95).toFixed(2)} ms`,
);
await db.destroy();
rmSync(dir, { recursive: true, force: true });
