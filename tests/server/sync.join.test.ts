import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getRound } from '../../src/core';
import type { TargetPackage } from '../../src/contract/sync';
import { startTestServer, type TestServer } from './support/testServer';
import { giveRole, makePerson, type TestPerson } from './support/people';
import { setUpField, setUpMixedField, type Field } from './support/fieldSetup';

/*
 * Joining a target group with the code from its target sheet, the target package a phone keeps
 * for scoring offline, and leaving the group.
 */

let server: TestServer;

beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

const join = (person: TestPerson, code: string, task: string) =>
  request(server.app).post('/api/join').set(person.auth).send({ code, task });
const pkg = (person: TestPerson, f: Field, target: number) =>
  request(server.app).get(`/api/targets/${f.sessionId}/${target}`).set(person.auth);
const leave = (person: TestPerson, f: Field, target: number) =>
  request(server.app).post(`/api/targets/${f.sessionId}/${target}/leave`).set(person.auth);

describe('joining', () => {
  let field: Field;
  beforeAll(async () => {
    field = await setUpMixedField(server.db);
  });

  it('returns the target package: event, session, the group, the archers in A–D order with their round snapshots', async () => {
    const person = await makePerson(server.db, 'Nell Writer');
    // Lay target 2 out in another order than it was entered, so the package must sort it.
    const [dan, eli] = [field.archer(2, 'A'), field.archer(2, 'B')];
    await server
      .db('target_assignments')
      .where({ session_id: field.sessionId, entry_id: dan.entryId })
      .update({ position: 'D' });
    await server
      .db('target_assignments')
      .where({ session_id: field.sessionId, entry_id: eli.entryId })
      .update({ position: 'A' });
    await server
      .db('target_assignments')
      .where({ session_id: field.sessionId, entry_id: dan.entryId })
      .update({ position: 'B' });
    try {
      const res = await join(person, `  ${field.targets.get(2)!.code.toLowerCase()} `, 'writer2');
      expect(res.status).toBe(200);
      const body = res.body as TargetPackage;
      expect(body).toEqual({
        event: { id: field.eventId, name: 'Field Shoot', venue: 'Test field' },
        session: { id: field.sessionId, name: 'Qualification', startsAt: '2026-12-12T09:00', closed: false },
        targetNumber: 2,
        task: 'writer2',
        members: [{ userId: person.id, name: 'Nell Writer', task: 'writer2' }],
        archers: [
          {
            entryId: eli.entryId,
            position: 'A',
            name: 'Eli Shaft',
            club: 'Field Club',
            division: 'Compound Men',
            bowStyle: 'compound',
            round: getRound('18m'),
          },
          {
            entryId: dan.entryId,
            position: 'B',
            name: 'Dan Vane',
            club: 'Field Club',
            division: 'Compound Men',
            bowStyle: 'compound',
            round: getRound('18m'),
          },
          {
            entryId: field.archer(2, 'C').entryId,
            position: 'C',
            name: 'Fay Limb',
            club: 'Field Club',
            division: 'Compound Women',
            bowStyle: 'compound',
            round: getRound('50m-compound'),
          },
        ],
      });
    } finally {
      await server
        .db('target_assignments')
        .where({ session_id: field.sessionId, entry_id: eli.entryId })
        .update({ position: 'D' });
      await server
        .db('target_assignments')
        .where({ session_id: field.sessionId, entry_id: dan.entryId })
        .update({ position: 'A' });
      await server
        .db('target_assignments')
        .where({ session_id: field.sessionId, entry_id: eli.entryId })
        .update({ position: 'B' });
      await leave(person, field, 2);
    }
  });

  it('keeps the round as stored for the session, whatever the catalog says later', async () => {
    const person = await makePerson(server.db, 'Snap Shot');
    const custom = { ...getRound('70m'), name: 'Club 70 m round (as set up)' };
    const division = await server
      .db('divisions')
      .where({ event_id: field.eventId, name: 'Recurve Women' })
      .first('id');
    await server
      .db('session_divisions')
      .where({ session_id: field.sessionId, division_id: division.id })
      .update({ round_json: JSON.stringify(custom) });
    try {
      const res = await join(person, field.targets.get(1)!.code, 'follower');
      expect(res.body.archers.map((a: TargetPackage['archers'][number]) => a.round.name)).toEqual(
        Array(3).fill('Club 70 m round (as set up)'),
      );
    } finally {
      await server
        .db('session_divisions')
        .where({ session_id: field.sessionId, division_id: division.id })
        .update({ round_json: JSON.stringify(getRound('70m')) });
      await leave(person, field, 1);
    }
  });

  it('refuses a code no target has (404) and a replaced code (410), with words', async () => {
    const person = await makePerson(server.db);
    const wrong = await join(person, 'ZZZZZZ', 'writer1');
    expect(wrong.status).toBe(404);
    expect(wrong.body.error.message).toBe(
      'No target has the join code ZZZZZZ. Check it against the target sheet.',
    );

    const code = field.targets.get(1)!.code;
    await server.db('join_codes').where({ code }).update({ revoked_at: new Date().toISOString() });
    try {
      const revoked = await join(person, code, 'writer1');
      expect(revoked.status).toBe(410);
      expect(revoked.body.error.message).toBe(
        `The join code ${code} was replaced. Use the code on the newest target sheet, or ask the organizer.`,
      );
    } finally {
      await server.db('join_codes').where({ code }).update({ revoked_at: null });
    }
  });

  it('refuses bad input with a readable 400', async () => {
    const person = await makePerson(server.db);
    const res = await join(person, 'AB', 'captain');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/A join code has 6 characters\./);
    expect(res.body.error.message).toMatch(/Choose writer 1, writer 2, caller or following\./);
  });

  it('refuses a task another person keeps (409), names them; the same person may re-join or change task', async () => {
    const [first, second] = [
      await makePerson(server.db, 'Ida Early'),
      await makePerson(server.db, 'Otto Later'),
    ];
    const code = field.targets.get(1)!.code;
    expect((await join(first, code, 'writer1')).status).toBe(200);
    const taken = await join(second, code, 'writer1');
    expect(taken.status).toBe(409);
    expect(taken.body.error.message).toBe(
      'Writer 1 on target 1 is already kept by Ida Early. Choose another task, ask them to leave it on their phone, or ask a judge or the organizer to free it.',
    );

    expect((await join(first, code, 'writer1')).status).toBe(200);
    const moved = await join(first, code, 'caller');
    expect(moved.status).toBe(200);
    expect(moved.body.members).toEqual([{ userId: first.id, name: 'Ida Early', task: 'caller' }]);
    const nowFree = await join(second, code, 'writer1');
    expect(nowFree.status).toBe(200);
    expect(nowFree.body.members.map((m: { name: string; task: string }) => `${m.task}:${m.name}`)).toEqual([
      'writer1:Otto Later',
      'caller:Ida Early',
    ]);
    await leave(first, field, 1);
    await leave(second, field, 1);
  });

  it('lets any number of people follow', async () => {
    const code = field.targets.get(1)!.code;
    const followers = [
      await makePerson(server.db, 'F One'),
      await makePerson(server.db, 'F Two'),
      await makePerson(server.db, 'F Three'),
    ];
    for (const f of followers) expect((await join(f, code, 'follower')).status).toBe(200);
    const res = await pkg(followers[0]!, field, 1);
    expect(res.body.members.filter((m: { task: string }) => m.task === 'follower')).toHaveLength(3);
    for (const f of followers) await leave(f, field, 1);
  });

  it('gives no event role: the code opens the target, not the event', async () => {
    const person = await makePerson(server.db);
    await join(person, field.targets.get(1)!.code, 'writer2');
    expect(await server.db('event_roles').where({ user_id: person.id })).toEqual([]);
    const event = await request(server.app).get(`/api/events/${field.eventId}`).set(person.auth);
    expect(event.status).toBe(403);
    await leave(person, field, 1);
  });

  it('refuses to join a closed session', async () => {
    const closed = await setUpField(server.db, {
      divisions: [{ name: 'Barebow', bowStyle: 'barebow', roundId: '50m-barebow' }],
      targets: [{ number: 4, archers: [{ name: 'Bo Bare', division: 'Barebow' }] }],
      closed: true,
    });
    const res = await join(await makePerson(server.db), closed.targets.get(4)!.code, 'writer1');
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(
      'The session "Qualification" is closed, so its targets cannot be joined any more.',
    );
  });
});

describe('the target package and leaving', () => {
  let field: Field;
  let member: TestPerson;
  beforeAll(async () => {
    field = await setUpMixedField(server.db);
    member = await makePerson(server.db, 'Mia Member');
    await join(member, field.targets.get(1)!.code, 'caller');
  });

  it('answers members with their task, judges and organizers as following', async () => {
    expect((await pkg(member, field, 1)).body.task).toBe('caller');
    for (const staff of [field.judge, field.organizer]) {
      const res = await pkg(staff, field, 2);
      expect(res.status).toBe(200);
      expect(res.body.task).toBe('follower');
      expect(res.body.archers).toHaveLength(3);
    }
  });

  it('refuses others with 403: another target’s member, an archer of the event, a stranger', async () => {
    const archer = await makePerson(server.db, 'Event Archer');
    await giveRole(server.db, field.eventId, archer, 'archer');
    for (const person of [member, archer, await makePerson(server.db)]) {
      const res = await pkg(person, field, 2);
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(
        /^Only the group of target 2, the judges and the organizers can see it\./,
      );
    }
  });

  it('answers 404 for a session or target that does not exist', async () => {
    expect(
      (await request(server.app).get('/api/targets/999999/1').set(field.judge.auth)).body.error.message,
    ).toBe('That session does not exist.');
    const empty = await pkg(field.judge, field, 9);
    expect(empty.status).toBe(404);
    expect(empty.body.error.message).toBe('Target 9 has no archers in this session.');
    expect(
      (await request(server.app).get(`/api/targets/${field.sessionId}/abc`).set(field.judge.auth)).status,
    ).toBe(404);
  });

  it('leaving frees the task and closes the target to the person; leaving twice is harmless', async () => {
    const res = await leave(member, field, 1);
    expect(res.status).toBe(204);
    expect((await leave(member, field, 1)).status).toBe(204);
    expect((await pkg(member, field, 1)).status).toBe(403);
    const other = await makePerson(server.db, 'Next Caller');
    expect((await join(other, field.targets.get(1)!.code, 'caller')).status).toBe(200);
  });

  it('every route of the target group asks for a sign-in', async () => {
    for (const [method, path] of [
      ['post', '/api/join'],
      ['get', `/api/targets/${field.sessionId}/1`],
      ['get', `/api/targets/${field.sessionId}/1/ends`],
      ['post', `/api/targets/${field.sessionId}/1/leave`],
    ] as const) {
      const res = await request(server.app)[method](path).send({});
      expect(res.status, `${method} ${path}`).toBe(401);
    }
  });
});
