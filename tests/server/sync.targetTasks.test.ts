import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { TargetMember } from '../../src/contract/targetTasks';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson, type TestPerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';
import { Phone } from './support/phone';

/*
 * Leaving a task, and an organizer or judge freeing or reassigning one when its keeper cannot
 * ("already kept by … ask them to leave it" had no way out before).
 */

let server: TestServer;
let field: Field;
let ida: TestPerson;
let ned: TestPerson;
let stranger: TestPerson;

beforeAll(async () => {
  server = await startTestServer();
  field = await setUpMixedField(server.db);
  ida = await makePerson(server.db, 'Ida Early');
  ned = await makePerson(server.db, 'Ned Late');
  stranger = await makePerson(server.db, 'Stray Person');
  const code = field.targets.get(1)!.code;
  await new Phone(server.app, ida).join(code, 'writer1');
  await new Phone(server.app, ned).join(code, 'follower');
});
afterAll(async () => {
  await server.close();
});

const path = (rest = '') =>
  `/api/events/${field.eventId}/sessions/${field.sessionId}/targets/1/members${rest}`;
const put = (person: TestPerson, userId: number, task: string) =>
  request(server.app)
    .put(path(`/${userId}`))
    .set(person.auth)
    .send({ task });
const join = (person: TestPerson, task: string) =>
  request(server.app)
    .post('/api/join')
    .set(person.auth)
    .send({ code: field.targets.get(1)!.code, task });

describe('freeing and reassigning a task', () => {
  it('a judge gives writer 1 to another member of the group; the one who kept it then follows', async () => {
    expect((await join(ned, 'writer1')).body.error.message).toMatch(/already kept by Ida Early.*free it/);
    const res = await put(field.judge, ned.id, 'writer1');
    expect(res.status).toBe(200);
    const members = res.body as TargetMember[];
    expect(members.map((m) => [m.name, m.task])).toEqual([
      ['Ned Late', 'writer1'],
      ['Ida Early', 'follower'],
    ]);
    // Ida's phone is now refused as writer 1, with a reason.
    const phone = new Phone(server.app, ida);
    const entryId = field.archer(1, 'A').entryId;
    const [result] = (
      await phone.push([
        phone.write({ sessionId: field.sessionId, entryId, endIndex: 0, slot: 1, arrows: ['9'] }),
      ])
    ).results;
    expect(result).toMatchObject({ status: 'rejected', reason: expect.stringMatching(/you are following/) });
  });

  it('an organizer frees a task by taking the person out of the group; then anyone can join with it', async () => {
    const res = await put(field.organizer, ned.id, 'none');
    expect(res.status).toBe(200);
    expect((res.body as TargetMember[]).map((m) => m.name)).toEqual(['Ida Early']);
    expect((await join(ida, 'writer1')).status).toBe(200);
  });

  it('a person leaves their own task', async () => {
    expect(
      (await request(server.app).post(`/api/targets/${field.sessionId}/1/leave`).set(ida.auth)).status,
    ).toBe(204);
    const list = await request(server.app).get(path()).set(field.judge.auth);
    expect(list.body).toEqual([]);
  });

  it('refuses people who are not judges or organizers, unknown members and unknown tasks', async () => {
    await join(ida, 'caller');
    for (const person of [ida, stranger]) {
      const res = await put(person, ida.id, 'none');
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/organizer or judge/);
      expect((await request(server.app).get(path()).set(person.auth)).status).toBe(403);
    }
    expect((await put(field.judge, stranger.id, 'writer2')).status).toBe(404);
    const bad = await put(field.judge, ida.id, 'captain');
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/Choose writer 1/);
    expect(
      (
        await request(server.app)
          .put(path(`/${ida.id}`))
          .send({ task: 'none' })
      ).status,
    ).toBe(401);
  });
});
