import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { roundEndCount, getRound, type ArrowValue } from '../../src/core';
import type { BracketDto, MatchDto } from '../../src/contract/matches';
import { setUpField, writeAgreedEnds, type Field } from './support/fieldSetup';
import { giveRole, makePerson, type TestPerson } from './support/people';
import { startTestServer, type TestServer } from './support/testServer';

/*
 * Eliminations through the API: brackets seeded from final standings (written straight into the
 * database as agreed ends), roles, match ends, shoot-offs, signatures, walkovers, byes, targets
 * and final places. The rules themselves are tested in tests/core/matches.test.ts and seeding.test.ts.
 */

let server: TestServer;
let field: Field;
let archer: TestPerson;
let stranger: TestPerson;
const divisions = new Map<string, number>();
const ENDS = roundEndCount(getRound('18m'));

/** Archers by division: each name's number says how many points it drops in its first end. */
const SPEC: Record<string, { bowStyle: 'recurve' | 'compound' | 'barebow'; drops: number[] }> = {
  'Recurve Men': { bowStyle: 'recurve', drops: [1, 2, 3, 4, 5, 6, 7, 8, 9] },
  'Compound Men': { bowStyle: 'compound', drops: [1, 2, 3, 4] },
  // Two archers level on every count at places 4 and 5.
  'Barebow Men': { bowStyle: 'barebow', drops: [1, 2, 3, 4, 4] },
  'Recurve Juniors': { bowStyle: 'recurve', drops: [1, 2, 3, 4] },
};

beforeAll(async () => {
  server = await startTestServer();
  const names = Object.entries(SPEC).flatMap(([division, d]) =>
    d.drops.map((drop, i) => ({ name: `${division} ${i + 1}`, division, drop })),
  );
  const targets = [];
  for (let i = 0; i < names.length; i += 4)
    targets.push({ number: i / 4 + 1, archers: names.slice(i, i + 4) });
  field = await setUpField(server.db, {
    divisions: Object.entries(SPEC).map(([name, d]) => ({ name, bowStyle: d.bowStyle, roundId: '18m' })),
    targets,
  });
  for (const d of (await server.db('divisions').where({ event_id: field.eventId })) as {
    id: number;
    name: string;
  }[])
    divisions.set(d.name, d.id);
  await writeAgreedEnds(
    server.db,
    field,
    ENDS,
    (a) => names.find((n) => n.name === a.name)!.drop,
    // The last junior has one end to shoot: the standings are not final.
    (a) => (a.name === 'Recurve Juniors 4' ? ENDS - 1 : ENDS),
  );
  archer = await makePerson(server.db, 'Entered Archer');
  await giveRole(server.db, field.eventId, archer, 'archer');
  await server
    .db('entries')
    .where({ event_id: field.eventId, name: 'Recurve Men 9' })
    .update({ user_id: archer.id });
  stranger = await makePerson(server.db, 'Stranger');
});
afterAll(() => server.close());

const base = () => `/api/events/${field.eventId}`;
const create = (body: object, who: TestPerson = field.organizer) =>
  request(server.app).post(`${base()}/brackets`).set(who.auth).send(body);
const brackets = async (): Promise<BracketDto[]> => {
  const res = await request(server.app).get(`${base()}/brackets`).set(field.organizer.auth);
  expect(res.status).toBe(200);
  return res.body.brackets as BracketDto[];
};
const bracketOf = async (division: string) => (await brackets()).find((b) => b.divisionName === division)!;
const matchAt = async (division: string, round: number, slot: number, bronze = false): Promise<MatchDto> =>
  (await bracketOf(division)).matches.find(
    (m) => m.round === round && m.slot === slot && m.bronze === bronze,
  )!;
const seeds = (m: MatchDto) => [m.sides.a?.seed ?? null, m.sides.b?.seed ?? null];
const v = (text: string) => text.split(' ') as ArrowValue[];
const putEnd = (matchId: number, endIndex: number, a: string, b: string, who: TestPerson = field.judge) =>
  request(server.app)
    .put(`${base()}/matches/${matchId}/ends/${endIndex}`)
    .set(who.auth)
    .send({ a: v(a), b: v(b) });
const sign = (matchId: number, who: TestPerson = field.judge) =>
  request(server.app).post(`${base()}/matches/${matchId}/sign`).set(who.auth).send({});
const shootOff = (matchId: number, body: object) =>
  request(server.app).put(`${base()}/matches/${matchId}/shoot-off`).set(field.judge.auth).send(body);
const walkover = (matchId: number, body: object, who: TestPerson = field.organizer) =>
  request(server.app).post(`${base()}/matches/${matchId}/walkover`).set(who.auth).send(body);

/** Three won sets (or, cumulative, five ends) for one side, signed. */
async function win(match: MatchDto, winner: 'a' | 'b', ends = 3) {
  for (let i = 0; i < ends; i += 1) {
    const res = await putEnd(
      match.id,
      i,
      winner === 'a' ? '10 10 10' : '9 9 9',
      winner === 'a' ? '9 9 9' : '10 10 10',
    );
    expect(res.status, JSON.stringify(res.body)).toBe(200);
  }
  expect((await sign(match.id)).status).toBe(200);
}

describe('brackets: who may create and see them', () => {
  const recurve = () => ({ sessionId: field.sessionId, divisionId: divisions.get('Recurve Men')!, size: 8 });

  it('lets only an organizer create a bracket', async () => {
    expect((await request(server.app).post(`${base()}/brackets`).send(recurve())).status).toBe(401);
    for (const who of [field.judge, archer, stranger]) {
      const res = await create(recurve(), who);
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
  });

  it('refuses sizes the rules or the standings cannot fill, with a reason', async () => {
    const small = await create({ ...recurve(), size: 3 });
    expect(small.status).toBe(400);
    expect(small.body.error.message).toMatch(/at least 4 archers/);
    const large = await create({ ...recurve(), size: 12 });
    expect(large.status).toBe(400);
    expect(large.body.error.message).toBe('Recurve Men has 9 archers in the standings, fewer than 12.');
    const unfinished = await create({ ...recurve(), divisionId: divisions.get('Recurve Juniors')!, size: 4 });
    expect(unfinished.status).toBe(409);
    expect(unfinished.body.error.message).toMatch(/1 archer still has ends to shoot in Recurve Juniors/);
    const level = await create({ ...recurve(), divisionId: divisions.get('Barebow Men')!, size: 4 });
    expect(level.status).toBe(409);
    expect(level.body.error.message).toMatch(/level at place 4/);
  });

  it('seeds the bracket from the standings in chart order, set system for recurve', async () => {
    expect((await create(recurve())).status).toBe(201);
    const b = await bracketOf('Recurve Men');
    expect([b.format, b.entrants, b.size, b.rounds]).toEqual(['sets', 8, 8, 3]);
    const first = b.matches.filter((m) => m.round === 0);
    expect(first.map(seeds)).toEqual([
      [1, 8],
      [4, 5],
      [3, 6],
      [2, 7],
    ]);
    expect(first[0]!.sides.a!.archers[0]!.name).toBe('Recurve Men 1');
    expect(first[0]!.sides.b!.archers[0]!.name).toBe('Recurve Men 8');
    expect(b.matches.filter((m) => m.bronze)).toHaveLength(1);
    expect((await create(recurve())).status).toBe(409);
  });

  it('shows brackets like the results: organizers, judges and the event’s archers before publishing', async () => {
    expect((await request(server.app).get(`${base()}/brackets`)).status).toBe(403);
    expect((await request(server.app).get(`${base()}/brackets`).set(stranger.auth)).status).toBe(403);
    for (const who of [field.judge, archer])
      expect((await request(server.app).get(`${base()}/brackets`).set(who.auth)).status).toBe(200);
  });
});

describe('matches: ends, shoot-offs, signatures and the bracket moving on', () => {
  it('lets only a judge record ends and sign; refuses ends the rules do not allow', async () => {
    const m = await matchAt('Recurve Men', 0, 0);
    expect((await putEnd(m.id, 0, '10 10 10', '9 9 9', field.organizer)).status).toBe(403);
    expect((await putEnd(m.id, 1, '10 10 10', '9 9 9')).body.error.message).toBe(
      'Record end 1 of this match first.',
    );
    expect((await putEnd(m.id, 5, '10 10 10', '9 9 9')).status).toBe(400);
    const short = await request(server.app)
      .put(`${base()}/matches/${m.id}/ends/0`)
      .set(field.judge.auth)
      .send({ a: ['10', '10'], b: v('9 9 9') });
    expect(short.status).toBe(400);
    expect(short.body.error.message).toMatch(/3 arrows a side/);
    expect((await sign(m.id)).body.error.message).toBe(
      'This match is not decided yet: more ends are to shoot.',
    );
    for (let i = 0; i < 3; i += 1) expect((await putEnd(m.id, i, '10 10 10', '9 9 9')).status).toBe(200);
    const after = await matchAt('Recurve Men', 0, 0);
    expect(after.state).toMatchObject({ score: { a: 6, b: 0 }, winner: 'a', next: 'none' });
    const fourth = await putEnd(m.id, 3, '10 10 10', '9 9 9');
    expect(fourth.status).toBe(409);
    expect(fourth.body.error.message).toBe('The match was won after set 3; set 4 is not shot.');
    expect((await sign(m.id, archer)).status).toBe(403);
    expect((await sign(m.id)).status).toBe(200);
    expect((await putEnd(m.id, 2, '9 9 9', '9 9 9')).status).toBe(409);
    expect(seeds(await matchAt('Recurve Men', 1, 0))).toEqual([1, null]);
  });

  it('refuses to score a match whose archers are not both known', async () => {
    const semi = await matchAt('Recurve Men', 1, 0);
    const res = await putEnd(semi.id, 0, '10 10 10', '9 9 9');
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/Both archers of this match are not known yet/);
  });

  it('decides 5–5 by a one-arrow shoot-off closest to the centre, once the judge marks it', async () => {
    const m = await matchAt('Recurve Men', 0, 1);
    const sets: [string, string][] = [
      ['10 10 10', '9 9 9'],
      ['9 9 9', '10 10 10'],
      ['10 10 10', '9 9 9'],
      ['9 9 9', '10 10 10'],
      ['9 9 9', '9 9 9'],
    ];
    expect((await shootOff(m.id, { a: { value: '10' }, b: { value: '9' } })).status).toBe(409);
    for (const [i, [a, b]] of sets.entries()) expect((await putEnd(m.id, i, a, b)).status).toBe(200);
    expect((await matchAt('Recurve Men', 0, 1)).state).toMatchObject({
      score: { a: 5, b: 5 },
      next: 'shoot-off',
    });
    expect((await shootOff(m.id, { a: { value: '10' }, b: { value: '10' } })).status).toBe(200);
    expect((await sign(m.id)).body.error.message).toMatch(
      /record the measured distance or which arrow is closer/,
    );
    const both = await shootOff(m.id, {
      a: { value: '10', closer: true, distanceMm: 3 },
      b: { value: '10' },
    });
    expect(both.status).toBe(400);
    expect((await shootOff(m.id, { a: { value: '10' }, b: { value: '10', closer: true } })).status).toBe(200);
    expect((await sign(m.id)).status).toBe(200);
    const decided = await matchAt('Recurve Men', 0, 1);
    expect([decided.winner, decided.decidedBy]).toEqual(['b', 'shoot-off']);
    expect(seeds(await matchAt('Recurve Men', 1, 0))).toEqual([1, 5]);
  });

  it('lets only the organizer record a no-show; the opponent goes through', async () => {
    const m = await matchAt('Recurve Men', 0, 2);
    expect((await walkover(m.id, { side: 'b', reason: 'no-show' }, field.judge)).status).toBe(403);
    expect((await walkover(m.id, { side: 'c', reason: 'no-show' })).status).toBe(400);
    expect((await walkover(m.id, { side: 'b', reason: 'no-show' })).status).toBe(200);
    expect((await walkover(m.id, { side: 'a', reason: 'withdrawal' })).status).toBe(409);
    const decided = await matchAt('Recurve Men', 0, 2);
    expect([decided.winner, decided.decidedBy]).toEqual(['a', 'no-show']);
  });

  it('refuses a match of this event reached through another event the caller runs', async () => {
    // A rival organizes (and judges) an event of their own and tries this event's match ids there.
    const rival = await makePerson(server.db, 'Rival Organizer');
    const own = await request(server.app)
      .post('/api/events')
      .set(rival.auth)
      .send({ name: 'Rival Shoot', startsOn: '2027-01-01', endsOn: '2027-01-01', timeZone: 'UTC' });
    expect(own.status).toBe(201);
    await giveRole(server.db, own.body.id, rival, 'judge');
    const m = await matchAt('Recurve Men', 0, 3);
    const path = (tail: string) => `/api/events/${own.body.id}/matches/${m.id}/${tail}`;
    const tries = [
      request(server.app).post(path('walkover')).set(rival.auth).send({ side: 'a', reason: 'no-show' }),
      request(server.app)
        .put(path('ends/0'))
        .set(rival.auth)
        .send({ a: v('10 10 10'), b: v('1 1 1') }),
      request(server.app).post(path('sign')).set(rival.auth).send({}),
      request(server.app).patch(path('target')).set(rival.auth).send({ targetNumber: 9 }),
    ];
    for (const res of await Promise.all(tries)) {
      expect(res.status).toBe(404);
      expect(res.body.error.message).toBe('That match does not exist in this event.');
    }
    const after = await matchAt('Recurve Men', 0, 3);
    expect([after.winner, after.targetNumber, after.ends.length]).toEqual([
      m.winner,
      m.targetNumber,
      m.ends.length,
    ]);
  });

  it('places matches on targets (organizers only, one open match a target)', async () => {
    const m = await matchAt('Recurve Men', 0, 3);
    const semi = await matchAt('Recurve Men', 1, 0);
    const place = (id: number, targetNumber: number | null, who = field.organizer) =>
      request(server.app).patch(`${base()}/matches/${id}/target`).set(who.auth).send({ targetNumber });
    expect((await place(m.id, 3, field.judge)).status).toBe(403);
    expect((await place(m.id, 0)).status).toBe(400);
    expect((await place(m.id, 3)).status).toBe(200);
    const taken = await place(semi.id, 3);
    expect(taken.status).toBe(409);
    expect(taken.body.error.message).toBe('Target 3 already holds another open match.');
    expect((await place(semi.id, 4)).status).toBe(200);
    expect((await matchAt('Recurve Men', 0, 3)).targetNumber).toBe(3);
  });

  it('shoots through to gold and bronze and gives the final places', async () => {
    await win(await matchAt('Recurve Men', 0, 3), 'a');
    expect(seeds(await matchAt('Recurve Men', 1, 1))).toEqual([3, 2]);
    await win(await matchAt('Recurve Men', 1, 0), 'b'); // 5 beats 1
    await win(await matchAt('Recurve Men', 1, 1), 'a'); // 3 beats 2
    expect(seeds(await matchAt('Recurve Men', 2, 0))).toEqual([5, 3]);
    expect(seeds(await matchAt('Recurve Men', 2, 0, true))).toEqual([1, 2]);
    await win(await matchAt('Recurve Men', 2, 0), 'b');
    expect((await bracketOf('Recurve Men')).places.map((p) => [p.place, p.seed])).toEqual([
      [1, 3],
      [2, 5],
      [5, 4],
      [6, 6],
      [7, 7],
      [8, 8],
    ]);
    await win(await matchAt('Recurve Men', 2, 0, true), 'a');
    const places = (await bracketOf('Recurve Men')).places;
    expect(places.map((p) => [p.place, p.seed])).toEqual([
      [1, 3],
      [2, 5],
      [3, 1],
      [4, 2],
      [5, 4],
      [6, 6],
      [7, 7],
      [8, 8],
    ]);
    expect(places[0]!.name).toBe('Recurve Men 3');
  });
});

describe('other brackets: cumulative for compound, byes for the top seeds', () => {
  it('compound: five ends cumulative, a level match decided by the measured distance', async () => {
    const res = await create({
      sessionId: field.sessionId,
      divisionId: divisions.get('Compound Men')!,
      size: 'everyone',
    });
    expect(res.status).toBe(201);
    const b = await bracketOf('Compound Men');
    expect([b.format, b.entrants, b.size]).toEqual(['cumulative', 4, 4]);
    const semi = await matchAt('Compound Men', 0, 0);
    for (let i = 0; i < 5; i += 1) expect((await putEnd(semi.id, i, '10 10 9', '10 9 10')).status).toBe(200);
    expect((await matchAt('Compound Men', 0, 0)).state).toMatchObject({
      totals: { a: 145, b: 145 },
      next: 'shoot-off',
    });
    expect(
      (await shootOff(semi.id, { a: { value: 'X', distanceMm: 8 }, b: { value: '10', distanceMm: 6.5 } }))
        .status,
    ).toBe(200);
    expect((await sign(semi.id)).status).toBe(200);
    expect(seeds(await matchAt('Compound Men', 1, 0))).toEqual([4, null]);
    expect(seeds(await matchAt('Compound Men', 1, 0, true))).toEqual([1, null]);
  });

  it('everyone who qualified: 5 archers fill a bracket of 8, seeds 1–3 through on byes', async () => {
    const res = await create({
      sessionId: field.sessionId,
      divisionId: divisions.get('Barebow Men')!,
      size: 'everyone',
    });
    expect(res.status).toBe(201);
    const b = await bracketOf('Barebow Men');
    expect([b.format, b.entrants, b.size]).toEqual(['sets', 5, 8]);
    const first = b.matches.filter((m) => m.round === 0);
    expect(first.map((m) => m.decidedBy)).toEqual(['bye', null, 'bye', 'bye']);
    expect(seeds(await matchAt('Barebow Men', 1, 0))).toEqual([1, null]);
    expect(seeds(await matchAt('Barebow Men', 1, 1))).toEqual([3, 2]);
    expect(b.places).toEqual([]);
  });
});
