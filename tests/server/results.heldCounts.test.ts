import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { EventResults } from '../../src/contract/results';
import type { ArrowValue } from '../../src/core';
import { heldCardCounts } from '../../server/services/results/heldCardCounts';
import { findResultsEvent } from '../../server/services/results/resultsEvent';
import { computeResults } from '../../server/services/results/standings';
import {
  agreeEnds,
  expectApplied,
  pushOne,
  setUpJudging,
  signEnds,
  twelveEnds,
  writeBoth,
  type JudgingField,
} from './support/judging';
import { startTestServer, type TestServer } from './support/testServer';

let server: TestServer;
let j: JudgingField;

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
});
afterAll(() => server.close());

const held = heldCardCounts();
const sessions = (r: EventResults) => r.sessions;

/** Standings from the held counts, checked against a computation that reads every card. */
async function heldEqualsFull(): Promise<EventResults> {
  const event = await findResultsEvent(server.db, j.field.eventId);
  const kept = await computeResults(server.db, event, held);
  const full = await computeResults(server.db, event);
  expect(sessions(kept)).toEqual(sessions(full));
  return kept;
}
/** The judge rules one end (with the given values). */
async function rule(entryId: number, endIndex: number, arrows: ArrowValue[], reason: string) {
  const judge = j.phones.judge;
  expectApplied([
    await pushOne(judge, judge.rule({ sessionId: j.sessionId, entryId, endIndex, arrows, reason })),
  ]);
}
const rowOf = (r: EventResults, entryId: number) =>
  r.sessions[0]!.divisions.flatMap((d) => d.rows).find((row) => row.entryId === entryId)!;

describe('results: held card counts', () => {
  it('equal a full recomputation after writes, rulings, signatures and card signatures', async () => {
    const ada = j.ada.entryId;
    const bea = j.field.archer(1, 'B').entryId;
    expect(rowOf(await heldEqualsFull(), ada).total).toBe(0);

    await agreeEnds(j, ada, twelveEnds());
    expect(rowOf(await heldEqualsFull(), ada)).toMatchObject({ endsShot: 12, trust: 'provisional' });

    // Writers disagree on Bea's end: nothing counts until the judge rules.
    await writeBoth(j, bea, 0, ['9', '9', '9', '9', '9', '9'], ['9', '9', '9', '9', '9', '8']);
    expect(rowOf(await heldEqualsFull(), bea).endsShot).toBe(0);
    await rule(bea, 0, ['10', '9', '9', '9', '9', '9'], 'Line cutter seen by the judge');
    expect(rowOf(await heldEqualsFull(), bea)).toMatchObject({ total: 55, tens: 1, endsShot: 1 });

    // Signed ends, then a ruling that replaces one signature.
    expectApplied(await signEnds(server, j, ada, [0, 1]));
    const before = rowOf(await heldEqualsFull(), ada).total;
    await rule(ada, 1, ['X', '10', '10', '8', '8', '6'], 'Arrow re-scored at the target');
    const ruled = rowOf(await heldEqualsFull(), ada);
    expect(ruled.total).toBe(before + 1);

    // The other ends signed (the ruled one again), then the card by archer and scorer: final.
    expectApplied(await signEnds(server, j, ada, [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11]));
    expect(rowOf(await heldEqualsFull(), ada).trust).toBe('signed');
    const card = { sessionId: j.sessionId, entryId: ada, total: ruled.total };
    expectApplied([await pushOne(j.phones.ada, j.phones.ada.signCard({ ...card, role: 'archer' }))]);
    expectApplied([await pushOne(j.phones.writer1, j.phones.writer1.signCard({ ...card, role: 'scorer' }))]);
    expect(rowOf(await heldEqualsFull(), ada).trust).toBe('final');
  });
});
