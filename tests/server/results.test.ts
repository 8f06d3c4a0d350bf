import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { EventResults, StandingRow } from '../../src/contract/results';
import {
  agreeEnds,
  expectApplied,
  expectRejected,
  pushOne,
  setUpJudging,
  signEnds,
  twelveEnds,
  type JudgingField,
} from './support/judging';
import { startTestServer, type TestServer } from './support/testServer';
import { RESULTS_NOT_PUBLISHED } from '../../src/contract/resultsAccess';

let server: TestServer;
let j: JudgingField;
const ids = { ada: 0, bea: 0, cora: 0 };

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
  ids.ada = j.ada.entryId;
  ids.bea = j.field.archer(1, 'B').entryId;
  ids.cora = j.field.archer(1, 'C').entryId;
});
afterAll(() => server.close());

const results = (auth?: { Authorization: string }) => {
  const req = request(server.app).get(`/api/results/${j.field.eventId}`);
  return auth ? req.set(auth) : req;
};
const settings = (body: object, auth = j.field.organizer.auth) =>
  request(server.app).patch(`/api/events/${j.field.eventId}/results-settings`).set(auth).send(body);
const recurve = (body: EventResults) => body.sessions[0]!.divisions.find((d) => d.name === 'Recurve Women')!;
const row = (body: EventResults, entryId: number) => recurve(body).rows.find((r) => r.entryId === entryId)!;

describe('results: who may see them', () => {
  it('keeps unpublished results from strangers and people without an account', async () => {
    const anonymous = await results();
    expect(anonymous.status).toBe(403);
    expect(anonymous.body.error.message).toMatch(/not published yet/);
    // Signing in may help a person without an account here (the page offers it), not a stranger.
    expect(anonymous.body.error.code).toBe(RESULTS_NOT_PUBLISHED);
    const stranger = await results(j.people.stranger.auth);
    expect(stranger.status).toBe(403);
    expect(stranger.body.error.code).toBe('forbidden');
    const csv = await request(server.app).get(`/api/results/${j.field.eventId}/csv`);
    expect(csv.status).toBe(403);
    // Anyone can try any event's number: a refusal does not tell them the event's name.
    const { name } = await server.db('events').where({ id: j.field.eventId }).first('name');
    for (const refused of [anonymous, stranger, csv])
      expect(JSON.stringify(refused.body)).not.toContain(name);
  });

  it('shows unpublished results to the organizer, the judges and the event’s archers', async () => {
    for (const who of [j.field.organizer, j.field.judge, j.people.ada])
      expect((await results(who.auth)).status).toBe(200);
  });

  it('lets only an organizer change the results settings', async () => {
    expect(
      (
        await request(server.app)
          .patch(`/api/events/${j.field.eventId}/results-settings`)
          .send({ published: true })
      ).status,
    ).toBe(401);
    for (const who of [j.field.judge, j.people.ada, j.people.stranger])
      expect((await settings({ published: true }, who.auth)).status).toBe(403);
    const bad = await settings({ teamSize: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/at least 1 archer/);
    expect((await settings({ cuts: [{ divisionId: 999_999, cut: 8 }] })).status).toBe(400);
    expect((await results()).status).toBe(403);
  });

  it('answers 404 for an event that does not exist', async () => {
    expect((await request(server.app).get('/api/results/999999')).status).toBe(404);
  });
});

describe('results: standings follow the cards', () => {
  it('publishes, then counts agreed ends as provisional', async () => {
    expect((await settings({ published: true })).status).toBe(200);
    await agreeEnds(j, ids.ada, [['X', '10', '9', '9', '8', '7']]);
    const res = await results();
    expect(res.status).toBe(200);
    const ada = row(res.body, ids.ada);
    expect(ada).toMatchObject({
      total: 53,
      tens: 2,
      second: 1,
      hits: 6,
      endsShot: 1,
      totalEnds: 12,
      place: 1,
      trust: 'provisional',
    });
    expect(res.body.totalCards).toBe(6);
    expect(res.body.finalCards).toBe(0);
    expect(recurve(res.body).secondCount).toBe('Xs');
    expect(
      res.body.sessions[0].divisions.find((d: { name: string }) => d.name === 'Compound Men').secondCount,
    ).toBe('9s');
  });

  it('answers 304 while nothing changed, and the new standings once a judge signs', async () => {
    const first = await results();
    const etag = first.headers.etag as string;
    expect(etag).toBeTruthy();
    expect((await results().set('If-None-Match', etag)).status).toBe(304);

    await agreeEnds(j, ids.ada, twelveEnds());
    expectApplied(await signEnds(server, j, ids.ada, [...Array(12).keys()]));
    const after = await results().set('If-None-Match', etag);
    expect(after.status).toBe(200);
    expect(after.headers.etag).not.toBe(etag);
    expect(row(after.body, ids.ada)).toMatchObject({ endsShot: 12, trust: 'signed' });
  });

  it('flags equal totals on a medal place and lets the judge’s shoot-off arrows decide them', async () => {
    await agreeEnds(j, ids.bea, twelveEnds());
    const tied = await results();
    for (const id of [ids.ada, ids.bea])
      expect(row(tied.body, id)).toMatchObject({
        place: 1,
        tied: true,
        shootOff: true,
      } satisfies Partial<StandingRow>);

    // Only a judge records shoot-offs.
    const where = { sessionId: j.sessionId };
    expectRejected(
      await pushOne(
        j.phones.writer1,
        j.phones.writer1.shootOff({ ...where, entryId: ids.bea, arrowIndex: 0, value: '9' }),
      ),
      /Only a judge/,
    );
    const judge = j.phones.judge;
    // Equal values: the measured distance decides (Bea's arrow is closer to the centre).
    expectApplied(
      (
        await judge.push([
          judge.shootOff({ ...where, entryId: ids.ada, arrowIndex: 0, value: '9', distanceMm: 40 }),
          judge.shootOff({ ...where, entryId: ids.bea, arrowIndex: 0, value: '9', distanceMm: 25 }),
        ])
      ).results,
    );
    const decided = await results();
    expect(row(decided.body, ids.bea)).toMatchObject({
      place: 1,
      tied: false,
      shootOff: false,
      decidedByShootOff: true,
    });
    expect(row(decided.body, ids.ada)).toMatchObject({ place: 2, tied: false, decidedByShootOff: true });
    expect(row(decided.body, ids.ada).shootOffArrows).toEqual([{ value: '9', distanceMm: 40 }]);

    // A re-recorded arrow replaces the earlier one: now Ada's arrow is higher.
    expectApplied(
      (await judge.push([judge.shootOff({ ...where, entryId: ids.ada, arrowIndex: 0, value: '10' })]))
        .results,
    );
    expect(row((await results()).body, ids.ada).place).toBe(1);
  });

  it('refuses a shoot-off with both a distance and "closer"', async () => {
    const arrowsBefore = (await server.db('shootoff_arrows')).length;
    const res = await request(server.app)
      .post('/api/sync/push')
      .set(j.field.judge.auth)
      .send({
        clientId: 'judge-shootoff-check',
        mutations: [
          {
            id: crypto.randomUUID(),
            seq: 1,
            at: new Date().toISOString(),
            kind: 'shootoff.record',
            args: {
              sessionId: j.sessionId,
              entryId: ids.ada,
              arrowIndex: 1,
              value: '9',
              distanceMm: 3,
              closer: true,
            },
          },
        ],
      });
    // Refused on its own, with its reason, so the judge's phone moves past it (no blocked outbox).
    expect(res.status).toBe(200);
    expect(res.body.results[0]).toMatchObject({ status: 'rejected' });
    expect(res.body.results[0].reason).toMatch(/either the measured distance or "closer"/);
    expect(await server.db('shootoff_arrows')).toHaveLength(arrowsBefore);
  });
});

describe('results: teams and settings', () => {
  it('sums the best archers of a club, and leaves out those marked not in a team', async () => {
    await agreeEnds(j, ids.cora, [['5', '5', '5', '5', '5', '5']]);
    const full = recurve((await settings({ teamSize: 3 })).body).teams;
    expect(full).toHaveLength(1);
    expect(full[0]).toMatchObject({ club: 'Field Club', place: 1 });
    expect(full[0]!.members.map((m) => m.entryId).sort()).toEqual([ids.ada, ids.bea, ids.cora].sort());
    const out = await settings({ teams: [{ entryId: ids.cora, inTeam: false }] });
    expect(recurve(out.body).teams).toEqual([]);
    const two = await settings({ teamSize: 2 });
    expect(
      recurve(two.body)
        .teams[0]!.members.map((m) => m.entryId)
        .sort(),
    ).toEqual([ids.ada, ids.bea].sort());
  });

  it('a cut turns the medal-place flag into counting back', async () => {
    const res = await settings({
      cuts: [{ divisionId: recurve((await results()).body).divisionId, cut: 3 }],
    });
    expect(recurve(res.body).cut).toBe(3);
    expect(recurve(res.body).rows.some((r) => r.shootOff)).toBe(false);
  });
});

describe('results: CSV', () => {
  it('exports the standings with formula-like cells neutralised', async () => {
    await server
      .db('entries')
      .where({ id: ids.cora })
      .update({ name: '=HYPERLINK("http://x.example","win")', club: '@SUM(1)' });
    // A renamed entry shows with the next change of the event: touch the settings.
    await settings({ teamSize: 2 });
    const res = await request(server.app).get(`/api/results/${j.field.eventId}/csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const text = res.text;
    expect(text.split('\r\n')[0]).toMatch(/^Session,Division,Class,Place/);
    expect(text).toContain(`"'=HYPERLINK(""http://x.example"",""win"")"`);
    expect(text).toContain(`'@SUM(1)`);
    expect(text).not.toMatch(/(^|,)[=@+-]/m);
    const division = recurve((await results()).body).divisionId;
    const one = await request(server.app).get(`/api/results/${j.field.eventId}/csv?division=${division}`);
    expect(one.text.trim().split('\r\n')).toHaveLength(4);
    expect((await request(server.app).get(`/api/results/${j.field.eventId}/csv?division=abc`)).status).toBe(
      400,
    );
    expect(
      (await request(server.app).get(`/api/results/${j.field.eventId}/csv?division=999999`)).status,
    ).toBe(404);
  });
});
