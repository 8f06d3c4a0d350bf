import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { roundEndCount, getRound, type ArrowValue } from '../../src/core';
import type { BracketDto, MatchDto } from '../../src/contract/matches';
import { setUpField, writeAgreedEnds, type Field } from './support/fieldSetup';
import { giveRole, makeEvent, makePerson, type TestPerson } from './support/people';
import { Phone } from './support/phone';
import type { MutationResult } from '../../src/contract/sync';
import { startTestServer, type TestServer } from './support/testServer';

/*
 * The judge's match changes through the phone's outbox: `match.end`, `match.shootoff` and
 * `match.sign` pushed to /api/sync/push are applied by the match services once, whatever the
 * number of pushes; refusals come back as rejected changes with a sentence, nothing stored.
 */

let server: TestServer;
let field: Field;
let stranger: TestPerson;
let otherEventId: number;
const ENDS = roundEndCount(getRound('18m'));

beforeAll(async () => {
  server = await startTestServer();
  const names = [1, 2, 3, 4].map((i) => ({ name: `Recurve ${i}`, division: 'Recurve Men', drop: i }));
  field = await setUpField(server.db, {
    divisions: [{ name: 'Recurve Men', bowStyle: 'recurve', roundId: '18m' }],
    targets: [{ number: 1, archers: names }],
  });
  await writeAgreedEnds(server.db, field, ENDS, (a) => names.find((n) => n.name === a.name)!.drop);
  const divisionId = (await server.db('divisions').where({ event_id: field.eventId }).first('id'))
    .id as number;
  const res = await request(server.app)
    .post(`/api/events/${field.eventId}/brackets`)
    .set(field.organizer.auth)
    .send({ sessionId: field.sessionId, divisionId, size: 4 });
  expect(res.status).toBe(201);
  stranger = await makePerson(server.db, 'Stranger');
  // The field's judge also judges another event: its number does not open this event's matches.
  otherEventId = await makeEvent(server.db, field.organizer, 'Other Shoot');
  await giveRole(server.db, otherEventId, field.judge, 'judge');
});
afterAll(() => server.close());

const brackets = async (): Promise<BracketDto[]> =>
  (await request(server.app).get(`/api/events/${field.eventId}/brackets`).set(field.organizer.auth)).body
    .brackets as BracketDto[];
const match = async (round: number, slot: number, bronze = false): Promise<MatchDto> =>
  (await brackets())[0]!.matches.find((m) => m.round === round && m.slot === slot && m.bronze === bronze)!;
const v = (text: string) => text.split(' ') as ArrowValue[];
/** A refused change's reason. */
const reasonOf = (r: MutationResult | undefined) => (r && 'reason' in r ? r.reason : undefined);
const endCount = async (matchId: number) =>
  (await server.db('match_ends').where({ match_id: matchId })).length;

describe('match changes through the outbox', () => {
  it('applies a match end once when it is pushed twice', async () => {
    const m = await match(0, 0);
    const phone = new Phone(server.app, field.judge);
    const end = phone.matchEnd({
      eventId: field.eventId,
      matchId: m.id,
      endIndex: 0,
      a: v('10 10 10'),
      b: v('9 9 9'),
    });
    expect((await phone.push([end])).results[0]).toMatchObject({ status: 'applied' });
    expect((await phone.push([end])).results[0]).toMatchObject({ status: 'duplicate' });
    expect(await endCount(m.id)).toBe(1);
    expect((await match(0, 0)).state!.score).toEqual({ a: 2, b: 0 });
    const log = await server.db('mutations').where({ mutation_uuid: end.id });
    expect(log).toHaveLength(1);
  });

  it('signs once, and the bracket moves on', async () => {
    const m = await match(0, 0);
    const phone = new Phone(server.app, field.judge);
    const ref = { eventId: field.eventId, matchId: m.id };
    const changes = [
      phone.matchEnd({ ...ref, endIndex: 1, a: v('10 10 10'), b: v('9 9 9') }),
      phone.matchEnd({ ...ref, endIndex: 2, a: v('10 10 10'), b: v('9 9 9') }),
      phone.matchSign(ref),
    ];
    const first = await phone.push(changes);
    expect(first.results.map((r) => r.status)).toEqual(['applied', 'applied', 'applied']);
    const again = await phone.push(changes);
    expect(again.results.map((r) => r.status)).toEqual(['duplicate', 'duplicate', 'duplicate']);
    const signed = await match(0, 0);
    expect(signed.winner).toBe('a');
    const final = await match(1, 0);
    expect(final.sides.a?.seed).toBe(1);
    expect(await server.db('audit_log').where({ action: 'match.sign' })).toHaveLength(1);
  });

  it('decides a 5–5 match by a shoot-off arrow marked closer, applied once', async () => {
    const m = await match(0, 1);
    const phone = new Phone(server.app, field.judge);
    const ref = { eventId: field.eventId, matchId: m.id };
    const sets = ['10 10 10|9 9 9', '9 9 9|10 10 10', '10 10 10|9 9 9', '9 9 9|10 10 10', '9 9 9|9 9 9'];
    const ends = sets.map((s, endIndex) => {
      const [a, b] = s.split('|') as [string, string];
      return phone.matchEnd({ ...ref, endIndex, a: v(a), b: v(b) });
    });
    const early = phone.matchSign(ref);
    const shot = phone.matchShootOff({
      ...ref,
      a: { value: '9', closer: false },
      b: { value: '9', closer: true },
    });
    const sign = phone.matchSign(ref);
    // Answered in the phone's order (seq): five sets, a signature before the shoot-off, the arrows, the signature.
    const res = await phone.push([...ends, early, shot, sign]);
    expect(res.results.map((r) => r.status)).toEqual([
      'applied',
      'applied',
      'applied',
      'applied',
      'applied',
      'rejected',
      'applied',
      'applied',
    ]);
    expect(reasonOf(res.results[5])).toMatch(/not decided yet: the shoot-off arrows are not recorded/);
    expect((await phone.push([shot, sign])).results.map((r) => r.status)).toEqual(['duplicate', 'duplicate']);
    const decided = await match(0, 1);
    expect(decided).toMatchObject({ winner: 'b', decidedBy: 'shoot-off' });
    expect(await server.db('match_shootoff_arrows').where({ match_id: m.id })).toHaveLength(2);
  });

  it('refuses a person who is not a judge of the event, with a reason', async () => {
    const final = await match(1, 0);
    for (const person of [stranger, field.organizer]) {
      const phone = new Phone(server.app, person);
      const res = await phone.push([
        phone.matchEnd({
          eventId: field.eventId,
          matchId: final.id,
          endIndex: 0,
          a: v('9 9 9'),
          b: v('9 9 9'),
        }),
        phone.matchSign({ eventId: field.eventId, matchId: final.id }),
      ]);
      expect(res.results.map((r) => r.status)).toEqual(['rejected', 'rejected']);
      expect(reasonOf(res.results[0])).toMatch(/Only a judge of this event can score its matches/);
    }
    expect(await endCount(final.id)).toBe(0);
  });

  it('refuses a match of another event, even to a judge of that other event', async () => {
    const final = await match(1, 0);
    const phone = new Phone(server.app, field.judge);
    const res = await phone.push([
      phone.matchEnd({ eventId: otherEventId, matchId: final.id, endIndex: 0, a: v('9 9 9'), b: v('9 9 9') }),
      phone.matchShootOff({
        eventId: otherEventId,
        matchId: final.id,
        a: { value: '9', closer: true },
        b: { value: '8', closer: false },
      }),
      phone.matchSign({ eventId: otherEventId, matchId: final.id }),
    ]);
    expect(res.results.map((r) => r.status)).toEqual(['rejected', 'rejected', 'rejected']);
    for (const r of res.results) expect(reasonOf(r)).toMatch(/That match does not exist in this event/);
    expect(await endCount(final.id)).toBe(0);
  });

  it('refuses bad bodies on their own, with what is wrong, and goes on with the next change', async () => {
    const final = await match(1, 0);
    const ref = { eventId: field.eventId, matchId: final.id };
    const bad = [
      {
        kind: 'match.end',
        args: { ...ref, endIndex: 0, a: ['10', '10'], b: ['9', '9', '9'] },
        why: /3 arrows a side/,
      },
      { kind: 'match.end', args: { ...ref, endIndex: 7, a: v('9 9 9'), b: v('9 9 9') }, why: /ends 1 to 5/ },
      { kind: 'match.end', args: { ...ref, endIndex: 0, a: ['11', '9', '9'], b: v('9 9 9') }, why: /a\.0/ },
      {
        kind: 'match.shootoff',
        args: { ...ref, a: { value: '9', closer: true, distanceMm: 3 }, b: { value: '9' } },
        why: /closer/,
      },
      { kind: 'match.sign', args: { eventId: field.eventId }, why: /matchId/ },
    ];
    const mutations = bad.map((b, i) => ({
      id: randomUUID(),
      seq: i + 1,
      at: new Date().toISOString(),
      kind: b.kind,
      args: b.args,
    }));
    const good = new Phone(server.app, field.judge);
    const res = await request(server.app)
      .post('/api/sync/push')
      .set(field.judge.auth)
      .send({
        clientId: good.clientId,
        mutations: [
          ...mutations,
          {
            id: randomUUID(),
            seq: 6,
            at: new Date().toISOString(),
            kind: 'match.end',
            args: { ...ref, endIndex: 0, a: v('9 9 9'), b: v('8 8 8') },
          },
        ],
      });
    expect(res.status).toBe(200);
    const results = res.body.results as { status: string; reason?: string }[];
    bad.forEach((b, i) => {
      expect(results[i]!.status).toBe('rejected');
      expect(results[i]!.reason).toMatch(b.why);
    });
    expect(results[5]!.status).toBe('applied');
    // An end out of order is refused by the match rules, in words.
    const phone = new Phone(server.app, field.judge);
    const gap = await phone.push([phone.matchEnd({ ...ref, endIndex: 3, a: v('9 9 9'), b: v('9 9 9') })]);
    expect(gap.results[0]).toMatchObject({
      status: 'rejected',
      reason: expect.stringMatching(/Record end 2 of this match first/),
    });
  });
});
