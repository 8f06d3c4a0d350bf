import request from 'supertest';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson, type TestPerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';
import { Phone } from './support/phone';

/*
 * The judge's import of a phone's waiting changes reads each change on its own, as a push does:
 * a change this server cannot read (a newer app's kind) is refused with its reason and never
 * keeps the changes behind it out.
 */

let server: TestServer;
let field: Field;
let writer: TestPerson;

beforeAll(async () => {
  server = await startTestServer();
  field = await setUpMixedField(server.db);
  writer = await makePerson(server.db, 'Offline Writer');
  await new Phone(server.app, writer).join(field.targets.get(1)!.code, 'writer1');
});
afterAll(async () => {
  await server.close();
});

it('refuses an unreadable change on its own and applies the ones behind it', async () => {
  const phone = new Phone(server.app, writer);
  const entryId = field.archer(1, 'A').entryId;
  const newer = {
    ...phone.write({ sessionId: field.sessionId, entryId, endIndex: 0, slot: 1, arrows: ['9'] }),
    kind: 'end.erase',
  };
  const behind = phone.write({ sessionId: field.sessionId, entryId, endIndex: 1, slot: 1, arrows: ['10'] });
  const res = await request(server.app)
    .post(`/api/events/${field.eventId}/waiting-changes`)
    .set(field.judge.auth)
    .send({
      format: 'ringcall-waiting-changes',
      version: 1,
      exportedAt: new Date().toISOString(),
      clients: [{ clientId: phone.clientId, userId: writer.id, mutations: [newer, behind] }],
    });
  expect(res.status).toBe(200);
  const [result] = res.body.clients;
  expect(result.results[0]).toMatchObject({ seq: 1, status: 'rejected' });
  expect(result.results[0].reason).toMatch(/Unknown kind of change/);
  expect(result.results[1]).toMatchObject({ seq: 2, status: 'applied' });
  expect(
    await server.db('end_entries').where({ entry_id: entryId, end_index: 1, slot: 1 }).first(),
  ).toBeTruthy();
});
