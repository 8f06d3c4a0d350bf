import request from 'supertest';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PracticeEndDto } from '../../src/contract/practice';
import type { ChangeDto, MutationResult } from '../../src/contract/sync';
import { giveRole, makeEvent, makePerson, type TestPerson } from './support/people';
import { Phone } from './support/phone';
import { arrows, end, session } from './support/practice';
import { startTestServer, type TestServer } from './support/testServer';

/*
 * The practice log synced to the person's account: `practice.session`, `practice.end` and
 * `practice.delete` through /api/sync/push, applied once, pulled back only by their person.
 */

let server: TestServer;
let archer: TestPerson;
let otherArcher: TestPerson;
let judge: TestPerson;
let organizer: TestPerson;

beforeAll(async () => {
  server = await startTestServer();
  archer = await makePerson(server.db, 'Practice Archer');
  otherArcher = await makePerson(server.db, 'Other Archer');
  judge = await makePerson(server.db, 'Judge');
  organizer = await makePerson(server.db, 'Organizer');
  // The archer shoots an event the judge and the organizer run: that opens none of their practice.
  const eventId = await makeEvent(server.db, organizer, 'Club Shoot');
  await giveRole(server.db, eventId, judge, 'judge');
  await giveRole(server.db, eventId, archer, 'archer');
});
afterAll(() => server.close());

const practiceOf = (changes: ChangeDto[]) => changes.filter((c) => c.type.startsWith('practice'));
const storedEnds = async (sessionId: string) =>
  (await server.db('practice_ends').where({ session_id: sessionId }).orderBy('end_index')).map(
    (r: { end_json: string }) => JSON.parse(r.end_json) as PracticeEndDto,
  );
const reasonOf = (r: MutationResult | undefined) => (r && 'reason' in r ? r.reason : undefined);

describe('practice through the outbox', () => {
  it('stores a session and its ends once, answers a push sent again as duplicates, and gives them to the person’s other phone', async () => {
    const phone = new Phone(server.app, archer);
    const s = session();
    const changes = [
      phone.practice({ kind: 'practice.session', args: s }),
      phone.practice({ kind: 'practice.end', args: end(s.id, 0, arrows('10', '9', 'X')) }),
      phone.practice({ kind: 'practice.end', args: end(s.id, 1, arrows('8')) }),
    ];
    expect((await phone.push(changes)).results.map((r) => r.status)).toEqual([
      'applied',
      'applied',
      'applied',
    ]);
    const again = await phone.push(changes);
    expect(again.results.map((r) => r.status)).toEqual(['duplicate', 'duplicate', 'duplicate']);
    expect(await server.db('practice_sessions').where({ id: s.id })).toHaveLength(1);
    expect((await storedEnds(s.id)).map((e) => e.arrows.length)).toEqual([3, 1]);

    const otherPhone = new Phone(server.app, archer);
    const pulled = practiceOf((await otherPhone.pull(0)).changes);
    expect(pulled.map((c) => c.type)).toEqual(['practice', 'practice-end', 'practice-end']);
    expect(pulled[0]!.record).toEqual(s);
  });

  it('keeps an arrow once when its end is sent again under a new change (a reload), and drops an end taken back to nothing', async () => {
    const phone = new Phone(server.app, archer);
    const s = session();
    await phone.push([
      phone.practice({ kind: 'practice.session', args: s }),
      phone.practice({ kind: 'practice.end', args: end(s.id, 0, arrows('10', '9')) }),
    ]);
    // The phone reloaded before hearing the answer and recorded the same end again.
    await phone.push([phone.practice({ kind: 'practice.end', args: end(s.id, 0, arrows('10', '9')) })]);
    expect((await storedEnds(s.id))[0]!.arrows).toEqual(arrows('10', '9'));
    await phone.push([phone.practice({ kind: 'practice.end', args: end(s.id, 0, []) })]);
    expect(await storedEnds(s.id)).toEqual([]);
    // The log keeps one change per end: the latest.
    const logged = practiceOf((await phone.pull(0)).changes).filter(
      (c) => c.type === 'practice-end' && c.record.sessionId === s.id,
    );
    expect(logged.map((c) => c.record)).toEqual([end(s.id, 0, [])]);
  });

  it('deletes a session on the server, its earlier changes too, and tells the person’s other phones', async () => {
    const phone = new Phone(server.app, archer);
    const s = session({ note: 'to be deleted' });
    await phone.push([
      phone.practice({ kind: 'practice.session', args: s }),
      phone.practice({ kind: 'practice.end', args: end(s.id, 0, arrows('7')) }),
    ]);
    const before = await phone.pull(0);
    const result = await phone.push([phone.practice({ kind: 'practice.delete', args: { sessionId: s.id } })]);
    expect(result.results[0]!.status).toBe('applied');
    // Kept as a tombstone (a later change from another phone brings it back), never pulled.
    expect((await server.db('practice_sessions').where({ id: s.id }).first()).deleted_at).toEqual(
      expect.any(String),
    );

    const fromStart = practiceOf((await new Phone(server.app, archer).pull(0)).changes);
    const aboutIt = fromStart.filter((c) => JSON.stringify(c.record).includes(s.id));
    expect(aboutIt.map((c) => c.type)).toEqual(['practice-del']);
    expect(JSON.stringify(fromStart)).not.toContain('to be deleted');
    // A phone that had pulled it hears of the deletion on its next pull.
    const next = practiceOf((await phone.pull(before.cursor)).changes);
    expect(next).toEqual([expect.objectContaining({ type: 'practice-del', record: { sessionId: s.id } })]);
  });

  it('shows a person’s practice to no one else: another archer, a judge of their event and its organizer pull none of it', async () => {
    const phone = new Phone(server.app, archer);
    const s = session({ note: 'private' });
    await phone.push([phone.practice({ kind: 'practice.session', args: s })]);
    for (const person of [otherArcher, judge, organizer]) {
      const { changes } = await new Phone(server.app, person).pull(0);
      expect(practiceOf(changes)).toEqual([]);
      expect(JSON.stringify(changes)).not.toContain(s.id);
    }
    // Nor through any other route of the person-facing API.
    for (const path of ['/api/me', '/api/me/cards', '/api/me/practice-cards']) {
      const res = await request(server.app).get(path).set(judge.auth);
      expect(JSON.stringify(res.body)).not.toContain(s.id);
    }
  });

  it('refuses another person’s change to a session that is not theirs, and stores nothing of it', async () => {
    const s = session();
    await new Phone(server.app, archer).push([
      new Phone(server.app, archer).practice({ kind: 'practice.session', args: s }),
    ]);
    const intruder = new Phone(server.app, otherArcher);
    const { results } = await intruder.push([
      intruder.practice({ kind: 'practice.session', args: { ...s, note: 'mine now' } }),
      intruder.practice({ kind: 'practice.end', args: end(s.id, 0, arrows('M')) }),
      intruder.practice({ kind: 'practice.delete', args: { sessionId: s.id } }),
    ]);
    expect(results.map((r) => r.status)).toEqual(['rejected', 'rejected', 'rejected']);
    expect(reasonOf(results[0])).toMatch(/belongs to another account/);
    const row = await server.db('practice_sessions').where({ id: s.id }).first();
    expect(row.user_id).toBe(archer.id);
    expect(JSON.parse(row.session_json as string).note).toBe('Windy');
    expect(await storedEnds(s.id)).toEqual([]);
  });

  it('refuses an end of a session the server does not hold, with words', async () => {
    const phone = new Phone(server.app, archer);
    const { results } = await phone.push([
      phone.practice({ kind: 'practice.end', args: end(randomUUID(), 0, arrows('9')) }),
    ]);
    expect(reasonOf(results[0])).toMatch(/not on your account/);
  });
});

describe('a change racing a deletion', () => {
  /** A session on the account with two ends, pulled by a second phone of the person. */
  const shared = async () => {
    const first = new Phone(server.app, archer);
    const second = new Phone(server.app, archer);
    const s = session({ note: 'raced' });
    await first.push([
      first.practice({ kind: 'practice.session', args: s }),
      first.practice({ kind: 'practice.end', args: end(s.id, 0, arrows('10', '9', '9')) }),
      first.practice({ kind: 'practice.end', args: end(s.id, 1, arrows('8', '8', '7')) }),
    ]);
    return { first, second, s };
  };
  const aboutIt = (changes: ChangeDto[], id: string) =>
    practiceOf(changes).filter((c) => JSON.stringify(c.record).includes(id));

  it('lets an end from a phone that had not heard of the deletion win: the whole session comes back on every phone, with a note', async () => {
    const { first, second, s } = await shared();
    await second.push([second.practice({ kind: 'practice.delete', args: { sessionId: s.id } })]);
    const afterDelete = (await second.pull(0)).cursor;

    // The first phone was offline and kept a third end.
    const third = first.practice({ kind: 'practice.end', args: end(s.id, 2, arrows('X', '10', '9')) });
    expect((await first.push([third])).results[0]!.status).toBe('applied');
    expect((await storedEnds(s.id)).map((e) => e.index)).toEqual([0, 1, 2]);
    expect((await server.db('practice_sessions').where({ id: s.id }).first()).deleted_at).toBeNull();

    // The deleting phone takes the whole session again, marked as brought back.
    const back = aboutIt((await second.pull(afterDelete)).changes, s.id);
    expect(back.map((c) => c.type)).toEqual(['practice', 'practice-end', 'practice-end', 'practice-end']);
    expect(back[0]!.record).toEqual({ ...s, revivedAt: third.at });
    // A phone pulling from the start sees the whole session and no deletion.
    const fresh = aboutIt((await new Phone(server.app, archer).pull(0)).changes, s.id);
    expect(fresh.map((c) => c.type).sort()).toEqual([
      'practice',
      'practice-end',
      'practice-end',
      'practice-end',
    ]);

    // Pushed again (a retry): a duplicate, nothing written twice.
    const logBefore = await server.db('changes').where('practice_id', 'like', `${s.id}%`).count({ n: '*' });
    expect((await first.push([third])).results[0]!.status).toBe('duplicate');
    expect(await server.db('changes').where('practice_id', 'like', `${s.id}%`).count({ n: '*' })).toEqual(
      logBefore,
    );
    // Recorded again under a new change (a reload): the end is still there once.
    await first.push([first.practice({ kind: 'practice.end', args: end(s.id, 2, arrows('X', '10', '9')) })]);
    expect((await storedEnds(s.id)).map((e) => e.arrows.length)).toEqual([3, 3, 3]);

    // The deleting phone may delete it again: then it is gone from every pull.
    await second.push([second.practice({ kind: 'practice.delete', args: { sessionId: s.id } })]);
    const gone = aboutIt((await new Phone(server.app, archer).pull(0)).changes, s.id);
    expect(gone.map((c) => c.type)).toEqual(['practice-del']);
  });

  it('brings back the earlier ends with a setup sent after the deletion (the session finished offline)', async () => {
    const { first, second, s } = await shared();
    await second.push([second.practice({ kind: 'practice.delete', args: { sessionId: s.id } })]);
    const finished = { ...s, finishedAt: '2026-11-30T10:00:00.000Z' };
    await first.push([first.practice({ kind: 'practice.session', args: finished })]);
    const back = aboutIt((await new Phone(server.app, archer).pull(0)).changes, s.id);
    expect(back.filter((c) => c.type === 'practice-end')).toHaveLength(2);
    expect(back.find((c) => c.type === 'practice')!.record).toMatchObject({
      finishedAt: finished.finishedAt,
      revivedAt: expect.any(String),
    });
  });

  it('brings a session back with no note when the phone that deleted it undoes the deletion', async () => {
    const { second, s } = await shared();
    await second.push([second.practice({ kind: 'practice.delete', args: { sessionId: s.id } })]);
    await second.push([second.practice({ kind: 'practice.session', args: s })]);
    const back = aboutIt((await new Phone(server.app, archer).pull(0)).changes, s.id);
    expect(back.find((c) => c.type === 'practice')!.record).toEqual(s);
    expect(back.filter((c) => c.type === 'practice-end')).toHaveLength(2);
  });

  it('lets no other account bring a deleted session back', async () => {
    const { second, s } = await shared();
    await second.push([second.practice({ kind: 'practice.delete', args: { sessionId: s.id } })]);
    const intruder = new Phone(server.app, otherArcher);
    const { results } = await intruder.push([
      intruder.practice({ kind: 'practice.end', args: end(s.id, 2, arrows('M')) }),
    ]);
    expect(reasonOf(results[0])).toMatch(/belongs to another account/);
    expect((await server.db('practice_sessions').where({ id: s.id }).first()).deleted_at).toEqual(
      expect.any(String),
    );
    expect(await storedEnds(s.id)).toHaveLength(2);
  });
});

describe('bad practice changes', () => {
  it('refuses each oversized or unreadable change on its own with a sentence, and the ones behind it still apply', async () => {
    const phone = new Phone(server.app, archer);
    const s = session();
    const res = await request(server.app)
      .post('/api/sync/push')
      .set(archer.auth)
      .send({
        clientId: phone.clientId,
        mutations: [
          phone.practice({ kind: 'practice.session', args: { ...s, note: 'n'.repeat(201) } }),
          phone.practice({ kind: 'practice.session', args: { ...s, roundId: 'no-such-round' } }),
          phone.practice({ kind: 'practice.session', args: { ...s, arrowsPerEnd: 40 } }),
          // Wider than the core's shaft range (src/core/shaft.ts), which the phone's form also keeps.
          phone.practice({ kind: 'practice.session', args: { ...s, shaftDiameterMm: 12 } }),
          phone.practice({ kind: 'practice.session', args: s }),
          phone.practice({
            kind: 'practice.end',
            args: end(s.id, 0, arrows(...Array<string>(13).fill('9'))),
          }),
          phone.practice({ kind: 'practice.end', args: end(s.id, 200, arrows('9')) }),
          phone.practice({ kind: 'practice.end', args: end(s.id, 0, [{ value: '9', xMm: 5000, yMm: 0 }]) }),
          phone.practice({ kind: 'practice.end', args: end(s.id, 0, arrows('9')) }),
        ],
      });
    expect(res.status).toBe(200);
    const results = (res.body as { results: MutationResult[] }).results;
    expect(results.map((r) => r.status)).toEqual([
      'rejected',
      'rejected',
      'rejected',
      'rejected',
      'applied',
      'rejected',
      'rejected',
      'rejected',
      'applied',
    ]);
    expect(reasonOf(results[0])).toMatch(/at most 200 characters/);
    expect(reasonOf(results[1])).toMatch(/not in the catalog/);
    expect(reasonOf(results[3])).toMatch(/A shaft is 4 to 9.5 mm across/);
    expect(reasonOf(results[5])).toMatch(/at most 12 arrows/);
    expect(reasonOf(results[6])).toMatch(/at most 200 ends/);
    expect((await storedEnds(s.id)).map((e) => e.arrows)).toEqual([arrows('9')]);
  });

  it('answers a push body that is not a push with a 400 in words', async () => {
    const res = await request(server.app)
      .post('/api/sync/push')
      .set(archer.auth)
      .send({ clientId: 'phone-x', mutations: [{ kind: 'practice.session', args: session() }] });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toEqual(expect.any(String));
  });
});
