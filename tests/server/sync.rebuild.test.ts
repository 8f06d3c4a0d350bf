import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ARROW_VALUES, type ArrowValue } from '../../src/core';
import type { Mutation } from '../../src/contract/sync';
import {
  readFieldState,
  rebuildFromLog,
  replayLog,
  sortFieldState,
} from '../../server/services/sync/rebuildFromLog';
import { targetEndViews } from '../../server/services/sync/targetEndViews';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';
import { Phone } from './support/phone';

/*
 * The log is the source of truth: replaying the applied mutations in order gives exactly the
 * current writer records and settlements, after a random run of writes, settlements (some
 * stale), rule breaks, duplicates, reordered and split batches.
 */

/** A small seeded generator (mulberry32), so a failing run can be repeated. */
function random(seed: number) {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const int = (n: number) => Math.floor(next() * n);
  return { next, int, pick: <T>(xs: readonly T[]): T => xs[int(xs.length)]! };
}

let server: TestServer;
let field: Field;
beforeAll(async () => {
  server = await startTestServer();
  field = await setUpMixedField(server.db);
});
afterAll(async () => {
  await server.close();
});

type Seat = {
  phone: Phone;
  target: number;
  task: 'writer1' | 'writer2' | 'caller';
  waiting: Mutation[];
  sent: Mutation[][];
};

async function randomRun(seed: number, steps: number) {
  const rnd = random(seed);
  const seats: Seat[] = [];
  for (const target of [1, 2]) {
    for (const task of ['writer1', 'writer2', 'caller'] as const) {
      const phone = new Phone(server.app, await makePerson(server.db, `${task} ${target} (${seed})`));
      await phone.join(field.targets.get(target)!.code, task);
      seats.push({ phone, target, task, waiting: [], sent: [] });
    }
  }
  const arrowsFor = (n: number): ArrowValue[] => Array.from({ length: n }, () => rnd.pick(ARROW_VALUES));
  const outcomes = { applied: 0, rejected: 0, duplicate: 0, held: 0, settled: 0 };

  for (let step = 0; step < steps; step += 1) {
    const seat = rnd.pick(seats);
    // Mostly the seat's own target, sometimes another (refused); mostly ends in range.
    const target = rnd.next() < 0.9 ? seat.target : 3 - seat.target;
    const archer = rnd.pick(field.targets.get(target)!.archers);
    const perEnd = archer.division === 'Recurve Women' ? 6 : 3;
    const endIndex = rnd.next() < 0.95 ? rnd.int(3) : 40;
    const where = { sessionId: field.sessionId, entryId: archer.entryId, endIndex };
    if (seat.task === 'caller') {
      const rows = await server
        .db('end_entries')
        .where({ session_id: field.sessionId, entry_id: archer.entryId, end_index: endIndex })
        .select('slot', 'revision');
      const rev = (slot: number) => rows.find((r) => r.slot === slot)?.revision ?? 0;
      const stale = rnd.next() < 0.2 ? 1 : 0;
      const disputed = rnd.next() < 0.2 ? [rnd.int(perEnd)] : [];
      seat.waiting.push(
        seat.phone.settle({
          ...where,
          arrows: arrowsFor(perEnd),
          basis: { first: rev(1), second: Math.max(0, rev(2) - stale) },
          disputed,
        }),
      );
    } else {
      // Values from the whole card, so compound and six-ring ends are sometimes refused.
      const few = rnd.next() < 0.15 ? ['M', '1', '2', '3', '4'] : ['10', '9', '9', '8', '8', '7', 'X', 'M'];
      const n = rnd.next() < 0.9 ? perEnd : rnd.int(perEnd + 2);
      const arrows = Array.from({ length: n }, () => rnd.pick(few)) as ArrowValue[];
      seat.waiting.push(seat.phone.write({ ...where, slot: seat.task === 'writer1' ? 1 : 2, arrows }));
    }

    if (rnd.next() < 0.4) {
      const count = 1 + rnd.int(seat.waiting.length);
      const batch = seat.waiting.splice(0, count);
      if (rnd.next() < 0.3) batch.reverse();
      seat.sent.push(batch);
      const res = await seat.phone.push(batch);
      for (const r of res.results) outcomes[r.status] += 1;
      expect(res.expectedSeq).toBeUndefined();
    }
    if (rnd.next() < 0.1 && seat.sent.length > 0) {
      const again = await seat.phone.push(rnd.pick(seat.sent));
      expect(again.results.every((r) => r.status !== 'applied')).toBe(true);
      outcomes.duplicate += again.results.length;
    }
  }
  for (const seat of seats) {
    if (seat.waiting.length > 0) {
      const res = await seat.phone.push(seat.waiting.splice(0));
      for (const r of res.results) outcomes[r.status] += 1;
    }
  }
  outcomes.settled = Number((await server.db('end_settlements').count({ n: '*' }).first())?.n ?? 0);
  return outcomes;
}

describe('rebuildFromLog', () => {
  it('the replay of the log equals the current tables after a random run, and rebuilding changes nothing', async () => {
    const outcomes = await randomRun(20261212, 400);
    // The run must have exercised every path to mean something.
    expect(outcomes.applied).toBeGreaterThan(100);
    expect(outcomes.rejected).toBeGreaterThan(20);
    expect(outcomes.duplicate).toBeGreaterThan(5);
    expect(outcomes.settled).toBeGreaterThan(0);

    const current = await readFieldState(server.db);
    expect(current.endEntries.length).toBeGreaterThan(10);
    expect(sortFieldState(await replayLog(server.db))).toEqual(current);

    const viewsBefore = [
      await targetEndViews(server.db, field.sessionId, 1),
      await targetEndViews(server.db, field.sessionId, 2),
    ];
    await server.db('end_entries').update({ arrows_json: '["M"]' }); // damage the current tables…
    await server.db('end_settlements').delete();
    await rebuildFromLog(server.db); // …and rebuild them from the log.
    expect(await readFieldState(server.db)).toEqual(current);
    expect([
      await targetEndViews(server.db, field.sessionId, 1),
      await targetEndViews(server.db, field.sessionId, 2),
    ]).toEqual(viewsBefore);
  });
});
