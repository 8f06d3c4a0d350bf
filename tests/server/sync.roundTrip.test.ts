import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { EndRecordDto, Mutation, PushResponse } from '../../src/contract/sync';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson, type TestPerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';
import { Phone, fieldTableCounts } from './support/phone';

/*
 * One round trip per sync: a push that carries the phone's pull cursor is answered with the pull
 * too, read after the push was committed. A push without it (older phones) is answered as before.
 */

let server: TestServer;
let field: Field;
let people: Record<'w1' | 'w2' | 'other', TestPerson>;

beforeAll(async () => {
  server = await startTestServer();
  field = await setUpMixedField(server.db);
  people = {
    w1: await makePerson(server.db, 'Rhea One'),
    w2: await makePerson(server.db, 'Rory Two'),
    other: await makePerson(server.db, 'Odo Elsewhere'),
  };
  await new Phone(server.app, people.w1).join(field.targets.get(1)!.code, 'writer1');
  await new Phone(server.app, people.w2).join(field.targets.get(1)!.code, 'writer2');
  await new Phone(server.app, people.other).join(field.targets.get(2)!.code, 'writer1');
});
afterAll(async () => {
  await server.close();
});

const post = (person: TestPerson, body: object) =>
  request(server.app).post('/api/sync/push').set(person.auth).send(body);

const write = (phone: Phone, target: number, endIndex: number, slot: 1 | 2, arrows: ArrowValue[]): Mutation =>
  phone.write({
    sessionId: field.sessionId,
    entryId: field.archer(target, 'A').entryId,
    endIndex,
    slot,
    arrows,
  });

describe('a push that carries the pull cursor', () => {
  it('is answered with what the phone has not seen, its own push included, and nothing of other targets', async () => {
    const w1 = new Phone(server.app, people.w1);
    const w2 = new Phone(server.app, people.w2);
    const other = new Phone(server.app, people.other);
    await w2.push([write(w2, 1, 0, 2, ['9', '8'])]);
    await other.push([write(other, 2, 0, 1, ['7'])]);
    const cursor = (await w1.pull(0)).cursor;
    await w2.push([write(w2, 1, 0, 2, ['9', '8', '7'])]);

    const res = await post(people.w1, {
      clientId: w1.clientId,
      mutations: [write(w1, 1, 0, 1, ['X'])],
      cursor,
    });
    expect(res.status).toBe(200);
    const body = res.body as PushResponse;
    expect(body.results.map((r) => r.status)).toEqual(['applied']);
    const records = body.pull!.changes.map((c) => c.record as EndRecordDto);
    expect(records.map((r) => [r.slot, r.arrows])).toEqual([
      [2, ['9', '8', '7']],
      [1, ['X']],
    ]);
    expect(body.pull!.hasMore).toBe(false);
    const top = Number((await server.db('changes').max({ v: 'version' }).first())?.v);
    expect(body.pull!.cursor).toBe(top);
  });

  it('is answered without a pull when the phone sends no cursor (older phones pull on their own)', async () => {
    const w1 = new Phone(server.app, people.w1, `phone-old-${Date.now()}`);
    const res = await post(people.w1, { clientId: w1.clientId, mutations: [write(w1, 1, 1, 1, ['8'])] });
    expect(res.status).toBe(200);
    expect(res.body).not.toHaveProperty('pull');
  });

  it('refuses a cursor that is not a whole number, storing nothing', async () => {
    const before = await fieldTableCounts(server.db);
    const w1 = new Phone(server.app, people.w1);
    const res = await post(people.w1, {
      clientId: w1.clientId,
      mutations: [write(w1, 1, 2, 1, ['8'])],
      cursor: -1,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toContain('cursor must be a whole number');
    expect(await fieldTableCounts(server.db)).toEqual(before);
  });
});

describe('a record written several times in one commit', () => {
  it('is stored once in its final state, with one change row that phones pull', async () => {
    const w1 = new Phone(server.app, people.w1);
    const changesBefore = (await fieldTableCounts(server.db)).changes;
    const taps: ArrowValue[][] = [['X'], ['X', '9'], ['X', '9', '9'], ['X', '9', '9', '8']];
    const body = (await w1.push(taps.map((arrows) => write(w1, 1, 5, 1, arrows)))) as PushResponse;
    expect(body.results.map((r) => r.status)).toEqual(['applied', 'applied', 'applied', 'applied']);
    const counts = await fieldTableCounts(server.db);
    expect(counts.changes! - changesBefore!).toBe(1);
    const pulled = (await w1.pull(0)).changes
      .map((c) => c.record as EndRecordDto)
      .filter((r) => r.endIndex === 5);
    expect(pulled.map((r) => [r.arrows, r.revision])).toEqual([[['X', '9', '9', '8'], 4]]);
  });
});
