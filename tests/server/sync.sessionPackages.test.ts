import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SessionPackages, TargetPackage } from '../../src/contract/sync';
import { startTestServer, type TestServer } from './support/testServer';
import { giveRole, makePerson, type TestPerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';

/*
 * The judge desk loads a session's targets in one request: the same packages as one target at a
 * time, for the event's judges and organizers only.
 */

let server: TestServer;
let field: Field;
beforeAll(async () => {
  server = await startTestServer();
  field = await setUpMixedField(server.db);
});
afterAll(async () => {
  await server.close();
});

const all = (person: TestPerson, sessionId = field.sessionId) =>
  request(server.app).get(`/api/targets/${sessionId}`).set(person.auth);
const one = (person: TestPerson, target: number) =>
  request(server.app).get(`/api/targets/${field.sessionId}/${target}`).set(person.auth);

describe("a session's targets at once", () => {
  it('are the packages of every target with archers, as one target at a time gives them', async () => {
    const res = await all(field.judge);
    expect(res.status).toBe(200);
    const { targets } = res.body as SessionPackages;
    expect(targets.map((t) => [t.targetNumber, t.task, t.archers.map((a) => a.name)])).toEqual([
      [1, 'follower', ['Ada Fletcher', 'Bea Quill', 'Cora Nock']],
      [2, 'follower', ['Dan Vane', 'Eli Shaft', 'Fay Limb']],
    ]);
    for (const t of targets)
      expect(t).toEqual((await one(field.judge, t.targetNumber)).body as TargetPackage);
    expect((await all(field.organizer)).status).toBe(200);
  });

  it("carry a judge's own task on a target they joined", async () => {
    const judge = await makePerson(server.db, 'Writing Judge');
    await giveRole(server.db, field.eventId, judge, 'judge');
    const joined = await request(server.app)
      .post('/api/join')
      .set(judge.auth)
      .send({ code: field.targets.get(2)!.code, task: 'caller' });
    expect(joined.status).toBe(200);
    const { targets } = (await all(judge)).body as SessionPackages;
    expect(targets.map((t) => t.task)).toEqual(['follower', 'caller']);
  });

  it('are refused to an archer of the event, a writer of one target and a judge of another event', async () => {
    const archer = await makePerson(server.db, 'Event Archer');
    await giveRole(server.db, field.eventId, archer, 'archer');
    const writer = await makePerson(server.db, 'Target Writer');
    await request(server.app)
      .post('/api/join')
      .set(writer.auth)
      .send({ code: field.targets.get(1)!.code, task: 'writer1' });
    expect((await one(writer, 1)).status).toBe(200);
    const other = await setUpMixedField(server.db);
    for (const person of [archer, writer, other.judge]) {
      const res = await all(person);
      expect(res.status).toBe(403);
      expect(res.body.error.message).toBe(
        "Only the event's judges and organizers can load all of a session's targets.",
      );
    }
  });

  it('answer 404 for a session that does not exist, and ask for a sign-in', async () => {
    const res = await all(field.judge, 999_999);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('That session does not exist.');
    expect((await request(server.app).get(`/api/targets/${field.sessionId}`)).status).toBe(401);
    expect((await request(server.app).get('/api/targets/abc').set(field.judge.auth)).status).toBe(404);
  });
});
