import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { Mutation } from '../../src/contract/sync';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson, type TestPerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';
import { Phone, fieldTableCounts } from './support/phone';

/*
 * Push: every mutation applied exactly once, in seq order; duplicates answered from the stored
 * outcome; a gap stops the batch; a broken rule is logged as rejected with its reason and never
 * blocks what follows.
 */

let server: TestServer;
let field: Field;
let people: Record<
  'writer1' | 'writer2' | 'caller' | 'follower' | 'writer1b' | 'writer2b' | 'stranger',
  TestPerson
>;

beforeAll(async () => {
  server = await startTestServer();
  field = await setUpMixedField(server.db);
  const { db } = server;
  people = {
    writer1: await makePerson(db, 'Wren One'),
    writer2: await makePerson(db, 'Wyn Two'),
    caller: await makePerson(db, 'Cal Caller'),
    follower: await makePerson(db, 'Fen Follower'),
    writer1b: await makePerson(db, 'Wade One'),
    writer2b: await makePerson(db, 'Will Two'),
    stranger: await makePerson(db, 'Stray Person'),
  };
  const t1 = field.targets.get(1)!.code;
  const t2 = field.targets.get(2)!.code;
  await new Phone(server.app, people.writer1).join(t1, 'writer1');
  await new Phone(server.app, people.writer2).join(t1, 'writer2');
  await new Phone(server.app, people.caller).join(t1, 'caller');
  await new Phone(server.app, people.follower).join(t1, 'follower');
  await new Phone(server.app, people.writer1b).join(t2, 'writer1');
  await new Phone(server.app, people.writer2b).join(t2, 'writer2');
});
afterAll(async () => {
  await server.close();
});

const SIX: ArrowValue[] = ['X', '10', '9', '9', '8', '7'];
let nextEnd = 0;
/** A fresh end of Ada Fletcher (target 1, 70 m round, 12 ends) for each test that needs one. */
const freshEnd = () => {
  nextEnd += 1;
  if (nextEnd > 11) throw new Error('Ada has only 12 ends; use another archer.');
  return nextEnd;
};
const ada = () => field.archer(1, 'A');
const write = (
  phone: Phone,
  endIndex: number,
  arrows: ArrowValue[] = SIX,
  slot: 1 | 2 = 1,
  entryId = ada().entryId,
) => phone.write({ sessionId: field.sessionId, entryId, endIndex, slot, arrows });
const record = (entryId: number, endIndex: number, slot: 1 | 2) =>
  server
    .db('end_entries')
    .where({ session_id: field.sessionId, entry_id: entryId, end_index: endIndex, slot })
    .first();

describe('applying writes', () => {
  it('applies a writer’s end: its record (revision 1), the log row and a change to pull', async () => {
    const phone = new Phone(server.app, people.writer1);
    const end = freshEnd();
    const m = write(phone, end);
    const res = await phone.push([m]);
    expect(res).toEqual({ results: [{ seq: 1, id: m.id, status: 'applied' }], lastSeq: 1 });

    const row = await record(ada().entryId, end, 1);
    expect(JSON.parse(row.arrows_json)).toEqual(SIX);
    expect(row).toMatchObject({
      revision: 1,
      written_by: people.writer1.id,
      written_at: m.at,
      mutation_id: m.id,
    });
    const logged = await server.db('mutations').where({ mutation_uuid: m.id }).first();
    expect(logged).toMatchObject({
      client_id: phone.clientId,
      seq: 1,
      user_id: people.writer1.id,
      kind: 'end.write',
      status: 'applied',
      reason: null,
    });
    const change = await server.db('changes').orderBy('version', 'desc').first();
    expect(change).toMatchObject({
      event_id: field.eventId,
      session_id: field.sessionId,
      target_number: 1,
      type: 'end',
    });
    expect(JSON.parse(change.record_json)).toMatchObject({
      entryId: ada().entryId,
      endIndex: end,
      slot: 1,
      arrows: SIX,
      revision: 1,
    });
  });

  it('keeps the two writers’ records apart: a new write replaces only its own slot, one revision on', async () => {
    const one = new Phone(server.app, people.writer1);
    const two = new Phone(server.app, people.writer2);
    const end = freshEnd();
    await one.push([write(one, end, ['9', '9', '9', '8', '8', '8'])]);
    await two.push([write(two, end, ['9', '9', '9', '8', '8', '7'], 2)]);
    await one.push([write(one, end, ['9', '9', '9', '8', '8', '7'])]);
    const first = await record(ada().entryId, end, 1);
    const second = await record(ada().entryId, end, 2);
    expect(first.revision).toBe(2);
    expect(JSON.parse(first.arrows_json)).toEqual(['9', '9', '9', '8', '8', '7']);
    expect(second.revision).toBe(1);
    expect(second.written_by).toBe(people.writer2.id);
  });

  it('accepts a partial end while the writer is still tapping, and flags on its arrows', async () => {
    const phone = new Phone(server.app, people.writer1);
    const m = phone.write({
      sessionId: field.sessionId,
      entryId: ada().entryId,
      endIndex: freshEnd(),
      slot: 1,
      arrows: ['10', 'M'],
      flags: [{ index: 1, flag: 'bounce-out' }],
    });
    expect((await phone.push([m])).results[0]!.status).toBe('applied');
  });
});

describe('exactly once', () => {
  it('answers the same batch twice as duplicates, with no second effect', async () => {
    const phone = new Phone(server.app, people.writer1);
    const end = freshEnd();
    const batch = [
      write(phone, end, ['8', '8', '8', '8', '8', '8']),
      write(phone, end, ['9', '8', '8', '8', '8', '8']),
      write(phone, end),
    ];
    const first = await phone.push(batch);
    expect(first.results.map((r) => r.status)).toEqual(['applied', 'applied', 'applied']);
    const before = await fieldTableCounts(server.db);
    const again = await phone.push(batch);
    expect(again.results).toEqual(batch.map((m) => ({ seq: m.seq, id: m.id, status: 'duplicate' })));
    expect(again.lastSeq).toBe(3);
    expect(await fieldTableCounts(server.db)).toEqual(before);
    expect((await record(ada().entryId, end, 1)).revision).toBe(3);
  });

  it('stops at a gap, names the seq it expects, and applies nothing behind the gap', async () => {
    const phone = new Phone(server.app, people.writer1);
    const end = freshEnd();
    const [m1, m2, m3] = [
      write(phone, end, ['7', '7', '7', '7', '7', '7']),
      write(phone, end, ['8', '7', '7', '7', '7', '7']),
      write(phone, end),
    ];
    const res = await phone.push([m1!, m3!]);
    expect(res).toEqual({ results: [{ seq: 1, id: m1!.id, status: 'applied' }], lastSeq: 1, expectedSeq: 2 });
    expect(await server.db('mutations').where({ mutation_uuid: m3!.id }).first()).toBeUndefined();
    expect((await record(ada().entryId, end, 1)).revision).toBe(1);

    const fill = await phone.push([m2!, m3!]);
    expect(fill.results.map((r) => r.status)).toEqual(['applied', 'applied']);
    expect(fill.lastSeq).toBe(3);
    const row = await record(ada().entryId, end, 1);
    expect(row.revision).toBe(3);
    expect(JSON.parse(row.arrows_json)).toEqual(SIX);
  });

  it('a batch that starts beyond the next seq applies nothing', async () => {
    const phone = new Phone(server.app, people.writer1);
    const end = freshEnd();
    write(phone, end);
    const m2 = write(phone, end);
    expect(await phone.push([m2])).toEqual({ results: [], lastSeq: 0, expectedSeq: 1 });
    expect(await server.db('mutations').where({ client_id: phone.clientId }).first()).toBeUndefined();
  });

  it('applies a reordered batch in seq order, exactly as the ordered batch', async () => {
    const phone = new Phone(server.app, people.writer1);
    const end = freshEnd();
    const m1 = write(phone, end, ['6', '6', '6', '6', '6', '6']);
    const m2 = write(phone, end, ['7', '6', '6', '6', '6', '6']);
    const m3 = write(phone, end, ['8', '7', '6', '6', '6', '6']);
    const res = await phone.push([m3, m1, m2]);
    expect(res.results).toEqual([m1, m2, m3].map((m) => ({ seq: m.seq, id: m.id, status: 'applied' })));
    const row = await record(ada().entryId, end, 1);
    expect(row.revision).toBe(3);
    expect(row.mutation_id).toBe(m3.id);
    expect(JSON.parse(row.arrows_json)).toEqual(['8', '7', '6', '6', '6', '6']);
  });

  it('split batches reach the same state as one batch', async () => {
    const split = new Phone(server.app, people.writer1b);
    const whole = new Phone(server.app, people.writer2b);
    const [dan, eli] = [field.archer(2, 'A'), field.archer(2, 'B')];
    const plan: { entryId: number; endIndex: number; arrows: ArrowValue[] }[] = [];
    for (let endIndex = 0; endIndex < 5; endIndex += 1) {
      plan.push({ entryId: dan.entryId, endIndex, arrows: ['10', '9', endIndex % 2 ? '8' : '9'] });
      plan.push({ entryId: eli.entryId, endIndex, arrows: ['10', '10', 'M'] });
    }
    const a = plan.map((p) => split.write({ sessionId: field.sessionId, slot: 1, ...p }));
    const b = plan.map((p) => whole.write({ sessionId: field.sessionId, slot: 2, ...p }));
    const answers = [
      ...(await split.push(a.slice(0, 4))).results,
      ...(await split.push(a.slice(4, 7))).results,
      ...(await split.push(a.slice(7))).results,
    ];
    expect(answers.map((r) => r.seq)).toEqual(a.map((m) => m.seq));
    expect(answers.every((r) => r.status === 'applied')).toBe(true);
    expect((await whole.push(b)).lastSeq).toBe(10);
    const slotRows = async (slot: number) =>
      await server
        .db('end_entries')
        .where({ session_id: field.sessionId, slot })
        .whereIn('entry_id', [dan.entryId, eli.entryId])
        .orderBy(['entry_id', 'end_index'])
        .select('entry_id', 'end_index', 'arrows_json', 'revision');
    expect(await slotRows(1)).toEqual(await slotRows(2));
  });

  it('applies a full batch of 500 changes in one push', async () => {
    const phone = new Phone(server.app, people.writer1b);
    const [dan, eli] = [field.archer(2, 'A'), field.archer(2, 'B')];
    const revisions = async () =>
      Number(
        (
          await server
            .db('end_entries')
            .where({ session_id: field.sessionId, slot: 1 })
            .whereIn('entry_id', [dan.entryId, eli.entryId])
            .sum({ n: 'revision' })
            .first()
        )?.n ?? 0,
      );
    const before = await revisions();
    const batch = Array.from({ length: 500 }, (_, i) =>
      phone.write({
        sessionId: field.sessionId,
        entryId: i % 2 ? dan.entryId : eli.entryId,
        endIndex: i % 20,
        slot: 1,
        arrows: ['10', '9', '8'],
      }),
    );
    const res = await phone.push(batch);
    expect(res.lastSeq).toBe(500);
    expect(res.results.every((r) => r.status === 'applied')).toBe(true);
    expect(await revisions()).toBe(before + 500);
  });

  it('answers the same change sent under a new number as a duplicate, without applying it twice', async () => {
    const phone = new Phone(server.app, people.writer1);
    const end = freshEnd();
    const m1 = write(phone, end);
    await phone.push([m1]);
    const resent: Mutation = { ...m1, seq: 2 };
    const res = await phone.push([resent]);
    expect(res).toEqual({ results: [{ seq: 2, id: m1.id, status: 'duplicate' }], lastSeq: 2 });
    expect((await record(ada().entryId, end, 1)).revision).toBe(1);
    const m3 = write(phone, end);
    expect((await phone.push([{ ...m3, seq: 3 }])).results[0]!.status).toBe('applied');
  });

  it('the same change twice in one batch is applied once', async () => {
    const phone = new Phone(server.app, people.writer1);
    const end = freshEnd();
    const m1 = write(phone, end);
    const res = await phone.push([m1, m1]);
    expect(res).toEqual({
      results: [
        { seq: 1, id: m1.id, status: 'applied' },
        { seq: 1, id: m1.id, status: 'duplicate' },
      ],
      lastSeq: 1,
    });
    expect((await record(ada().entryId, end, 1)).revision).toBe(1);
  });

  it('refuses a different change under a number already used, and stores nothing for it', async () => {
    const phone = new Phone(server.app, people.writer1);
    const end = freshEnd();
    const m1 = write(phone, end);
    await phone.push([m1]);
    const before = await fieldTableCounts(server.db);
    const other: Mutation = { ...write(phone, end, ['M', 'M', 'M', 'M', 'M', 'M']), seq: 1 };
    const res = await phone.push([other]);
    expect(res.results).toEqual([
      {
        seq: 1,
        id: other.id,
        status: 'rejected',
        reason: expect.stringMatching(/sent change number 1 twice/),
      },
    ]);
    expect(await fieldTableCounts(server.db)).toEqual(before);
  });
});

describe('rejections', () => {
  it('logs a rejected mutation with its reason, keeps going behind it, and answers it rejected again on replay', async () => {
    const phone = new Phone(server.app, people.writer1);
    const end = freshEnd();
    const ok1 = write(phone, end);
    const bad = write(phone, end, ['10', '10', '10', '10', '10', '10', '10']);
    const ok2 = write(phone, end, ['X', 'X', '10', '9', '9', '9']);
    const res = await phone.push([ok1, bad, ok2]);
    const reason = `End ${end + 1} of Ada Fletcher: End has 7 arrows; this round has 6 per end.`;
    expect(res).toEqual({
      results: [
        { seq: 1, id: ok1.id, status: 'applied' },
        { seq: 2, id: bad.id, status: 'rejected', reason },
        { seq: 3, id: ok2.id, status: 'applied' },
      ],
      lastSeq: 3,
    });
    expect(await server.db('mutations').where({ mutation_uuid: bad.id }).first()).toMatchObject({
      status: 'rejected',
      reason,
    });
    expect((await record(ada().entryId, end, 1)).revision).toBe(2);

    const replay = await phone.push([ok1, bad, ok2]);
    expect(replay.results).toEqual([
      { seq: 1, id: ok1.id, status: 'duplicate' },
      { seq: 2, id: bad.id, status: 'rejected', reason },
      { seq: 3, id: ok2.id, status: 'duplicate' },
    ]);
  });

  type Case = [label: string, who: keyof typeof people, make: (p: Phone) => Mutation, reason: RegExp];
  const s = () => field.sessionId;
  const cases: Case[] = [
    [
      'writer 1 writing the second card',
      'writer1',
      (p) => write(p, 0, SIX, 2),
      /^Only writer 2 of target 1 can write the second card; you are writer 1\.$/,
    ],
    [
      'writer 2 writing the first card',
      'writer2',
      (p) => write(p, 0, SIX, 1),
      /^Only writer 1 of target 1 can write the first card; you are writer 2\.$/,
    ],
    [
      'the caller writing a card',
      'caller',
      (p) => write(p, 0),
      /^Only writer 1 of target 1 can write the first card; you are the caller\.$/,
    ],
    ['a follower writing a card', 'follower', (p) => write(p, 0), /you are following\.$/],
    [
      'someone not in the group',
      'stranger',
      (p) => write(p, 0),
      /^You are not in the group of target 1\. Join it with the code on the target sheet\.$/,
    ],
    [
      'a writer of target 1 writing for an archer on target 2',
      'writer1',
      (p) => write(p, 0, ['10', '9', '9'], 1, field.archer(2, 'A').entryId),
      /not in the group of target 2/,
    ],
    [
      'a 4 on the 80 cm six-ring face',
      'writer1b',
      (p) =>
        p.write({
          sessionId: s(),
          entryId: field.archer(2, 'C').entryId,
          endIndex: 0,
          slot: 1,
          arrows: ['10', '9', '4'],
        }),
      /^End 1 of Fay Limb: 4 is not a value on the 80 cm six-ring face\.$/,
    ],
    [
      'an X for compound indoors',
      'writer1b',
      (p) =>
        p.write({
          sessionId: s(),
          entryId: field.archer(2, 'A').entryId,
          endIndex: 0,
          slot: 1,
          arrows: ['X', '10', '9'],
        }),
      /^End 1 of Dan Vane: X is not a value on the 40 cm face for compound indoors; write the inner ring as 10\.$/,
    ],
    [
      'too many arrows indoors',
      'writer1b',
      (p) =>
        p.write({
          sessionId: s(),
          entryId: field.archer(2, 'A').entryId,
          endIndex: 0,
          slot: 1,
          arrows: ['10', '9', '9', '8'],
        }),
      /End has 4 arrows; this round has 3 per end\./,
    ],
    [
      'an end beyond the 70 m round',
      'writer1',
      (p) => write(p, 12),
      /^Ada Fletcher shoots the 70 m round, which has 12 ends; there is no end 13\.$/,
    ],
    [
      'an end beyond the 18 m round',
      'writer1b',
      (p) =>
        p.write({
          sessionId: s(),
          entryId: field.archer(2, 'A').entryId,
          endIndex: 20,
          slot: 1,
          arrows: ['10'],
        }),
      /which has 20 ends; there is no end 21\./,
    ],
    [
      'a flag on an arrow the end does not have',
      'writer1',
      (p) =>
        p.write({
          sessionId: s(),
          entryId: ada().entryId,
          endIndex: 0,
          slot: 1,
          arrows: ['10', '9'],
          flags: [{ index: 4, flag: 'pass-through' }],
        }),
      /the pass-through mark is on arrow 5, but the end has 2 arrows\./,
    ],
    [
      'an archer who is not in the session',
      'writer1',
      (p) => p.write({ sessionId: s(), entryId: 999_999, endIndex: 0, slot: 1, arrows: ['10'] }),
      /has no target in the session "Qualification"/,
    ],
    [
      'a session that does not exist',
      'writer1',
      (p) => p.write({ sessionId: 999_999, entryId: ada().entryId, endIndex: 0, slot: 1, arrows: ['10'] }),
      /session no longer exists/,
    ],
  ];

  it.each(cases)('refuses %s, with a reason, and stores no effect', async (_label, who, make, reason) => {
    const phone = new Phone(server.app, people[who]);
    const m = make(phone);
    const before = await fieldTableCounts(server.db);
    const res = await phone.push([m]);
    expect(res.results).toEqual([
      { seq: 1, id: m.id, status: 'rejected', reason: expect.stringMatching(reason) },
    ]);
    expect(res.lastSeq).toBe(1);
    const after = await fieldTableCounts(server.db);
    expect(after).toEqual({
      ...before,
      mutations: before.mutations! + 1,
      sync_clients: before.sync_clients! + 1,
    });
  });

  it('holds writes that arrive once the session is closed, for a judge (sync.lateValues.test.ts)', async () => {
    const phone = new Phone(server.app, people.writer1);
    await server
      .db('event_sessions')
      .where({ id: field.sessionId })
      .update({ closed_at: new Date().toISOString() });
    try {
      const res = await phone.push([write(phone, 0)]);
      expect(res.results[0]).toMatchObject({
        status: 'held',
        reason: expect.stringMatching(/kept for a judge/),
      });
    } finally {
      await server.db('event_sessions').where({ id: field.sessionId }).update({ closed_at: null });
    }
  });
});

describe('requests refused as a whole store nothing', () => {
  const push = (body: unknown, person: TestPerson = people.writer1) =>
    request(server.app)
      .post('/api/sync/push')
      .set(person.auth)
      .set('Content-Type', 'application/json')
      .send(typeof body === 'string' ? body : JSON.stringify(body));
  const valid = (over: Record<string, unknown> = {}, args: Record<string, unknown> = {}) => ({
    id: randomUUID(),
    seq: 1,
    at: new Date().toISOString(),
    kind: 'end.write',
    args: {
      sessionId: field.sessionId,
      entryId: ada().entryId,
      endIndex: 0,
      slot: 1,
      arrows: ['10'],
      ...args,
    },
    ...over,
  });

  const bad: [string, () => unknown, RegExp][] = [
    ['no changes at all', () => ({ clientId: 'phone-empty-batch', mutations: [] }), /mutations/],
    ['a missing client id', () => ({ mutations: [valid()] }), /clientId/],
    [
      'a change id that is not a uuid',
      () => ({ clientId: 'phone-bad-id', mutations: [valid({ id: 'one' })] }),
      /mutations\.0\.id/,
    ],
    [
      'a seq of 0',
      () => ({ clientId: 'phone-seq-zero', mutations: [valid({ seq: 0 })] }),
      /mutations\.0\.seq/,
    ],
  ];

  it.each(bad)('%s: 400 with a readable message', async (_label, body, message) => {
    const before = await fieldTableCounts(server.db);
    const res = await push(body());
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_request');
    expect(res.body.error.message).toMatch(/^The request was not accepted\. /);
    expect(res.body.error.message).toMatch(message);
    expect(await fieldTableCounts(server.db)).toEqual(before);
  });

  it('too many changes at once: 413, so the phone sends its batch in halves; nothing stored', async () => {
    const before = await fieldTableCounts(server.db);
    const res = await push({
      clientId: 'phone-huge-batch',
      mutations: Array.from({ length: 501 }, (_, i) => valid({ seq: i + 1 })),
    });
    expect(res.status).toBe(413);
    expect(res.body.error).toEqual({ code: 'too_large', message: 'Send at most 500 changes at once.' });
    expect(await fieldTableCounts(server.db)).toEqual(before);
  });

  it('a body that is not JSON, and a body over the size limit: 400 and 413, nothing stored', async () => {
    const before = await fieldTableCounts(server.db);
    const broken = await push('{"clientId": ');
    expect(broken.status).toBe(400);
    expect(broken.body.error.message).toBe('The request body is not valid JSON.');
    const huge = await push({
      clientId: 'phone-huge-body',
      mutations: [valid({}, { arrows: Array.from({ length: 60_000 }, () => '10') })],
    });
    expect(huge.status).toBe(413);
    expect(huge.body.error.message).toMatch(/too large/);
    expect(await fieldTableCounts(server.db)).toEqual(before);
  });

  it('refuses with 403 a client id that belongs to another person, storing nothing', async () => {
    const owner = new Phone(server.app, people.writer2);
    await owner.push([write(owner, 0, ['10'], 2)]);
    const before = await fieldTableCounts(server.db);
    const res = await push({ clientId: owner.clientId, mutations: [valid({ seq: 2 })] }, people.writer1);
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/belong to another account/);
    expect(await fieldTableCounts(server.db)).toEqual(before);
    expect((await server.db('sync_clients').where({ client_id: owner.clientId }).first()).last_seq).toBe(1);
  });

  it('refuses anonymous pushes with 401', async () => {
    const res = await request(server.app)
      .post('/api/sync/push')
      .send({ clientId: 'phone-anonymous', mutations: [valid()] });
    expect(res.status).toBe(401);
    expect(res.body.error.message).toMatch(/sign in/i);
  });
});

describe('a change the server cannot read is refused on its own', () => {
  const raw = (seq: number, over: Record<string, unknown> = {}, args: Record<string, unknown> = {}) => ({
    id: randomUUID(),
    seq,
    at: new Date().toISOString(),
    kind: 'end.write',
    args: {
      sessionId: field.sessionId,
      entryId: field.archer(1, 'B').entryId,
      endIndex: 11,
      slot: 1,
      arrows: ['10'],
      ...args,
    },
    ...over,
  });
  const unreadable: [string, Record<string, unknown>, Record<string, unknown>, RegExp][] = [
    [
      'a kind this server does not know yet',
      { kind: 'end.erase' },
      {},
      /Unknown kind of change\. This phone may need the newest version of Ringcall\./,
    ],
    [
      'an arrow value that does not exist',
      {},
      { arrows: ['11'] },
      /"11" is not an arrow value\. Use X, 10 to 1, or M\./,
    ],
    ['a writer slot 3', {}, { slot: 3 }, /args\.slot/],
    [
      'a time with an offset',
      { at: '2026-12-12T10:00:00+01:00' },
      {},
      /^This change could not be read: at: /,
    ],
    ['a time that is not a time', { at: 'yesterday' }, {}, /at: /],
    ['a change too large to be one', { note: 'n'.repeat(9000) }, {}, /too large to be one change/],
  ];

  it.each(unreadable)(
    '%s: refused with its reason, logged, and the change behind it applied',
    async (_label, over, args, reason) => {
      const clientId = `phone-unreadable-${randomUUID()}`;
      const bad = raw(1, over, args);
      const good = raw(2);
      const res = await request(server.app)
        .post('/api/sync/push')
        .set(people.writer1.auth)
        .send({ clientId, mutations: [bad, good] });
      expect(res.status).toBe(200);
      expect(res.body.lastSeq).toBe(2);
      expect(res.body.results[0]).toMatchObject({ seq: 1, id: bad.id, status: 'rejected' });
      expect(res.body.results[0].reason).toMatch(reason);
      expect(res.body.results[1]).toEqual({ seq: 2, id: good.id, status: 'applied' });
      const logged = await server.db('mutations').where({ mutation_uuid: bad.id }).first();
      expect(logged).toMatchObject({
        client_id: clientId,
        seq: 1,
        status: 'rejected',
        reason: res.body.results[0].reason,
      });

      // Sent again (the phone missed the answer): answered from the log, never a 400.
      const again = await request(server.app)
        .post('/api/sync/push')
        .set(people.writer1.auth)
        .send({ clientId, mutations: [bad, good] });
      expect(again.status).toBe(200);
      expect(again.body.results.map((r: { status: string }) => r.status)).toEqual(['rejected', 'duplicate']);
    },
  );
});

describe('scores outlive setup changes', () => {
  it('a session or an entry that has scores cannot be deleted with them', async () => {
    const other = await setUpMixedField(server.db);
    const writer = await makePerson(server.db, 'Keeper Of Scores');
    const phone = new Phone(server.app, writer);
    await phone.join(other.targets.get(1)!.code, 'writer1');
    const entryId = other.archer(1, 'A').entryId;
    await phone.push([
      phone.write({ sessionId: other.sessionId, entryId, endIndex: 0, slot: 1, arrows: SIX }),
    ]);
    const before = await fieldTableCounts(server.db);

    const asOrganizer = (path: string) =>
      request(server.app).delete(`/api/events/${other.eventId}${path}`).set(other.organizer.auth);
    const entry = await asOrganizer(`/entries/${entryId}`);
    const session = await asOrganizer(`/sessions/${other.sessionId}`);
    // Refused (today by the database's foreign keys); never a success that takes the scores along.
    expect(entry.status).toBeGreaterThanOrEqual(400);
    expect(session.status).toBeGreaterThanOrEqual(400);
    expect(await fieldTableCounts(server.db)).toEqual(before);
    expect(
      await server.db('end_entries').where({ session_id: other.sessionId, entry_id: entryId }).first(),
    ).toBeDefined();
  });
});
