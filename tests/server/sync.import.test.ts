import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson, type TestPerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';
import { Phone } from './support/phone';

/* A phone that cannot sync saves its changes to a file; a judge of the event imports it. */

let server: TestServer;
let field: Field;
let writer: TestPerson;
let phone: Phone;
const SIX: ArrowValue[] = ['X', '10', '9', '9', '8', '7'];

beforeAll(async () => {
  server = await startTestServer();
  field = await setUpMixedField(server.db);
  writer = await makePerson(server.db, 'Offline Writer');
  phone = new Phone(server.app, writer);
  await phone.join(field.targets.get(1)!.code, 'writer1');
});
afterAll(async () => {
  await server.close();
});

function fileOf(mutations: ReturnType<Phone['write']>[]) {
  return {
    format: 'ringcall-waiting-changes',
    version: 1,
    exportedAt: new Date().toISOString(),
    clients: [
      {
        clientId: phone.clientId,
        userId: writer.id,
        mutations: mutations.map((m) => ({ ...m, status: 'pending' })),
      },
    ],
  };
}

describe('importing a phone’s waiting changes', () => {
  it('applies them as the phone’s person, once, however often the file is imported or the phone syncs later', async () => {
    const entryId = field.archer(1, 'A').entryId;
    const changes = [0, 1].map((endIndex) =>
      phone.write({ sessionId: field.sessionId, entryId, endIndex, slot: 1, arrows: SIX }),
    );
    const first = await request(server.app)
      .post(`/api/events/${field.eventId}/waiting-changes`)
      .set(field.judge.auth)
      .send(fileOf(changes));
    expect(first.status).toBe(200);
    expect(first.body.clients[0]).toMatchObject({ applied: 2, duplicates: 0 });

    const again = await request(server.app)
      .post(`/api/events/${field.eventId}/waiting-changes`)
      .set(field.judge.auth)
      .send(fileOf(changes));
    expect(again.body.clients[0]).toMatchObject({ applied: 0, duplicates: 2 });
    const pushed = await phone.push(changes);
    expect(pushed.results.map((r) => r.status)).toEqual(['duplicate', 'duplicate']);
    const rows = await server.db('end_entries').where({ entry_id: entryId, slot: 1 });
    expect(rows.map((r) => r.revision)).toEqual([1, 1]);
  });

  it('is for the event’s judges only', async () => {
    const change = phone.write({
      sessionId: field.sessionId,
      entryId: field.archer(1, 'B').entryId,
      endIndex: 0,
      slot: 1,
      arrows: SIX,
    });
    const denied = await request(server.app)
      .post(`/api/events/${field.eventId}/waiting-changes`)
      .set(field.organizer.auth)
      .send(fileOf([change]));
    expect(denied.status).toBe(403);
    expect(denied.body.error.message).toMatch(/judge/);
    expect(await server.db('end_entries').where({ entry_id: field.archer(1, 'B').entryId })).toHaveLength(0);
  });

  it('refuses a file that is not one, with a readable message, and stores nothing', async () => {
    const res = await request(server.app)
      .post(`/api/events/${field.eventId}/waiting-changes`)
      .set(field.judge.auth)
      .send({ format: 'something-else', version: 1, exportedAt: '', clients: [] });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/not a file of waiting changes/);
  });
});
