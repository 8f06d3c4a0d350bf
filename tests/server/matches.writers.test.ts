import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { MatchDto, MatchPadDto } from '../../src/contract/matches';
import type { Mutation, MutationResult } from '../../src/contract/sync';
import type { Field } from './support/fieldSetup';
import {
  matchOf,
  organizerBrackets,
  reasonOf,
  setUpMatchWriters,
  type MatchWritersField,
} from './support/matchWriters';
import { makePerson, type TestPerson } from './support/people';
import { Phone } from './support/phone';
import { startTestServer, type TestServer } from './support/testServer';

/*
 * Two writers score a match at its target: its archers (or the organizer's named scorers) join it
 * with the match's join code; each writer's ends are kept apart and compared with the core's
 * cross-check; an agreed end counts, a mismatch waits for the judge, whose end settles it; both
 * archers countersign after the judge. Everything else is refused with words.
 */

let server: TestServer;
let field: Field;
let stranger: TestPerson;
let otherJudge: TestPerson;
/** The archers of the first semi-final (seed 1 v 4) and of the second (2 v 3), by line. */
let archers: MatchWritersField['archers'];
let first: MatchDto;
let second: MatchDto;
let codes: Map<number, string>;

const v = (text: string) => text.split(' ') as ArrowValue[];
const brackets = () => organizerBrackets(server, field);
const matchById = (id: number) => matchOf(server, field, id);
const join = (person: TestPerson, code: unknown) =>
  request(server.app).post('/api/join/match').set(person.auth).send({ code });
/** Pushes one change from a person's phone and answers its result. */
async function pushOne(phone: Phone, change: Mutation): Promise<MutationResult> {
  return (await phone.push([change])).results[0]!;
}

beforeAll(async () => {
  server = await startTestServer();
  ({ field, stranger, otherJudge, archers, first, second, codes } = await setUpMatchWriters(server));
});
afterAll(() => server.close());

describe('join codes for match targets', () => {
  it('gives each open match whose archers are known a code, kept when asked again', async () => {
    expect([...codes.keys()].sort()).toEqual([first.id, second.id].sort());
    const again = await request(server.app)
      .get(`/api/events/${field.eventId}/matches/join-codes`)
      .set(field.organizer.auth);
    expect(again.body.codes).toEqual([...codes].map(([matchId, code]) => ({ matchId, code })));
  });

  it('lets only the match’s archers join, each as the writer of their line', async () => {
    const code = codes.get(first.id)!;
    const refused = await join(stranger, code);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toContain('Only the two archers of this match');
    expect((await join(archers.c, code)).status).toBe(403);
    expect((await join(archers.a, 'ZZZZZZ')).status).toBe(404);
    const bad = await join(archers.a, 12);
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toBeTruthy();
    const a = await join(archers.a, code.toLowerCase());
    expect(a.status).toBe(200);
    expect((a.body as MatchPadDto).slot).toBe(1);
    expect((a.body as MatchPadDto).ownEntryId).toBe(first.sides.a!.archers[0]!.entryId);
    const b = await join(archers.b, code);
    expect((b.body as MatchPadDto).slot).toBe(2);
  });

  it('shows the pad to the match’s writers only', async () => {
    const path = `/api/events/${field.eventId}/matches/${first.id}/pad`;
    expect((await request(server.app).get(path).set(archers.a.auth)).status).toBe(200);
    const other = await request(server.app).get(path).set(stranger.auth);
    expect(other.status).toBe(403);
    expect(other.body.error.message).toContain('join code');
  });

  it('lets a scorer the organizer named write for a line in place of its archer', async () => {
    const scorer = await makePerson(server.db, 'Scorer');
    const path = `/api/events/${field.eventId}/matches/${second.id}/scorers`;
    const unknown = await request(server.app)
      .put(path)
      .set(field.organizer.auth)
      .send({ slot: 2, email: 'nobody@example.org' });
    expect(unknown.status).toBe(400);
    expect(
      (await request(server.app).put(path).set(field.judge.auth).send({ slot: 2, email: null })).status,
    ).toBe(403);
    const named = await request(server.app)
      .put(path)
      .set(field.organizer.auth)
      .send({ slot: 2, email: scorer.email });
    expect(named.status).toBe(204);
    const code = codes.get(second.id)!;
    expect((await join(archers.d, code)).status).toBe(403);
    expect(((await join(scorer, code)).body as MatchPadDto).slot).toBe(2);
    expect(((await join(archers.c, code)).body as MatchPadDto).slot).toBe(1);
  });
});

describe('two writers score a match', () => {
  const ref = () => ({ eventId: field.eventId, matchId: first.id });

  it('counts an end when both writers wrote it alike, whatever the order of the taps', async () => {
    const pa = new Phone(server.app, archers.a);
    const pb = new Phone(server.app, archers.b);
    expect(await pushOne(pa, pa.matchWrite({ ...ref(), endIndex: 0, a: v('10 9'), b: [] }))).toMatchObject({
      status: 'applied',
    });
    expect(
      await pushOne(pa, pa.matchWrite({ ...ref(), endIndex: 0, a: v('10 9 9'), b: v('9 9 9') })),
    ).toMatchObject({ status: 'applied' });
    expect((await matchById(first.id)).ends).toHaveLength(0);
    expect(
      await pushOne(pb, pb.matchWrite({ ...ref(), endIndex: 0, a: v('9 10 9'), b: v('9 9 9') })),
    ).toMatchObject({ status: 'applied' });
    const m = await matchById(first.id);
    expect(m.ends).toEqual([{ a: v('10 9 9'), b: v('9 9 9'), by: 'writers' }]);
    expect(m.state!.score).toEqual({ a: 2, b: 0 });
    expect(m.writes.map((w) => w.slot)).toEqual([1, 2]);
  });

  it('refuses a person who is not a writer of the match, a bad body, and ends out of order', async () => {
    const change = { ...ref(), endIndex: 1, a: v('10 10 10'), b: v('9 9 9') };
    const ps = new Phone(server.app, stranger);
    expect(reasonOf(await pushOne(ps, ps.matchWrite(change)))).toContain(
      'Only the two writers of this match',
    );
    const pc = new Phone(server.app, archers.c);
    expect(reasonOf(await pushOne(pc, pc.matchWrite(change)))).toContain(
      'Only the two writers of this match',
    );
    const pj = new Phone(server.app, otherJudge);
    expect(reasonOf(await pushOne(pj, pj.matchWrite(change)))).toContain(
      'Only the two writers of this match',
    );
    const pa = new Phone(server.app, archers.a);
    expect(reasonOf(await pushOne(pa, pa.matchWrite({ ...change, endIndex: 2 })))).toBe(
      'Write end 2 of this match before end 3.',
    );
    const bad = await pa.push([pa.matchWrite({ ...change, a: v('10 10 10 10') })]);
    expect(bad.results[0]!.status).toBe('rejected');
    expect(await server.db('match_end_writes').where({ match_id: first.id, end_index: 1 })).toHaveLength(0);
  });

  it('sends a mismatch to the judge, whose end settles it and closes it to the writers', async () => {
    const pa = new Phone(server.app, archers.a);
    const pb = new Phone(server.app, archers.b);
    await pushOne(pa, pa.matchWrite({ ...ref(), endIndex: 1, a: v('10 10 10'), b: v('9 9 9') }));
    await pushOne(pb, pb.matchWrite({ ...ref(), endIndex: 1, a: v('10 10 9'), b: v('9 9 9') }));
    const waiting = await matchById(first.id);
    expect(waiting.ends).toHaveLength(1);
    expect(waiting.writes.filter((w) => w.endIndex === 1)).toHaveLength(2);
    // The other event's judge cannot settle it; an archer cannot enter the judge's end.
    const pjOther = new Phone(server.app, otherJudge);
    const judgeEnd = { ...ref(), endIndex: 1, a: v('10 10 10'), b: v('9 9 9') };
    expect(reasonOf(await pushOne(pjOther, pjOther.matchEnd(judgeEnd)))).toContain(
      'Only a judge of this event',
    );
    expect(reasonOf(await pushOne(pa, pa.matchEnd(judgeEnd)))).toContain('Only a judge of this event');
    const judge = new Phone(server.app, field.judge);
    expect(await pushOne(judge, judge.matchEnd(judgeEnd))).toMatchObject({ status: 'applied' });
    const settled = await matchById(first.id);
    expect(settled.ends[1]).toEqual({ a: v('10 10 10'), b: v('9 9 9'), by: 'judge' });
    expect(settled.state!.score).toEqual({ a: 4, b: 0 });
    expect(reasonOf(await pushOne(pb, pb.matchWrite({ ...judgeEnd })))).toBe(
      'The judge settled end 2 of this match; only the judge can change it now.',
    );
  });

  it('lets both archers countersign only after the judge signed, once each', async () => {
    const pa = new Phone(server.app, archers.a);
    const pb = new Phone(server.app, archers.b);
    const end = { ...ref(), endIndex: 2, a: v('10 10 10'), b: v('9 9 9') };
    await pushOne(pa, pa.matchWrite(end));
    await pushOne(pb, pb.matchWrite(end));
    expect((await matchById(first.id)).state!.winner).toBe('a');
    expect(reasonOf(await pushOne(pa, pa.matchCountersign(ref())))).toBe(
      'The judge has not signed this match card yet. Countersign it after the judge’s signature.',
    );
    const judge = new Phone(server.app, field.judge);
    expect(await pushOne(judge, judge.matchSign(ref()))).toMatchObject({ status: 'applied' });
    expect(await pushOne(pa, pa.matchCountersign(ref()))).toMatchObject({ status: 'applied' });
    expect(reasonOf(await pushOne(pa, pa.matchCountersign(ref())))).toBe(
      'You have already countersigned this match card.',
    );
    const ps = new Phone(server.app, stranger);
    expect(reasonOf(await pushOne(ps, ps.matchCountersign(ref())))).toBe(
      'Only the archers of this match countersign its card.',
    );
    expect(await pushOne(pb, pb.matchCountersign(ref()))).toMatchObject({ status: 'applied' });
    const signed = await matchById(first.id);
    expect(signed.countersignedBy).toEqual([
      first.sides.a!.archers[0]!.entryId,
      first.sides.b!.archers[0]!.entryId,
    ]);
    // The bracket moved on: the winner is in the final, and the match takes no more writes.
    expect((await brackets())[0]!.matches.find((m) => m.round === 1 && !m.bronze)!.sides.a?.seed).toBe(1);
    expect(reasonOf(await pushOne(pa, pa.matchWrite({ ...end, endIndex: 3 })))).toContain('already signed');
  });
});
