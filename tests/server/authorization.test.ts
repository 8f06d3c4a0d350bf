import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { callRoute, makeRouteFixture } from './support/routeFixture';
import { listRoutes } from './support/routeList';
import { LANE_ROUTES } from '../../server/routes/syncLane';
import {
  CALLERS,
  PNG,
  ROUTES,
  ev,
  se,
  type Fixture,
} from './support/routeRoles';

/*
 * Every route is tried as each kind of caller against a fresh event: an allowed caller gets the
 * route's success status, a signed-in caller without the right role gets 403, and an anonymous
 * caller gets 401 — always with a readable error message. The expected table is
 * support/routeRoles.ts; the routes themselves are read from the app's router, so a route without
 * a row fails here. Callers that are refused run first, so a refused call that changed anything
 * would break the allowed one.
 */

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

const NAMING_FIXTURE = {
  entryIds: [0],
  people: { judge: { id: 0 }, archer: { id: 0 } },
} as unknown as Fixture;

describe('authorization table: every route × every kind of caller', () => {
  it('the archer in the fixture holds the archer role (linked through their entry)', async () => {
    const f = await makeRouteFixture(server);
    const role = await server
      .db('event_roles')
      .where({ event_id: f.eventId, user_id: f.people.archer.id })
      .first();
    expect(role.role).toBe('archer');
  });

  it('every route the app serves has a row, and every row names a route the app serves', () => {
    // The field lane answers before Express's router (server/app.ts), so it lists its own.
    const served = [...listRoutes(server.app), ...LANE_ROUTES];
    const covered = new Set(ROUTES.map((r) => `${r.method.toUpperCase()} ${r.route}`));
    expect(served.filter((r) => !covered.has(r))).toEqual([]);
    expect([...covered].filter((r) => !served.includes(r))).toEqual([]);
  });

  it("each row's path is an address of the route it names", async () => {
    const f = await makeRouteFixture(server);
    for (const rule of ROUTES) {
      const pattern = new RegExp(`^${rule.route.replace(/\./g, '\\.').replace(/:\w+/g, '[^/]+')}$`);
      expect(rule.path(f).split('?')[0], rule.route).toMatch(pattern);
    }
  });

  for (const rule of ROUTES) {
    // Only the query, to tell rows of one route apart (no fixture exists yet when tests are named).
    const query = rule.path(NAMING_FIXTURE).split('?')[1];
    const label = `${rule.method.toUpperCase()} ${rule.route}${query ? `?${query}` : ''}`;
    it(`${label} → allowed: ${rule.allowed.join(', ') || 'no app caller'}`, async () => {
      const f = await makeRouteFixture(server);
      const refused = CALLERS.filter((c) => !rule.allowed.includes(c));
      for (const caller of [...refused, ...rule.allowed]) {
        const res = await callRoute(server, rule, f, caller);
        const expected = rule.allowed.includes(caller)
          ? rule.ok
          : (rule.refused ?? (caller === 'anonymous' ? 401 : 403));
        expect(res.status, `${label} as ${caller}: ${JSON.stringify(res.body)}`).toBe(expected);
        if (expected >= 400) expect(res.body.error.message, `${label} as ${caller}`).toMatch(/\w{3,}.*\./);
      }
    });
  }
});

/*
 * Bad input for every route that takes a body: an empty body, wrong types, and a body far over
 * the size limit. Each answers 4xx with a message a person can read.
 */
type BodyRule = {
  method: 'post' | 'put' | 'patch';
  path: (f: Fixture) => string;
  wrongTypes: object;
  /** Who sends it, when the route is not the organizer's. */
  as?: 'judge';
};
const BODY_ROUTES: BodyRule[] = [
  {
    method: 'post',
    path: () => '/api/events',
    wrongTypes: { name: 7, startsOn: true, endsOn: [], timeZone: {} },
  },
  { method: 'patch', path: ev, wrongTypes: { name: ['x'], startsOn: 20270101 } },
  { method: 'post', path: (f) => `${ev(f)}/divisions`, wrongTypes: { bowStyle: 1, className: null } },
  {
    method: 'put',
    path: (f) => `${ev(f)}/divisions/${f.divisionId}`,
    wrongTypes: { bowStyle: 'crossbow', className: 5 },
  },
  {
    method: 'post',
    path: (f) => `${ev(f)}/sessions`,
    wrongTypes: { name: 1, startsAt: 'tomorrow', rounds: 'all' },
  },
  { method: 'patch', path: se, wrongTypes: { rounds: [{ divisionId: 'one', roundId: 70 }] } },
  { method: 'post', path: (f) => `${ev(f)}/entries`, wrongTypes: { name: {}, divisionId: '1', email: 5 } },
  { method: 'patch', path: (f) => `${ev(f)}/entries/${f.entryIds[0]}`, wrongTypes: { divisionId: -3 } },
  { method: 'post', path: (f) => `${ev(f)}/staff`, wrongTypes: { email: 42, role: 'archer' } },
  {
    method: 'post',
    path: (f) => `${se(f)}/assignments/move`,
    wrongTypes: { entryId: 'x', targetNumber: 1.5, position: 'a' },
  },
  {
    method: 'post',
    path: (f) => `${se(f)}/assignments/swap`,
    wrongTypes: { entryId: null, otherEntryId: [] },
  },
  { method: 'post', path: () => '/api/join', wrongTypes: { code: 7, task: 'captain' } },
  { method: 'post', path: () => '/api/sync/push', wrongTypes: { clientId: 5, mutations: 'all' } },
  {
    method: 'post',
    path: () => '/api/sync/device-key',
    wrongTypes: { clientId: 5, publicJwk: { kty: 'RSA', n: 'AQAB' } },
  },
  {
    method: 'post',
    path: (f) => `${ev(f)}/waiting-changes`,
    wrongTypes: { format: 3, clients: 'all' },
    as: 'judge',
  },
  { method: 'post', path: (f) => `${ev(f)}/entries/import`, wrongTypes: { rows: 'all' } },
  {
    method: 'post',
    path: (f) => `${ev(f)}/brackets`,
    wrongTypes: { sessionId: 'x', divisionId: [], size: 7.5, format: 'knockout' },
  },
  // Match routes check the body before looking for the match (the fixture has none).
  { method: 'patch', path: (f) => `${ev(f)}/matches/999999/target`, wrongTypes: { targetNumber: 'five' } },
  { method: 'post', path: (f) => `${ev(f)}/matches/999999/walkover`, wrongTypes: { side: 'c', reason: 1 } },
  {
    method: 'put',
    path: (f) => `${ev(f)}/matches/999999/ends/0`,
    wrongTypes: { a: 'X X X', b: [10, 10, 10] },
    as: 'judge',
  },
  {
    method: 'put',
    path: (f) => `${ev(f)}/matches/999999/shoot-off`,
    wrongTypes: { a: { value: 'Q' }, b: { value: '9', distanceMm: -3, closer: true } },
    as: 'judge',
  },
];

describe('bad input is refused with a readable message', () => {
  let f: Fixture;
  beforeAll(async () => {
    f = await makeRouteFixture(server);
  });

  for (const rule of BODY_ROUTES) {
    const label = `${rule.method.toUpperCase()} ${rule.path({ eventId: ':eventId', sessionId: ':sessionId', divisionId: ':divisionId', entryIds: [':entryId' as unknown as number] } as unknown as Fixture)}`;
    it(`${label}: missing fields, wrong types, a huge body`, async () => {
      const agent = request(server.app);
      const send = (body: string | object) =>
        agent[rule.method](rule.path(f))
          .set(f.people[rule.as ?? 'organizer'].auth)
          .set('Content-Type', 'application/json')
          .send(body);
      for (const [what, body] of [
        ['missing fields', {}],
        ['wrong types', rule.wrongTypes],
      ] as const) {
        const res = await send(body);
        expect(res.status, `${label} with ${what}: ${JSON.stringify(res.body)}`).toBe(400);
        expect(res.body.error.code).toBe('bad_request');
        expect(res.body.error.message).toMatch(/^The request was not accepted\. .+: .+/);
      }
      const huge = await send(JSON.stringify({ name: 'x'.repeat(300 * 1024) }));
      expect(huge.status).toBe(413);
      expect(huge.body.error.message).toMatch(/too large/);
      const broken = await send('{"name": ');
      expect(broken.status).toBe(400);
      expect(broken.body.error.message).toBe('The request body is not valid JSON.');
    });
  }

  it('upload of an entry list: a missing file, a wrong kind of file and an oversized file', async () => {
    const url = `${ev(f)}/entries/import/preview`;
    const none = await request(server.app).post(url).set(f.people.organizer.auth).field('other', 'x');
    expect(none.status).toBe(400);
    expect(none.body.error.message).toMatch(/Choose a CSV file/);
    const wrong = await request(server.app)
      .post(url)
      .set(f.people.organizer.auth)
      .attach('file', Buffer.from('GIF89a'), { filename: 'photo.gif', contentType: 'image/gif' });
    expect(wrong.status).toBe(415);
    const huge = await request(server.app)
      .post(url)
      .set(f.people.organizer.auth)
      .attach('file', Buffer.alloc(600 * 1024, 'a'), { filename: 'big.csv', contentType: 'text/csv' });
    expect(huge.status).toBe(413);
    expect(huge.body.error.message).toMatch(/larger than/);
  });

  it('photo uploads: a missing file, a file that is not an image and an oversized one', async () => {
    const url = `${ev(f)}/photos`;
    const none = await request(server.app).post(url).set(f.people.judge.auth).field('other', 'x');
    expect(none.status).toBe(400);
    expect(none.body.error.message).toBe('Choose a photo to upload.');
    const notImage = await request(server.app)
      .post(url)
      .set(f.people.judge.auth)
      .attach('photo', Buffer.from('name,club\nA,B\n'), { filename: 'photo.jpg', contentType: 'image/jpeg' });
    expect(notImage.status).toBe(415);
    expect(notImage.body.error.message).toMatch(/JPEG, PNG or WebP/);
    const huge = await request(server.app)
      .post(url)
      .set(f.people.judge.auth)
      .attach('photo', Buffer.concat([PNG, Buffer.alloc(5 * 1024 * 1024 + 1)]), {
        filename: 'big.png',
        contentType: 'image/png',
      });
    expect(huge.status).toBe(413);
    expect(huge.body.error.message).toMatch(/larger than 5 MB/);
  });

  it('judging changes with missing or wrong arguments are refused one by one, with words', async () => {
    const base = { id: randomUUID(), seq: 1, at: '2026-12-12T10:00:00.000Z' };
    const where = { sessionId: f.sessionId, entryId: f.entryIds[0] };
    for (const mutation of [
      { ...base, kind: 'end.rule', args: { ...where, endIndex: 0, arrows: ['10'] } },
      { ...base, kind: 'end.rule', args: { ...where, endIndex: 0, arrows: [], reason: 'Looked' } },
      { ...base, kind: 'end.sign', args: { ...where, endIndex: 'first', arrows: ['Z'] } },
      { ...base, kind: 'card.sign', args: { ...where, role: 'coach', total: -1 } },
      { ...base, kind: 'card.sign', args: { ...where, role: 'archer' } },
      { ...base, kind: 'end.erase', args: where },
    ]) {
      const res = await request(server.app)
        .post('/api/sync/push')
        .set(f.people.judge.auth)
        .send({ clientId: `bad-${randomUUID()}`, mutations: [mutation] });
      expect(res.status, JSON.stringify(mutation)).toBe(200);
      expect(res.body.results[0]).toMatchObject({ seq: 1, status: 'rejected' });
      expect(res.body.results[0].reason).toMatch(/^This change could not be read: .+/);
    }
  });

  it('ids in the address that cannot be ids answer 404 with words', async () => {
    for (const path of [
      `${ev(f)}/sessions/abc/targets`,
      `${ev(f)}/sessions/-1/targets`,
      `${ev(f)}/sessions/99999999999/targets`,
    ]) {
      const res = await request(server.app).get(path).set(f.people.organizer.auth);
      expect(res.status).toBe(404);
      expect(res.body.error.message).toBe('That session does not exist.');
    }
    const event = await request(server.app).get('/api/events/abc').set(f.people.organizer.auth);
    expect(event.status).toBe(400);
    expect(event.body.error.message).toMatch(/event number/);
  });
});
