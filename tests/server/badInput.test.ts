import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { setUpEvent, type SetUpEvent } from './support/eventSetup';
import { makePerson, type TestPerson } from './support/people';
import { expectNoServerErrors } from './support/noServerErrors';

/*
 * Hostile or broken input is the sender's fault: every such request gets a 4xx in the usual
 * `{error: {code, message}}` shape, and nothing is logged as a server failure.
 */

let server: TestServer;
let setup: SetUpEvent;
let person: TestPerson;
let divisionId: number;
expectNoServerErrors();

beforeAll(async () => {
  server = await startTestServer();
  setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Women' }]);
  divisionId = Object.values(setup.divisions)[0]!;
  person = await makePerson(server.db, 'Bad Input Sender');
});
afterAll(async () => {
  await server.close();
});

const expectRefused = (res: request.Response, status = 400) => {
  expect(res.status).toBe(status);
  expect(res.type).toBe('application/json');
  expect(typeof res.body.error.code).toBe('string');
  expect(res.body.error.message.length).toBeGreaterThan(10);
};

const json = (path: string, body: string, auth: Record<string, string> = {}) =>
  request(server.app).post(path).set(auth).set('Content-Type', 'application/json').send(body);

describe('a broken %-escape in the address', () => {
  it('is a 400 for anyone, signed in or not', async () => {
    expectRefused(await request(server.app).get('/api/photos/%zz'));
    expectRefused(
      await request(server.app).get(`/api/events/${setup.eventId}/sessions/%E0`).set(setup.organizer.auth),
    );
    expectRefused(await request(server.app).get('/api/cards/%E0%A4%A/1').set(person.auth));
  });
});

describe('values that turn hostile when made into text', () => {
  const hostile = { toString: 1 };
  it('in the sign-in e-mail', async () => {
    expectRefused(
      await request(server.app).post('/api/auth/sign-in').send({ email: hostile, password: 'x' }),
    );
  });

  it('in arrow values of a push', async () => {
    const change = {
      id: '6b1f3c1e-1d2a-4c3b-8d4e-5f6a7b8c9d0e',
      seq: 1,
      at: '2026-12-12T09:00:00.000Z',
      kind: 'end.write',
      args: { sessionId: 1, entryId: 1, endIndex: 0, slot: 1, arrows: [hostile] },
    };
    expectRefused(
      await request(server.app)
        .post('/api/sync/push')
        .set(person.auth)
        .send({ clientId: 'phone-hostile', mutations: [change] }),
    );
  });

  it('in the fields of a custom round', async () => {
    const round = {
      id: 'club',
      name: 'Club',
      venue: 'outdoor',
      bowStyles: [hostile],
      distances: [
        { label: '30 m', distanceM: 30, faceId: hostile, arrows: 36, arrowsPerEnd: 6, secondsPerEnd: 240 },
      ],
    };
    expectRefused(
      await setup.api('post', '/sessions', {
        name: 'S',
        startsAt: '2026-12-12T09:00',
        rounds: [{ divisionId, customRound: round }],
      }),
    );
  });
});

describe('arrays nested 5,000 deep', () => {
  const deep = `${'['.repeat(5000)}${']'.repeat(5000)}`;
  it.each([
    ['sign-in', '/api/auth/sign-in', `{"email":${deep},"password":"x"}`],
    ['push', '/api/sync/push', `{"clientId":"phone-deep","mutations":${deep}}`],
  ])('in %s', async (_label, path, body) => {
    expectRefused(await json(path, body, person.auth));
  });

  it('in a custom round', async () => {
    const body = `{"name":"S","startsAt":"2026-12-12T09:00","rounds":[{"divisionId":${divisionId},"customRound":{"distances":${deep}}}]}`;
    expectRefused(await json(`/api/events/${setup.eventId}/sessions`, body, setup.organizer.auth));
  });
});

describe('Cache-Control on answers with personal data', () => {
  it('is no-store on /api/me, entries, pull, caught mail and errors', async () => {
    const answers = await Promise.all([
      request(server.app).get('/api/me').set(setup.organizer.auth),
      setup.api('get', '/entries'),
      request(server.app).get('/api/sync/pull').set(person.auth),
      request(server.app).get('/api/caught-mail').set(setup.organizer.auth),
      request(server.app).get('/api/me'),
    ]);
    for (const res of answers) expect(res.headers['cache-control']).toBe('no-store');
    expect(answers[0]!.status).toBe(200);
  });

  it('stays public on the signing key, which is meant to be cached', async () => {
    const res = await request(server.app).get('/.well-known/jwks.json');
    expect(res.headers['cache-control']).toBe('public, max-age=3600');
  });
});
