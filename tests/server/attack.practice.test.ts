import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PracticeEndDto, PracticeSessionDto } from '../../src/contract/practice';
import type { Mutation, MutationResult, PushResponse } from '../../src/contract/sync';
import { makePerson, type TestPerson } from './support/people';
import { Phone } from './support/phone';
import { expectNoServerErrors } from './support/noServerErrors';
import { arrows, end as practiceEnd, session as practiceSession } from './support/practice';
import { startTestServer, type TestServer } from './support/testServer';

/*
 * A rival on the field Wi-Fi against the practice log's sync: hostile values, odd types and bad
 * encodings in `practice.*` changes, the push body over its size, a stranger without a token.
 * Each is refused in words (the change on its own, or the request with a 4xx), never a 500, and
 * nothing of it is stored. Another account's session: tests/server/practice.sync.test.ts.
 */

let server: TestServer;
let archer: TestPerson;
expectNoServerErrors();

beforeAll(async () => {
  server = await startTestServer();
  archer = await makePerson(server.db, 'Practice Archer');
});
afterAll(() => server.close());

const session = (over: Partial<PracticeSessionDto> = {}) => practiceSession({ note: 'Calm', ...over });
const end = (sessionId: string, index: number, values = ['9']) =>
  practiceEnd(sessionId, index, arrows(...values));
const reasonOf = (r: MutationResult | undefined) => (r && 'reason' in r ? r.reason : undefined);
const storedSession = async (id: string) => server.db('practice_sessions').where({ id }).first();
const storedEnds = async (sessionId: string) =>
  (await server.db('practice_ends').where({ session_id: sessionId }).orderBy('end_index')).map(
    (r: { end_json: string }) => JSON.parse(r.end_json) as PracticeEndDto,
  );
const pushRaw = (person: TestPerson | null, body: unknown) => {
  const req = request(server.app).post('/api/sync/push');
  return (person ? req.set(person.auth) : req).send(body as object);
};
/** A change with arguments no schema would type, numbered by the phone like any other. */
const odd = (phone: Phone, kind: string, args: unknown): Mutation =>
  ({
    ...phone.practice({ kind: 'practice.delete', args: { sessionId: randomUUID() } }),
    kind,
    args,
  }) as Mutation;

describe('a stranger without a sign-in', () => {
  it('can neither push practice nor pull anything: 401 in words, nothing stored', async () => {
    const s = session();
    const phone = new Phone(server.app, archer);
    const body = {
      clientId: phone.clientId,
      mutations: [phone.practice({ kind: 'practice.session', args: s })],
    };
    for (const res of [
      await pushRaw(null, body),
      await request(server.app).post('/api/sync/push').set('Authorization', 'Bearer not-a-token').send(body),
      await request(server.app).get('/api/sync/pull'),
      await request(server.app).get('/api/me/practice-cards').set('Authorization', `Bearer ${archer.token}x`),
    ]) {
      expect(res.status).toBe(401);
      expect(res.body.error.message).toEqual(expect.any(String));
    }
    expect(await storedSession(s.id)).toBeUndefined();
  });
});

describe('hostile values in a practice change', () => {
  it('refuses each one on its own with a sentence; the changes behind it still apply', async () => {
    const phone = new Phone(server.app, archer);
    const s = session();
    const res = await pushRaw(archer, {
      clientId: phone.clientId,
      mutations: [
        phone.practice({ kind: 'practice.session', args: s }),
        phone.practice({ kind: 'practice.end', args: end(s.id, 1, Array<string>(10_000).fill('9')) }),
        phone.practice({ kind: 'practice.end', args: end(s.id, 1e9) }),
        phone.practice({ kind: 'practice.end', args: end(s.id, -1) }),
        phone.practice({ kind: 'practice.end', args: end(s.id, 1.5) }),
        odd(phone, 'practice.end', { ...end(s.id, 0), index: '0' }),
        odd(phone, 'practice.end', { ...end(s.id, 0), distanceM: 'NaN' }),
        odd(phone, 'practice.end', { ...end(s.id, 0), distanceM: 'Infinity' }),
        odd(phone, 'practice.session', { ...s, distanceM: '18' }),
        odd(phone, 'practice.session', [s]),
        odd(phone, 'practice.end', [end(s.id, 0)]),
        odd(phone, 'practice.delete', [s.id]),
        odd(phone, 'practice.end', { ...end(s.id, 0), arrows: { 0: { value: '9' } } }),
        odd(phone, 'practice.end', { ...end(s.id, 0), arrows: [{ value: 9 }] }),
        odd(phone, 'practice.end', { ...end(s.id, 0), arrows: [{ value: '11' }] }),
        odd(phone, 'practice.session', { ...s, id: 'not-a-uuid' }),
        odd(phone, 'practice.session', { ...s, plannedEnds: 1e9 }),
        odd(phone, 'practice.session', { ...s, shaftDiameterMm: -5 }),
        phone.practice({ kind: 'practice.end', args: end(s.id, 0, ['10']) }),
      ],
    });
    expect(res.status).toBe(200);
    const results = (res.body as PushResponse).results;
    expect(results[0]!.status).toBe('applied');
    expect(results.at(-1)!.status).toBe('applied');
    const refused = results.slice(1, -1);
    expect(refused.map((r) => r.status)).toEqual(refused.map(() => 'rejected'));
    for (const r of refused) expect(reasonOf(r)!.length).toBeGreaterThan(15);
    // 10,000 arrows are far over a change's size; an end index out of range says the bound.
    expect(reasonOf(results[1])).toMatch(/too large to be one change .*at most 8000/);
    expect(reasonOf(results[2])).toMatch(/at most 200 ends/);
    // A number out of place says what it should be, not the schema library's words.
    for (const i of [3, 4, 5])
      expect(reasonOf(results[i])).toMatch(/args\.index: An end is numbered by a whole number/);
    for (const i of [6, 7, 8])
      expect(reasonOf(results[i])).toMatch(/args\.distanceM: A distance is a number of metres/);
    expect(reasonOf(results[16])).toMatch(/Planned ends are a whole number from 1 to 200/);
    expect(await storedEnds(s.id)).toEqual([end(s.id, 0, ['10'])]);
    expect(JSON.parse((await storedSession(s.id)).session_json as string)).toEqual(s);
  });

  it('refuses a note of 1 MB: the whole push is over the size limit (413 in words) and nothing is stored', async () => {
    const phone = new Phone(server.app, archer);
    const s = session({ note: 'n'.repeat(1_000_000) });
    const before = await server.db('mutations').count({ n: '*' }).first();
    const res = await pushRaw(archer, {
      clientId: phone.clientId,
      mutations: [phone.practice({ kind: 'practice.session', args: s })],
    });
    expect(res.status).toBe(413);
    expect(res.body.error.message).toEqual(expect.any(String));
    expect(await storedSession(s.id)).toBeUndefined();
    expect(await server.db('mutations').count({ n: '*' }).first()).toEqual(before);
  });

  it('keeps a note with NUL, a lone surrogate half and direction marks as text, and pulls it back unharmed', async () => {
    const phone = new Phone(server.app, archer);
    const note = 'a\u0000b \ud800 c\u202ed';
    const s = session({ note });
    const res = await pushRaw(archer, {
      clientId: phone.clientId,
      mutations: [phone.practice({ kind: 'practice.session', args: s })],
    });
    expect(res.status).toBe(200);
    const stored = JSON.parse((await storedSession(s.id)).session_json as string) as PracticeSessionDto;
    expect(stored.note).toBe(note);
    const pulled = await phone.pull(0);
    expect(pulled.changes.some((c) => JSON.stringify(c.record).includes(s.id))).toBe(true);
  });

  it('answers a body with bytes that are not UTF-8 without a server failure', async () => {
    const phone = new Phone(server.app, archer);
    const s = session();
    const text = JSON.stringify({
      clientId: phone.clientId,
      mutations: [phone.practice({ kind: 'practice.session', args: { ...s, note: 'NOTE' } })],
    });
    const [head, tail] = text.split('NOTE') as [string, string];
    const body = Buffer.concat([Buffer.from(head), Buffer.from([0xff, 0xfe, 0xc3]), Buffer.from(tail)]);
    const res = await request(server.app)
      .post('/api/sync/push')
      .set(archer.auth)
      .set('Content-Type', 'application/json; charset=utf-8')
      .send(body);
    expect(res.status).toBeLessThan(500);
    if (res.status === 200) expect((res.body as PushResponse).results[0]!.status).toBe('applied');
    else expect(res.body.error.message).toEqual(expect.any(String));
  });
});

describe('a client id a person cannot type', () => {
  it('with a lone surrogate half, a NUL, a space or over 100 characters is a 400 in words, nothing stored', async () => {
    // A lone half was stored as bytes that read back as U+FFFD: the phone's sequence was never
    // found again, so each next push stopped at a gap, and the database held text that is not UTF-8.
    const s = session();
    for (const clientId of [
      'phone-\ud800-lone',
      'phone-\udc00-lone',
      'phone-\u0000-nul',
      'phone with space',
      'p'.repeat(101),
    ]) {
      const res = await pushRaw(archer, {
        clientId,
        mutations: [new Phone(server.app, archer).practice({ kind: 'practice.session', args: s })],
      });
      expect(res.status).toBe(400);
      expect(res.body.error.message).toMatch(/clientId/);
    }
    expect(await storedSession(s.id)).toBeUndefined();
    // Nor can such an id have a device key.
    const coordinate = 'A'.repeat(43);
    const key = await request(server.app)
      .post('/api/sync/device-key')
      .set(archer.auth)
      .send({
        clientId: 'phone-\ud800-lone',
        publicJwk: { kty: 'EC', crv: 'P-256', x: coordinate, y: coordinate },
      });
    expect(key.status).toBe(400);
    expect(key.body.error.message).toMatch(/clientId/);
  });
});

describe('the same change id again', () => {
  it('with another payload changes nothing: under its number or a new one it is a duplicate', async () => {
    const phone = new Phone(server.app, archer);
    const s = session({ note: 'first' });
    const original = phone.practice({ kind: 'practice.session', args: s });
    await phone.push([original]);
    const sameNumber = { ...original, args: { ...s, note: 'changed' } } as Mutation;
    expect((await phone.push([sameNumber])).results[0]!.status).toBe('duplicate');
    const next = phone.practice({ kind: 'practice.delete', args: { sessionId: s.id } });
    const newNumber = { ...next, id: original.id } as Mutation;
    expect((await phone.push([newNumber])).results[0]!.status).toBe('duplicate');
    expect(JSON.parse((await storedSession(s.id)).session_json as string).note).toBe('first');
  });

  it('another change under a number already used is refused, not stored', async () => {
    const phone = new Phone(server.app, archer);
    const s = session({ note: 'kept' });
    const original = phone.practice({ kind: 'practice.session', args: s });
    await phone.push([original]);
    const reuse = { ...original, id: randomUUID(), args: { ...s, note: 'overwritten' } } as Mutation;
    const [result] = (await phone.push([reuse])).results;
    expect(result!.status).toBe('rejected');
    expect(reasonOf(result)!.length).toBeGreaterThan(15);
    expect(JSON.parse((await storedSession(s.id)).session_json as string).note).toBe('kept');
  });
});
