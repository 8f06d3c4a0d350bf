import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { Mutation, PushResponse } from '../../src/contract/sync';
import { pushBatch } from '../../server/services/sync/pushBatch';
import { readFieldState, replayLog, sortFieldState } from '../../server/services/sync/rebuildFromLog';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson, type TestPerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';
import { Phone } from './support/phone';

/*
 * Pushes that reach the server together are committed together (group commit), yet each is
 * answered exactly as if it had been committed on its own: sequence, duplicates and gaps per
 * phone, and one push's refusal or failure never touches another. The pushes below are started
 * in the same turn of the event loop, so they land in one group.
 */

let server: TestServer;
let field: Field;
let one: TestPerson;
let two: TestPerson;
let oneB: TestPerson;
beforeAll(async () => {
  server = await startTestServer();
  field = await setUpMixedField(server.db);
  one = await makePerson(server.db, 'Wren One');
  two = await makePerson(server.db, 'Wyn Two');
  oneB = await makePerson(server.db, 'Wade One');
  await new Phone(server.app, one).join(field.targets.get(1)!.code, 'writer1');
  await new Phone(server.app, two).join(field.targets.get(1)!.code, 'writer2');
  await new Phone(server.app, oneB).join(field.targets.get(2)!.code, 'writer1');
});
afterAll(async () => {
  await server.close();
});

const SIX: ArrowValue[] = ['X', '10', '9', '9', '8', '7'];
const THREE: ArrowValue[] = ['10', '9', '9'];
let nextEnd = -1;
const freshEnd = () => (nextEnd += 1);

const write = (phone: Phone, endIndex: number, slot: 1 | 2 = 1, position: 'A' | 'B' = 'A') =>
  phone.write({
    sessionId: field.sessionId,
    entryId: field.archer(phone.person === oneB ? 2 : 1, position).entryId,
    endIndex,
    slot,
    arrows: phone.person === oneB ? THREE : SIX,
  });
const push = (phone: Phone, mutations: Mutation[]) =>
  pushBatch(server.db, phone.person.id, { clientId: phone.clientId, mutations });
const statuses = (res: PushResponse) => res.results.map((r) => r.status);
const settle = (p: Promise<PushResponse>) =>
  p.then(
    (value) => ({ value }),
    (error: { status?: number; message: string }) => ({ error }),
  );

describe('pushes committed together', () => {
  it('answers each push for its own mutations and logs them in the order they arrived', async () => {
    const a = new Phone(server.app, one);
    const b = new Phone(server.app, two);
    const c = new Phone(server.app, oneB);
    const end = freshEnd();
    const ma = [write(a, end), write(a, end, 1, 'B')];
    const mb = [write(b, end, 2)];
    const mc = [write(c, end)];
    const [ra, rb, rc] = await Promise.all([push(a, ma), push(b, mb), push(c, mc)]);
    expect(ra).toEqual({
      results: ma.map((m) => ({ seq: m.seq, id: m.id, status: 'applied' })),
      lastSeq: 2,
    });
    expect(rb).toEqual({ results: [{ seq: 1, id: mb[0]!.id, status: 'applied' }], lastSeq: 1 });
    expect(statuses(rc!)).toEqual(['applied']);
    const logged = await server.db('mutations').orderBy('id', 'desc').limit(4).pluck('mutation_uuid');
    expect(logged.reverse()).toEqual([...ma, ...mb, ...mc].map((m) => m.id));
  });

  it('applies the same batch sent twice at once only once: the second is answered as a duplicate', async () => {
    const phone = new Phone(server.app, one);
    const end = freshEnd();
    const batch = [write(phone, end), write(phone, end, 1, 'B')];
    const [first, second] = await Promise.all([push(phone, batch), push(phone, batch)]);
    expect(statuses(first!)).toEqual(['applied', 'applied']);
    expect(statuses(second!)).toEqual(['duplicate', 'duplicate']);
    expect(await server.db('mutations').where({ client_id: phone.clientId }).count({ n: '*' })).toEqual([
      { n: 2 },
    ]);
    const row = await server
      .db('end_entries')
      .where({ session_id: field.sessionId, entry_id: field.archer(1, 'A').entryId, end_index: end, slot: 1 })
      .first();
    expect(row.revision).toBe(1);
  });

  it('follows a phone’s earlier push in the same commit: the next numbers apply, a gap stops', async () => {
    const phone = new Phone(server.app, one);
    const end = freshEnd();
    const [m1, m2, m3, , m5] = [1, 2, 3, 4, 5].map(() => write(phone, end));
    const [a, b, c] = await Promise.all([push(phone, [m1!, m2!]), push(phone, [m3!]), push(phone, [m5!])]);
    expect(statuses(a!)).toEqual(['applied', 'applied']);
    expect(b).toEqual({ results: [{ seq: 3, id: m3!.id, status: 'applied' }], lastSeq: 3 });
    expect(c).toEqual({ results: [], lastSeq: 3, expectedSeq: 4 });
  });

  it('refuses a push under another account’s phone on its own; the others in its commit are kept', async () => {
    const owner = new Phone(server.app, one);
    await push(owner, [write(owner, freshEnd())]);
    const intruder = new Phone(server.app, two, owner.clientId);
    const other = new Phone(server.app, two);
    const end = freshEnd();
    const before = await server.db('mutations').count({ n: '*' }).first();
    const [refused, kept] = await Promise.all([
      settle(push(intruder, [{ ...write(intruder, end, 2), seq: 2 }])),
      settle(push(other, [write(other, end, 2)])),
    ]);
    expect(refused).toMatchObject({ error: { status: 403 } });
    expect(kept).toMatchObject({ value: { results: [{ status: 'applied' }] } });
    const after = await server.db('mutations').count({ n: '*' }).first();
    expect(Number(after!.n) - Number(before!.n)).toBe(1);
  });

  it('loses only the push that fails unexpectedly; the others in its commit are kept', async () => {
    const judge = new Phone(server.app, field.judge);
    const writer = new Phone(server.app, one);
    // Signing needs the server's key; without it the push fails as a server error would.
    const sign = judge.sign({
      sessionId: field.sessionId,
      entryId: field.archer(1, 'A').entryId,
      endIndex: 0,
      arrows: SIX,
    });
    const m = write(writer, freshEnd());
    const [failed, kept] = await Promise.all([settle(push(judge, [sign])), settle(push(writer, [m]))]);
    expect(failed).toMatchObject({ error: { message: expect.stringContaining('signing keys') } });
    expect(kept).toMatchObject({ value: { results: [{ id: m.id, status: 'applied' }] } });
    expect(await server.db('mutations').where({ client_id: judge.clientId }).first()).toBeUndefined();
    expect(await server.db('sync_clients').where({ client_id: judge.clientId }).first()).toBeUndefined();
    expect(await server.db('mutations').where({ mutation_uuid: m.id }).first()).toMatchObject({
      status: 'applied',
    });
  });

  it('leaves a log whose replay equals the live tables', async () => {
    expect(sortFieldState(await replayLog(server.db))).toEqual(await readFieldState(server.db));
  });
});
