import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { BracketDto, MatchDto } from '../../src/contract/matches';
import { replayLog } from '../../server/services/sync/rebuildFromLog';
import type { Field } from './support/fieldSetup';
import {
  matchOf,
  organizerBrackets,
  reasonOf,
  setUpMatchWriters,
  type MatchWritersField,
} from './support/matchWriters';
import type { TestPerson } from './support/people';
import { Phone } from './support/phone';
import { startTestServer, type TestServer } from './support/testServer';

/*
 * Alternate shooting in the finals: the organizer sets which matches of a bracket alternate; a
 * writer of the match or a judge of the event records who shoots first in the first end, once,
 * until end 1 has arrows. Everyone else, and every bad body, is refused in words.
 */

let server: TestServer;
let field: Field;
let stranger: TestPerson;
let otherJudge: TestPerson;
let otherEventId: number;
let archers: MatchWritersField['archers'];
let first: MatchDto;
let second: MatchDto;
let codes: Map<number, string>;
let bracketId: number;

const v = (text: string) => text.split(' ') as ArrowValue[];
const brackets = () => organizerBrackets(server, field);
const matchById = (id: number) => matchOf(server, field, id);
const setAlternate = (
  person: TestPerson,
  body: unknown,
  id: number | string = bracketId,
  eventId = field.eventId,
) =>
  request(server.app)
    .patch(`/api/events/${eventId}/brackets/${id}`)
    .set(person.auth)
    .send(body as object);
const pushOne = async (phone: Phone, m: ReturnType<Phone['matchFirstShooter']>) =>
  (await phone.push([m])).results[0]!;

beforeAll(async () => {
  server = await startTestServer();
  ({ field, stranger, otherJudge, otherEventId, archers, first, second, codes } =
    await setUpMatchWriters(server));
  bracketId = (await brackets())[0]!.id;
  for (const [person, match] of [
    [archers.a, first],
    [archers.b, first],
    [archers.c, second],
  ] as const) {
    const joined = await request(server.app)
      .post('/api/join/match')
      .set(person.auth)
      .send({ code: codes.get(match.id) });
    expect(joined.status).toBe(200);
  }
});
afterAll(() => server.close());

describe('which matches alternate (the organizer’s setting per bracket)', () => {
  it('is never by default, and set by the organizer to the medal matches or from the semi-finals on', async () => {
    const before = (await brackets())[0]!;
    expect(before.alternate).toBe('never');
    expect(before.matches.every((m) => !m.alternate && m.firstShooter === null)).toBe(true);
    const medals = await setAlternate(field.organizer, { alternate: 'medal-matches' });
    expect(medals.status).toBe(200);
    const byRound = (b: BracketDto) => b.matches.map((m) => [m.round, m.bronze, m.alternate]);
    // A bracket of 4: the semi-finals are round 0; the final and the bronze match round 1.
    expect(byRound((medals.body.brackets as BracketDto[])[0]!)).toEqual([
      [0, false, false],
      [0, false, false],
      [1, false, true],
      [1, true, true],
    ]);
    const semis = await setAlternate(field.organizer, { alternate: 'semi-finals' });
    expect((semis.body.brackets as BracketDto[])[0]!.alternate).toBe('semi-finals');
    expect((semis.body.brackets as BracketDto[])[0]!.matches.every((m) => m.alternate)).toBe(true);
    expect(await server.db('audit_log').where({ action: 'bracket.alternate' })).toHaveLength(2);
  });

  it('is the organizer’s alone, and refuses bad bodies and other events’ brackets in words', async () => {
    for (const person of [field.judge, archers.a, stranger]) {
      const res = await setAlternate(person, { alternate: 'never' });
      expect(res.status).toBe(403);
      expect(res.body.error.message).toBe('Only an event organizer can do this.');
    }
    const anonymous = await request(server.app)
      .patch(`/api/events/${field.eventId}/brackets/${bracketId}`)
      .send({ alternate: 'never' });
    expect(anonymous.status).toBe(401);
    for (const body of [{}, { alternate: 'always' }, { alternate: true }, 'semi-finals']) {
      const res = await setAlternate(field.organizer, body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.message).toMatch(/never|object/i);
    }
    const words = await setAlternate(field.organizer, { alternate: 'always' });
    expect(words.body.error.message).toContain('"medal-matches" (bronze and gold)');
    const notNumber = await setAlternate(field.organizer, { alternate: 'never' }, 'abc');
    expect(notNumber.status).toBe(404);
    expect(notNumber.body.error.message).toBe('That bracket does not exist.');
    const elsewhere = await setAlternate(field.organizer, { alternate: 'never' }, bracketId, otherEventId);
    expect(elsewhere.status).toBe(404);
    expect(elsewhere.body.error.message).toBe('That bracket does not exist in this event.');
    expect((await brackets())[0]!.alternate).toBe('semi-finals');
  });
});

describe('who shoots first (through the outbox)', () => {
  const ref = () => ({ eventId: field.eventId, matchId: first.id });

  it('is recorded by a writer of the match, applied once, and corrected before end 1', async () => {
    const pa = new Phone(server.app, archers.a);
    const choice = pa.matchFirstShooter({ ...ref(), side: 'b' });
    expect(await pushOne(pa, choice)).toMatchObject({ status: 'applied' });
    expect((await matchById(first.id)).firstShooter).toBe('b');
    // The same change pushed again is answered from the log, not applied again.
    expect(await pushOne(pa, choice)).toMatchObject({ status: 'duplicate' });
    expect(
      await server.db('mutations').where({ kind: 'match.firstShooter', status: 'applied' }),
    ).toHaveLength(1);
    // The other writer corrects it before the first arrow; a judge may record it too.
    const pb = new Phone(server.app, archers.b);
    expect(await pushOne(pb, pb.matchFirstShooter({ ...ref(), side: 'a' }))).toMatchObject({
      status: 'applied',
    });
    const judge = new Phone(server.app, field.judge);
    expect(
      await pushOne(
        judge,
        judge.matchFirstShooter({ eventId: field.eventId, matchId: second.id, side: 'b' }),
      ),
    ).toMatchObject({ status: 'applied' });
    expect((await matchById(first.id)).firstShooter).toBe('a');
    expect((await matchById(second.id)).firstShooter).toBe('b');
  });

  it('is refused in words for anyone else: a stranger, a writer of another match, another event’s judge', async () => {
    for (const person of [stranger, archers.c, otherJudge]) {
      const phone = new Phone(server.app, person);
      expect(reasonOf(await pushOne(phone, phone.matchFirstShooter({ ...ref(), side: 'b' })))).toBe(
        'Only the writers of this match (after joining it with its code) or a judge of the event record who shoots first.',
      );
    }
    // An archer of the match who has not joined it is no writer yet.
    const pd = new Phone(server.app, archers.d);
    const notJoined = { eventId: field.eventId, matchId: second.id, side: 'a' as const };
    expect(reasonOf(await pushOne(pd, pd.matchFirstShooter(notJoined)))).toContain('Only the writers');
    expect((await matchById(first.id)).firstShooter).toBe('a');
  });

  it('refuses a body the schema cannot read, on its own', async () => {
    const pa = new Phone(server.app, archers.a);
    const good = pa.matchFirstShooter({ ...ref(), side: 'a' });
    const res = await pa.push([{ ...good, args: { ...ref(), side: 'c' } } as unknown as typeof good]);
    expect(res.results[0]!.status).toBe('rejected');
    expect(reasonOf(res.results[0])).toContain('Side must be "a" (upper line) or "b" (lower line).');
  });

  it('is refused once end 1 has arrows, and the bracket’s setting cannot change under the match', async () => {
    const pa = new Phone(server.app, archers.a);
    await pa.push([pa.matchWrite({ ...ref(), endIndex: 0, a: v('10'), b: [] })]);
    expect(reasonOf(await pushOne(pa, pa.matchFirstShooter({ ...ref(), side: 'b' })))).toBe(
      'End 1 of this match has arrows already: who shoots first cannot change any more.',
    );
    const off = await setAlternate(field.organizer, { alternate: 'medal-matches' });
    expect(off.status).toBe(409);
    expect(off.body.error.message).toContain('A match of the semi-finals is under way');
    expect((await matchById(first.id)).firstShooter).toBe('a');
  });

  it('leaves the log replayable: match changes are records of their own, not replayed', async () => {
    // The log now holds applied match.firstShooter and match.write changes; the replay once threw
    // on any match change but the judge's.
    expect(await server.db('mutations').where({ kind: 'match.write', status: 'applied' })).not.toHaveLength(
      0,
    );
    await expect(replayLog(server.db)).resolves.toMatchObject({ endEntries: [] });
  });

  it('is refused for a match that is not shot alternately', async () => {
    const other = await startTestServer();
    try {
      const f = await setUpMatchWriters(other);
      const judge = new Phone(other.app, f.field.judge);
      const res = (
        await judge.push([
          judge.matchFirstShooter({ eventId: f.field.eventId, matchId: f.first.id, side: 'a' }),
        ])
      ).results[0];
      expect(reasonOf(res)).toBe(
        'This match is not shot alternately: both archers shoot their end at once. The organizer sets which matches alternate.',
      );
    } finally {
      await other.close();
    }
  });
});
