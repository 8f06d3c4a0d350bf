import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { BracketDto, MatchDto } from '../../src/contract/matches';
import type { Mutation, MutationResult } from '../../src/contract/sync';
import type { Field } from './support/fieldSetup';
import { setUpMatchWriters, type MatchWritersField } from './support/matchWriters';
import { giveRole, makePerson, type TestPerson } from './support/people';
import { Phone } from './support/phone';
import { startTestServer, type TestServer } from './support/testServer';
import { replayLog } from '../../server/services/sync/rebuildFromLog';
import { signMatchEnd } from '../../server/services/matches/endSignatures';
import { recordWalkover, signMatch } from '../../server/services/matches/matchActions';

/*
 * How a match's ends are settled once two writers score it: the judge signs each set or end that
 * counts (closed to the writers from then on; the judge's own correction replaces it and drops the
 * signature; signing the match signs the rest), and a counted end a writer changes afterwards
 * leaves the count at once, with every end after it, until the writers agree again or the judge
 * settles it. All through the phones' outboxes.
 */

let server: TestServer;
let field: Field;
let otherJudge: TestPerson;
let archers: MatchWritersField['archers'];
let first: MatchDto;
let second: MatchDto;

const v = (text: string) => text.split(' ') as ArrowValue[];
const reasonOf = (r: MutationResult | undefined) => (r && 'reason' in r ? r.reason : undefined);
const matchById = async (id: number) =>
  (
    (await request(server.app).get(`/api/events/${field.eventId}/brackets`).set(field.organizer.auth)).body
      .brackets as BracketDto[]
  )[0]!.matches.find((m) => m.id === id)!;
async function pushOne(phone: Phone, change: Mutation): Promise<MutationResult> {
  return (await phone.push([change])).results[0]!;
}
/** A set the upper line wins, a tied set. */
const WIN = { a: v('10 10 10'), b: v('9 9 9') };
const TIE = { a: v('9 9 9'), b: v('9 9 9') };

beforeAll(async () => {
  server = await startTestServer();
  let codes: Map<number, string>;
  ({ field, otherJudge, archers, first, second, codes } = await setUpMatchWriters(server));
  for (const [person, m] of [
    [archers.a, first],
    [archers.b, first],
    [archers.c, second],
    [archers.d, second],
  ] as const) {
    const joined = await request(server.app)
      .post('/api/join/match')
      .set(person.auth)
      .send({ code: codes.get(m.id) });
    expect(joined.status).toBe(200);
  }
});
afterAll(() => server.close());

describe('the judge signs each set', () => {
  const ref = () => ({ eventId: field.eventId, matchId: first.id });

  it('signs a set that counts once, and closes it to the writers', async () => {
    const pa = new Phone(server.app, archers.a);
    const pb = new Phone(server.app, archers.b);
    await pushOne(pa, pa.matchWrite({ ...ref(), endIndex: 0, ...WIN }));
    await pushOne(pb, pb.matchWrite({ ...ref(), endIndex: 0, ...WIN }));
    const judge = new Phone(server.app, field.judge);
    const sign = judge.matchEndSign({ ...ref(), endIndex: 0 });
    expect((await judge.push([sign])).results[0]).toMatchObject({ status: 'applied' });
    expect((await judge.push([sign])).results[0]).toMatchObject({ status: 'duplicate' });
    expect(reasonOf(await pushOne(judge, judge.matchEndSign({ ...ref(), endIndex: 0 })))).toBe(
      'End 1 of this match is already signed.',
    );
    expect(await server.db('audit_log').where({ action: 'match.endSign' })).toHaveLength(1);
    const m = await matchById(first.id);
    expect(m.ends).toEqual([{ ...WIN, by: 'writers', signed: true }]);
    expect(m.state!.score).toEqual({ a: 2, b: 0 });
    // A writer's later write to the signed set is refused in words; their record stays as it was.
    expect(reasonOf(await pushOne(pa, pa.matchWrite({ ...ref(), endIndex: 0, ...TIE })))).toBe(
      'The judge signed end 1 of this match; ask the judge.',
    );
    expect((await matchById(first.id)).writes.find((w) => w.slot === 1 && w.endIndex === 0)).toMatchObject(
      WIN,
    );
  });

  it('refuses an archer, a judge of another event, and a set that does not count', async () => {
    const pa = new Phone(server.app, archers.a);
    expect(reasonOf(await pushOne(pa, pa.matchEndSign({ ...ref(), endIndex: 0 })))).toContain(
      'Only a judge of this event',
    );
    const pj = new Phone(server.app, otherJudge);
    expect(reasonOf(await pushOne(pj, pj.matchEndSign({ ...ref(), endIndex: 0 })))).toContain(
      'Only a judge of this event',
    );
    // Written by one writer only: it does not count yet.
    await pushOne(pa, pa.matchWrite({ ...ref(), endIndex: 1, ...TIE }));
    const judge = new Phone(server.app, field.judge);
    expect(reasonOf(await pushOne(judge, judge.matchEndSign({ ...ref(), endIndex: 1 })))).toBe(
      'End 2 of this match does not count yet: the two writers have not agreed on it (or on an end before it) and no judge has settled it.',
    );
    expect(
      await server.db('match_ends').where({ match_id: first.id }).whereNotNull('signed_at'),
    ).toHaveLength(1);
  });

  it('lets the judge correct a signed set: the correction replaces it and drops the signature', async () => {
    const judge = new Phone(server.app, field.judge);
    const corrected = { a: v('10 10 9'), b: v('9 9 9') };
    expect(await pushOne(judge, judge.matchEnd({ ...ref(), endIndex: 0, ...corrected }))).toMatchObject({
      status: 'applied',
    });
    expect((await matchById(first.id)).ends[0]).toEqual({ ...corrected, by: 'judge' });
    // Signed again through the route (the judge's phone uses the outbox; the route answers the brackets).
    const path = `/api/events/${field.eventId}/matches/${first.id}/ends/0/sign`;
    expect((await request(server.app).post(path).set(archers.a.auth)).status).toBe(403);
    // Two judges of the event sign at once, both checks before either write: one signature is
    // kept, by its signer; the other hears it is signed already.
    const secondJudge = await makePerson(server.db, 'Second Judge');
    await giveRole(server.db, field.eventId, secondJudge, 'judge');
    const raced = await Promise.allSettled(
      [field.judge, secondJudge].map((person) =>
        signMatchEnd(server.db, field.eventId, first.id, 0, person.id),
      ),
    );
    expect(raced.map((r) => r.status).sort()).toEqual(['fulfilled', 'rejected']);
    const refused = raced.find((r) => r.status === 'rejected')!;
    expect(String(refused.reason)).toContain('End 1 of this match is already signed.');
    const signer = raced[0]!.status === 'fulfilled' ? field.judge : secondJudge;
    const row = await server.db('match_ends').where({ match_id: first.id, end_index: 0 }).first();
    expect(row.signed_by).toBe(signer.id);
    expect(await server.db('audit_log').where({ action: 'match.endSign' })).toHaveLength(2);
    expect((await matchById(first.id)).ends[0]).toEqual({ ...corrected, by: 'judge', signed: true });
    const twice = await request(server.app).post(path).set(field.judge.auth);
    expect(twice.status).toBe(409);
    expect(twice.body.error.message).toBe('End 1 of this match is already signed.');
  });

  it('signing the match signs its counted sets not signed yet; a signed match never changes', async () => {
    const pa = new Phone(server.app, archers.a);
    const pb = new Phone(server.app, archers.b);
    await pushOne(pb, pb.matchWrite({ ...ref(), endIndex: 1, ...WIN }));
    await pushOne(pa, pa.matchWrite({ ...ref(), endIndex: 1, ...WIN }));
    await pushOne(pa, pa.matchWrite({ ...ref(), endIndex: 2, ...WIN }));
    await pushOne(pb, pb.matchWrite({ ...ref(), endIndex: 2, ...WIN }));
    const judge = new Phone(server.app, field.judge);
    expect(await pushOne(judge, judge.matchSign(ref()))).toMatchObject({ status: 'applied' });
    const signed = await matchById(first.id);
    expect(signed.winner).toBe('a');
    expect(signed.ends.map((e) => e.signed)).toEqual([true, true, true]);
    expect(reasonOf(await pushOne(pa, pa.matchWrite({ ...ref(), endIndex: 1, ...TIE })))).toContain(
      'already signed',
    );
    expect(reasonOf(await pushOne(judge, judge.matchEndSign({ ...ref(), endIndex: 2 })))).toContain(
      'already signed',
    );
    expect((await matchById(first.id)).ends).toEqual(signed.ends);
  });
});

describe('a counted set a writer changes afterwards', () => {
  const ref = () => ({ eventId: field.eventId, matchId: second.id });
  let pc: Phone;
  let pd: Phone;
  let judge: Phone;
  const both = async (endIndex: number, end: typeof WIN) => {
    await pushOne(pc, pc.matchWrite({ ...ref(), endIndex, ...end }));
    await pushOne(pd, pd.matchWrite({ ...ref(), endIndex, ...end }));
  };

  beforeAll(() => {
    pc = new Phone(server.app, archers.c);
    pd = new Phone(server.app, archers.d);
    judge = new Phone(server.app, field.judge);
  });

  it('leaves the count at once with the sets after it, and comes back when both writers agree', async () => {
    await both(0, TIE);
    await both(1, TIE);
    // Set 3: the writers differ, the judge settles it.
    await pushOne(pc, pc.matchWrite({ ...ref(), endIndex: 2, ...TIE }));
    await pushOne(pd, pd.matchWrite({ ...ref(), endIndex: 2, ...WIN }));
    await pushOne(judge, judge.matchEnd({ ...ref(), endIndex: 2, ...TIE }));
    expect((await matchById(second.id)).state!.score).toEqual({ a: 3, b: 3 });

    // One writer changes set 1: it no longer counts, and neither do sets 2 and 3 after it.
    expect(await pushOne(pc, pc.matchWrite({ ...ref(), endIndex: 0, ...WIN }))).toMatchObject({
      status: 'applied',
    });
    const changed = await matchById(second.id);
    expect(changed.ends).toEqual([]);
    expect(changed.state!.score).toEqual({ a: 0, b: 0 });
    expect(reasonOf(await pushOne(judge, judge.matchEndSign({ ...ref(), endIndex: 1 })))).toContain(
      'End 2 of this match does not count yet',
    );
    // The judge's set 3 is kept, waiting for the sets before it.
    expect(await server.db('match_ends').where({ match_id: second.id }).select('end_index')).toEqual([
      { end_index: 2 },
    ]);

    await pushOne(pd, pd.matchWrite({ ...ref(), endIndex: 0, ...WIN }));
    const again = await matchById(second.id);
    expect(again.ends).toEqual([
      { ...WIN, by: 'writers' },
      { ...TIE, by: 'writers' },
      { ...TIE, by: 'judge' },
    ]);
    expect(again.state!.score).toEqual({ a: 4, b: 2 });
  });

  it('comes back when the judge settles the changed set, with the agreed sets after it', async () => {
    await pushOne(pd, pd.matchWrite({ ...ref(), endIndex: 0, ...TIE }));
    expect((await matchById(second.id)).ends).toEqual([]);
    await pushOne(judge, judge.matchEnd({ ...ref(), endIndex: 0, ...TIE }));
    const settled = await matchById(second.id);
    expect(settled.ends.map((e) => e.by)).toEqual(['judge', 'writers', 'judge']);
    expect(settled.state!.score).toEqual({ a: 3, b: 3 });
  });

  it('refuses a writer’s change once the judge recorded the shoot-off', async () => {
    await both(3, TIE);
    await both(4, TIE);
    expect((await matchById(second.id)).state!.next).toBe('shoot-off');
    const arrow = (value: ArrowValue) => ({ value, closer: false });
    expect(
      await pushOne(judge, judge.matchShootOff({ ...ref(), a: arrow('10'), b: arrow('9') })),
    ).toMatchObject({ status: 'applied' });
    expect(reasonOf(await pushOne(pc, pc.matchWrite({ ...ref(), endIndex: 1, ...WIN })))).toBe(
      'The judge recorded the shoot-off of this match: its ends are closed; ask the judge.',
    );
    expect((await matchById(second.id)).state!.winner).toBe('a');
  });
});

describe('a decided match signed twice at once', () => {
  it('keeps one decision: a second signature or a walkover racing it is refused and undone', async () => {
    // The second match is decided by its shoot-off above and not signed yet.
    const secondJudge = await makePerson(server.db, 'Racing Judge');
    await giveRole(server.db, field.eventId, secondJudge, 'judge');
    const raced = await Promise.allSettled([
      signMatch(server.db, field.eventId, second.id, field.judge.id),
      signMatch(server.db, field.eventId, second.id, secondJudge.id),
      recordWalkover(
        server.db,
        field.eventId,
        second.id,
        { side: 'a', reason: 'withdrawal' },
        field.organizer.id,
      ),
    ]);
    // Whichever came first is kept; the others are refused in words (a 409), not a database failure.
    expect(raced.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
    for (const r of raced.filter((x): x is PromiseRejectedResult => x.status === 'rejected'))
      expect(r.reason).toMatchObject({ status: 409, message: expect.stringContaining('decided') });
    const row = await server.db('matches').where({ id: second.id }).first();
    const kept = raced.findIndex((r) => r.status === 'fulfilled');
    expect(row).toMatchObject(
      kept === 2
        ? { winner_side: 'b', decided_by: 'withdrawal', signed_by: field.organizer.id }
        : { winner_side: 'a', decided_by: 'shoot-off', signed_by: [field.judge, secondJudge][kept]!.id },
    );
    const decisions = await server.db('audit_log').whereIn('action', ['match.sign', 'match.walkover']);
    expect(
      decisions.filter((d: { details: string }) => d.details.includes(`"matchId":${second.id}`)),
    ).toHaveLength(1);
  });
});

describe('the log replay', () => {
  it('passes over every kind of match change (records of their own, not replayed)', async () => {
    const kinds = (await server.db('mutations').distinct('kind')).map((r: { kind: string }) => r.kind);
    expect(kinds).toEqual(expect.arrayContaining(['match.write', 'match.endSign', 'match.sign']));
    await expect(replayLog(server.db)).resolves.toBeTruthy();
  });
});
