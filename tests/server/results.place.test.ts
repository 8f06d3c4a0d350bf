import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArcherPlace } from '../../src/contract/archerPlace';
import { agreeEnds, setUpJudging, type JudgingField } from './support/judging';
import { giveRole, makePerson, type TestPerson } from './support/people';
import { startTestServer, type TestServer } from './support/testServer';

let server: TestServer;
let j: JudgingField;
let bea: TestPerson;
const ids = { ada: 0, bea: 0, cora: 0 };

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
  ids.ada = j.ada.entryId;
  ids.bea = j.field.archer(1, 'B').entryId;
  ids.cora = j.field.archer(1, 'C').entryId;
  // Bea, another archer of the event, with an account of her own.
  bea = await makePerson(server.db, 'Bea Archer');
  await server.db('entries').where({ id: ids.bea }).update({ user_id: bea.id });
  await giveRole(server.db, j.field.eventId, bea, 'archer');
});
afterAll(() => server.close());

const place = (entryId: number, auth?: { Authorization: string }) => {
  const req = request(server.app).get(`/api/places/${j.sessionId}/${entryId}`);
  return auth ? req.set(auth) : req;
};

describe("an archer's live place", () => {
  it('before the results are published: the archer, organizers and judges only', async () => {
    expect((await place(ids.ada, j.people.ada.auth)).status).toBe(200);
    expect((await place(ids.ada, j.field.organizer.auth)).status).toBe(200);
    expect((await place(ids.ada, j.field.judge.auth)).status).toBe(200);
    const other = await place(ids.ada, bea.auth);
    expect(other.status).toBe(403);
    expect(other.body.error.message).toMatch(/each archer sees only their own place/);
    expect((await place(ids.ada, j.people.stranger.auth)).status).toBe(403);
    const anonymous = await place(ids.ada);
    expect(anonymous.status).toBe(401);
    expect(anonymous.body.error.message).toMatch(/not published yet/);
    // A refusal does not tell an outsider the unpublished event's name.
    const { name } = await server.db('events').where({ id: j.field.eventId }).first('name');
    for (const refused of [other, anonymous]) expect(JSON.stringify(refused.body)).not.toContain(name);
  });

  it('has no place before any end counts', async () => {
    const res = await place(ids.ada, j.people.ada.auth);
    expect(res.body).toMatchObject({ place: null, toPlaceAbove: null, leadOverBelow: null, endsShot: 0 });
  });

  it('gives the place, the points to the place above and the lead over the place below', async () => {
    await agreeEnds(j, ids.cora, [['X', '10', '10', '9', '9', '8']]); // 56
    await agreeEnds(j, ids.ada, [['X', '10', '9', '9', '8', '7']]); // 53
    await agreeEnds(j, ids.bea, [['10', '9', '9', '8', '7', '7']]); // 50
    const ada = (await place(ids.ada, j.people.ada.auth)).body as ArcherPlace;
    expect(ada).toMatchObject({
      place: 2,
      ranked: 3,
      total: 53,
      toPlaceAbove: 3,
      leadOverBelow: 3,
      trust: 'provisional',
      division: 'Recurve Women',
      eventId: j.field.eventId,
    });
    const first = (await place(ids.cora, j.field.organizer.auth)).body as ArcherPlace;
    expect(first).toMatchObject({ place: 1, toPlaceAbove: null, leadOverBelow: 3 });
  });

  it('once published: anyone, and still 404 for an archer not in the session', async () => {
    const publish = await request(server.app)
      .patch(`/api/events/${j.field.eventId}/results-settings`)
      .set(j.field.organizer.auth)
      .send({ published: true });
    expect(publish.status).toBe(200);
    expect((await place(ids.ada, bea.auth)).status).toBe(200);
    expect((await place(ids.ada)).body.place).toBe(2);
    expect((await place(999_999)).status).toBe(404);
    expect((await request(server.app).get(`/api/places/${j.sessionId}/abc`)).status).toBe(404);
  });
});
