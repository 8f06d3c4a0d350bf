import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { BracketDto, MatchDto, MatchPadDto } from '../../src/contract/matches';
import type { Mutation, MutationResult } from '../../src/contract/sync';
import type { Field } from './support/fieldSetup';
import { setUpMatchWriters, type MatchWritersField } from './support/matchWriters';
import { expectNoServerErrors } from './support/noServerErrors';
import { giveRole, makeEvent, makePerson, type TestPerson } from './support/people';
import { Phone } from './support/phone';
import { startTestServer, type TestServer } from './support/testServer';

/*
 * A rival with a laptop on the field Wi-Fi against the match join and the match changes: hostile
 * join bodies, people of another match or event, a judge of another event, a signed match. The
 * plain refusals (a stranger joining or writing, countersigning early or twice, a writer on an end
 * the judge settled) are in tests/server/matches.writers.test.ts and matches.sync.test.ts.
 */

let server: TestServer;
let m: MatchWritersField;
let field: Field;
let first: MatchDto;
let second: MatchDto;
expectNoServerErrors();

beforeAll(async () => {
  server = await startTestServer();
  m = await setUpMatchWriters(server);
  ({ field, first, second } = m);
});
afterAll(() => server.close());
afterEach(() => vi.useRealTimers());

const v = (text: string) => text.split(' ') as ArrowValue[];
const reasonOf = (r: MutationResult | undefined) => (r && 'reason' in r ? r.reason : undefined);
const join = (person: TestPerson | null, body: unknown) => {
  const req = request(server.app).post('/api/join/match');
  return (person ? req.set(person.auth) : req).send(body as object);
};
const pushOne = async (phone: Phone, change: Mutation) => (await phone.push([change])).results[0]!;
const matchById = async (id: number) =>
  (
    (await request(server.app).get(`/api/events/${field.eventId}/brackets`).set(field.organizer.auth)).body
      .brackets as BracketDto[]
  )[0]!.matches.find((x) => x.id === id)!;
const expectRefused = (res: request.Response, status: number, message: RegExp) => {
  expect(res.status).toBe(status);
  expect(res.body.error.message).toMatch(message);
};

describe('joining a match with hostile bodies', () => {
  it('refuses a caller without a sign-in', async () => {
    expectRefused(await join(null, { code: m.codes.get(first.id) }), 401, /sign in/i);
  });

  it('refuses codes of the wrong type or size with a 400 in words, and a body over the limit with 413', async () => {
    const archer = m.archers.a;
    for (const body of [
      { code: 'Q'.repeat(10_000) },
      { code: [m.codes.get(first.id)] },
      { code: { code: m.codes.get(first.id) } },
      { code: null },
      { code: true },
      {},
      [m.codes.get(first.id)],
    ])
      expectRefused(await join(archer, body), 400, /join code|not accepted/i);
    expectRefused(await join(archer, { code: 'Q'.repeat(300_000) }), 413, /.{10}/);
    expect(await server.db('match_writers').where({ match_id: first.id })).toHaveLength(0);
  });

  it('reads the code as typed on any keyboard: spaces anywhere and full-width letters; marks it cannot hold are a 400', async () => {
    const code = m.codes.get(first.id)!;
    const spaced = ` ${code.slice(0, 3).toLowerCase()} ${code.slice(3)} `;
    const fullWidth = [...code].map((c) => String.fromCodePoint(c.codePointAt(0)! + 0xfee0)).join('');
    for (const typed of [spaced, fullWidth]) {
      const res = await join(m.archers.a, { code: typed });
      expect(res.status).toBe(200);
      expect((res.body as MatchPadDto).slot).toBe(1);
    }
    // A zero-width space or a direction mark inside: no code holds it, so it is not a guess.
    for (const typed of [`${code.slice(0, 3)}\u200b${code.slice(3)}`, `\u202e${code}`, `${code}\u0000`])
      expectRefused(await join(m.archers.a, { code: typed }), 400, /letters and digits/);
  });

  it('refuses an archer of another match and an archer or judge of another event (403 in words)', async () => {
    const code = m.codes.get(first.id)!;
    const otherEventArcher = await makePerson(server.db, 'Other Event Archer');
    await giveRole(server.db, m.otherEventId, otherEventArcher, 'archer');
    for (const person of [m.archers.c, m.archers.d, otherEventArcher, m.otherJudge, field.judge])
      expectRefused(await join(person, { code }), 403, /Only the two archers of this match/);
  });
});

describe('the organizer naming a scorer', () => {
  const path = () => `/api/events/${field.eventId}/matches/${second.id}/scorers`;

  it('refuses a judge, an archer, and the organizer of another event (through either event)', async () => {
    const rival = await makePerson(server.db, 'Rival Organizer');
    const rivalEvent = await makeEvent(server.db, rival, 'Rival Shoot');
    const body = { slot: 1, email: rival.email };
    expect((await request(server.app).put(path()).send(body)).status).toBe(401);
    for (const person of [field.judge, m.archers.c, rival])
      expect((await request(server.app).put(path()).set(person.auth).send(body)).status).toBe(403);
    const through = await request(server.app)
      .put(`/api/events/${rivalEvent}/matches/${second.id}/scorers`)
      .set(rival.auth)
      .send(body);
    expect(through.status).toBe(404);
    expect(await server.db('match_scorers').where({ match_id: second.id })).toHaveLength(0);
  });

  it('refuses hostile e-mail values and slots with a 400 in words; an address in capitals is the same account', async () => {
    const org = (body: unknown) =>
      request(server.app)
        .put(path())
        .set(field.organizer.auth)
        .send(body as object);
    for (const body of [
      { slot: 1, email: `${'a'.repeat(300)}@example.org` },
      { slot: 1, email: 5 },
      { slot: 1, email: [m.stranger.email] },
      { slot: 1, email: `${m.stranger.email}\u0000` },
      { slot: 1, email: `x@example.org\r\nBcc: y@example.org` },
      { slot: 3, email: m.stranger.email },
      { slot: '1', email: m.stranger.email },
      { email: m.stranger.email },
    ]) {
      const res = await org(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.message.length).toBeGreaterThan(10);
    }
    expect(await server.db('match_scorers').where({ match_id: second.id })).toHaveLength(0);
    expect((await org({ slot: 1, email: ` ${m.stranger.email.toUpperCase()} ` })).status).toBe(204);
    const named = await server.db('match_scorers').where({ match_id: second.id });
    expect(named).toEqual([expect.objectContaining({ slot: 1, user_id: m.stranger.id })]);
  });
});

describe('match changes from the wrong person', () => {
  const ref = () => ({ eventId: field.eventId, matchId: first.id });

  it('refuses a writer the organizer replaced with a scorer; the scorer, who is not an archer, cannot countersign', async () => {
    // Archer c joined the second match as writer 1; the organizer then named a scorer for line 1.
    const c = new Phone(server.app, m.archers.c);
    await request(server.app)
      .put(`/api/events/${field.eventId}/matches/${second.id}/scorers`)
      .set(field.organizer.auth)
      .send({ slot: 1, email: null });
    expect((await join(m.archers.c, { code: m.codes.get(second.id) })).status).toBe(200);
    await request(server.app)
      .put(`/api/events/${field.eventId}/matches/${second.id}/scorers`)
      .set(field.organizer.auth)
      .send({ slot: 1, email: m.stranger.email });
    const write = { eventId: field.eventId, matchId: second.id, endIndex: 0, a: v('9'), b: [] };
    expect(reasonOf(await pushOne(c, c.matchWrite(write)))).toMatch(/Only the two writers of this match/);
    expect(await server.db('match_end_writes').where({ match_id: second.id })).toHaveLength(0);
    const scorer = new Phone(server.app, m.stranger);
    expect(
      reasonOf(
        await pushOne(scorer, scorer.matchCountersign({ eventId: field.eventId, matchId: second.id })),
      ),
    ).toBe('Only the archers of this match countersign its card.');
  });

  it('refuses a judge of the event who did not join as a writer, and a writer of this match naming another event', async () => {
    const judge = new Phone(server.app, field.judge);
    const end = { ...ref(), endIndex: 0, a: v('10 10 10'), b: v('9 9 9') };
    expect(reasonOf(await pushOne(judge, judge.matchWrite(end)))).toMatch(
      /Only the two writers of this match/,
    );
    const a = new Phone(server.app, m.archers.a);
    expect(reasonOf(await pushOne(a, a.matchWrite({ ...end, eventId: m.otherEventId })))).toMatch(
      /does not exist in this event/,
    );
    expect(await server.db('match_end_writes').where({ match_id: first.id })).toHaveLength(0);
  });
});

describe('a judge beyond a ruling', () => {
  const ref = () => ({ eventId: field.eventId, matchId: first.id });

  it('refuses a judge of another event signing or shooting off this event’s match', async () => {
    const other = new Phone(server.app, m.otherJudge);
    const res = await other.push([
      other.matchSign(ref()),
      other.matchShootOff({ ...ref(), a: { value: '9', closer: true }, b: { value: '8', closer: false } }),
    ]);
    for (const r of res.results) expect(reasonOf(r)).toMatch(/Only a judge of this event/);
  });

  it('refuses to change a signed match: no end, shoot-off or second signature; no one countersigns for another', async () => {
    const a = new Phone(server.app, m.archers.a);
    const b = new Phone(server.app, m.archers.b);
    expect((await join(m.archers.b, { code: m.codes.get(first.id) })).status).toBe(200);
    for (const endIndex of [0, 1, 2]) {
      const end = { ...ref(), endIndex, a: v('10 10 10'), b: v('9 9 9') };
      await pushOne(a, a.matchWrite(end));
      await pushOne(b, b.matchWrite(end));
    }
    const judge = new Phone(server.app, field.judge);
    expect(await pushOne(judge, judge.matchSign(ref()))).toMatchObject({ status: 'applied' });
    const signed = await matchById(first.id);
    const res = await judge.push([
      judge.matchEnd({ ...ref(), endIndex: 2, a: v('1 1 1'), b: v('10 10 10') }),
      judge.matchShootOff({ ...ref(), a: { value: '9', closer: false }, b: { value: '10', closer: false } }),
      judge.matchSign(ref()),
    ]);
    expect(res.results.map((r) => r.status)).toEqual(['rejected', 'rejected', 'rejected']);
    for (const r of res.results) expect(reasonOf(r)!.length).toBeGreaterThan(15);
    // The archer of the other match, and a judge, cannot countersign this card.
    const c = new Phone(server.app, m.archers.c);
    expect(reasonOf(await pushOne(c, c.matchCountersign(ref())))).toBe(
      'Only the archers of this match countersign its card.',
    );
    expect(reasonOf(await pushOne(judge, judge.matchCountersign(ref())))).toBe(
      'Only the archers of this match countersign its card.',
    );
    const after = await matchById(first.id);
    expect(after).toEqual(signed);
  });
});

describe('the judge signing one end', () => {
  const ref = () => ({ eventId: field.eventId, matchId: second.id });
  const signPath = (endIndex: string, eventId = field.eventId, matchId = second.id) =>
    `/api/events/${eventId}/matches/${matchId}/ends/${endIndex}/sign`;
  const signatures = () => server.db('match_ends').where({ match_id: second.id }).whereNotNull('signed_at');

  it('refuses end numbers in the address it cannot hold with a 400 in words, and people beyond the event', async () => {
    for (const endIndex of ['-1', '5', '1.5', 'abc', '01', '1e0', '%00', '0x1', ' 0'])
      expectRefused(
        await request(server.app).post(signPath(endIndex)).set(field.judge.auth),
        400,
        /A match has ends/,
      );
    expect((await request(server.app).post(signPath('0'))).status).toBe(401);
    for (const person of [m.archers.c, m.otherJudge, m.stranger])
      expect((await request(server.app).post(signPath('0')).set(person.auth)).status).toBe(403);
    // Through the other event's address, where this match does not exist.
    expectRefused(
      await request(server.app).post(signPath('0', m.otherEventId)).set(m.otherJudge.auth),
      404,
      /match/i,
    );
    expect(await signatures()).toHaveLength(0);
  });

  it('refuses end numbers and references it cannot read in the outbox, each on its own', async () => {
    const judge = new Phone(server.app, field.judge);
    const odd = (args: unknown): Mutation =>
      ({ ...judge.matchEndSign({ ...ref(), endIndex: 0 }), args }) as Mutation;
    const bad = [-1, 5, 1.5, '0', null, 1e308].map((endIndex) => odd({ ...ref(), endIndex }));
    bad.push(odd({ eventId: m.otherEventId, matchId: second.id, endIndex: 0 }));
    const res = await judge.push(bad);
    expect(res.results.map((r) => r.status)).toEqual(bad.map(() => 'rejected'));
    for (const r of res.results) expect(reasonOf(r)!.length).toBeGreaterThan(15);
    expect(await signatures()).toHaveLength(0);
  });
});

describe('guessing match codes', () => {
  it('counts wrong match codes with wrong target codes: the right code waits too', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const guesser = m.archers.d;
    for (let i = 0; i < 5; i += 1)
      expect((await join(guesser, { code: `ZZZZZ${'ACDEF'[i]}` })).status).toBe(404);
    for (let i = 0; i < 5; i += 1) {
      const res = await request(server.app)
        .post('/api/join')
        .set(guesser.auth)
        .send({ code: `YYYYY${'ACDEF'[i]}`, task: 'follower' });
      expect(res.status).toBe(404);
    }
    const held = await join(guesser, { code: m.codes.get(second.id) });
    expectRefused(held, 429, /Too many wrong join codes/);
    vi.setSystemTime(Date.now() + 1_000);
    expect((await join(guesser, { code: m.codes.get(second.id) })).status).not.toBe(429);
  });
});
