import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { giveRole, makeEvent, makePerson, type TestPerson } from './support/people';

/*
 * Who may call which route. Every route is tried as each kind of caller against a fresh event:
 * an allowed caller gets the route's success status, a signed-in caller without the right role
 * gets 403, and an anonymous caller gets 401 — always with a readable error message.
 *
 * To add a route, add a row to ROUTES: its method, a path built from the fixture, a valid body
 * (or upload), the callers allowed, and the status an allowed call answers. Callers that are
 * refused run first, so a refused call that changed anything would break the allowed one.
 */

type Caller = 'organizer' | 'judge' | 'archer' | 'stranger' | 'anonymous';
const CALLERS: Caller[] = ['organizer', 'judge', 'archer', 'stranger', 'anonymous'];
const SIGNED_IN: Caller[] = ['organizer', 'judge', 'archer', 'stranger'];
const EVENT_ROLES: Caller[] = ['organizer', 'judge', 'archer'];
const STAFF: Caller[] = ['organizer', 'judge'];
const ORGANIZER: Caller[] = ['organizer'];
const JUDGE: Caller[] = ['judge'];

type Fixture = {
  people: Record<Exclude<Caller, 'anonymous'>, TestPerson>;
  eventId: number;
  divisionId: number;
  emptyDivisionId: number;
  sessionId: number;
  /** A second session, closed, for reopening. */
  closedSessionId: number;
  entryIds: number[];
  invitationId: number;
  /** The join code of target 1. */
  joinCode: string;
  /** A photo of a target, uploaded by the organizer. */
  photoId: number;
};

type Upload = { upload: { field: string; content: string | Buffer; filename: string; contentType?: string } };
type RouteRule = {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: (f: Fixture) => string;
  body?: (f: Fixture) => object | Upload;
  allowed: Caller[];
  /** What an allowed call answers. */
  ok: number;
};

const csv = 'name,club,email,division\nUpload Archer,Test Club,,Recurve Women\n';
/** A 1 × 1 PNG; each upload gets its own trailing bytes, so each is a new photo. */
const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==',
  'base64',
);
let photoCount = 0;
const photo = (): Upload => ({
  upload: {
    field: 'photo',
    content: Buffer.concat([PNG, Buffer.from(`#${(photoCount += 1)}`)]),
    filename: 'target.png',
    contentType: 'image/png',
  },
});
const ev = (f: Fixture) => `/api/events/${f.eventId}`;
const se = (f: Fixture) => `${ev(f)}/sessions/${f.sessionId}`;

export const ROUTES: RouteRule[] = [
  // Events
  {
    method: 'post',
    path: () => '/api/events',
    body: () => ({ name: 'New', startsOn: '2027-01-01', endsOn: '2027-01-01', timeZone: 'UTC' }),
    allowed: SIGNED_IN,
    ok: 201,
  },
  { method: 'get', path: () => '/api/events', allowed: SIGNED_IN, ok: 200 },
  { method: 'get', path: ev, allowed: EVENT_ROLES, ok: 200 },
  { method: 'patch', path: ev, body: () => ({ venue: 'Elsewhere' }), allowed: ORGANIZER, ok: 200 },
  // Divisions
  { method: 'get', path: (f) => `${ev(f)}/divisions`, allowed: EVENT_ROLES, ok: 200 },
  {
    method: 'post',
    path: (f) => `${ev(f)}/divisions`,
    body: () => ({ bowStyle: 'barebow', className: 'Open' }),
    allowed: ORGANIZER,
    ok: 201,
  },
  {
    method: 'put',
    path: (f) => `${ev(f)}/divisions/${f.divisionId}`,
    body: () => ({ bowStyle: 'recurve', className: 'Ladies' }),
    allowed: ORGANIZER,
    ok: 200,
  },
  { method: 'delete', path: (f) => `${ev(f)}/divisions/${f.emptyDivisionId}`, allowed: ORGANIZER, ok: 204 },
  // Sessions
  { method: 'get', path: (f) => `${ev(f)}/sessions`, allowed: EVENT_ROLES, ok: 200 },
  {
    method: 'post',
    path: (f) => `${ev(f)}/sessions`,
    body: (f) => ({
      name: 'Second',
      startsAt: '2026-12-12T14:00',
      rounds: [{ divisionId: f.divisionId, roundId: '18m' }],
    }),
    allowed: ORGANIZER,
    ok: 201,
  },
  { method: 'patch', path: se, body: () => ({ name: 'Renamed' }), allowed: ORGANIZER, ok: 200 },
  { method: 'delete', path: se, allowed: ORGANIZER, ok: 204 },
  { method: 'post', path: (f) => `${se(f)}/close`, allowed: ORGANIZER, ok: 200 },
  {
    method: 'post',
    path: (f) => `${ev(f)}/sessions/${f.closedSessionId}/reopen`,
    allowed: ORGANIZER,
    ok: 200,
  },
  // Entries
  { method: 'get', path: (f) => `${ev(f)}/entries`, allowed: STAFF, ok: 200 },
  { method: 'get', path: (f) => `${ev(f)}/entries/template.csv`, allowed: ORGANIZER, ok: 200 },
  {
    method: 'post',
    path: (f) => `${ev(f)}/entries`,
    body: (f) => ({ name: 'Form Archer', divisionId: f.divisionId }),
    allowed: ORGANIZER,
    ok: 201,
  },
  {
    method: 'patch',
    path: (f) => `${ev(f)}/entries/${f.entryIds[0]}`,
    body: () => ({ club: 'Other Club' }),
    allowed: ORGANIZER,
    ok: 200,
  },
  { method: 'delete', path: (f) => `${ev(f)}/entries/${f.entryIds[0]}`, allowed: ORGANIZER, ok: 204 },
  {
    method: 'post',
    path: (f) => `${ev(f)}/entries/import/preview`,
    body: () => ({ upload: { field: 'file', content: csv, filename: 'e.csv' } }),
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'post',
    path: (f) => `${ev(f)}/entries/import`,
    body: () => ({
      rows: [{ row: 2, name: 'Import Archer', club: 'Test Club', email: '', division: 'Recurve Women' }],
    }),
    allowed: ORGANIZER,
    ok: 201,
  },
  // Staff
  { method: 'get', path: (f) => `${ev(f)}/staff`, allowed: STAFF, ok: 200 },
  {
    method: 'post',
    path: (f) => `${ev(f)}/staff`,
    body: () => ({ email: 'new.judge@example.org', role: 'judge' }),
    allowed: ORGANIZER,
    ok: 201,
  },
  {
    method: 'delete',
    path: (f) => `${ev(f)}/staff/invitations/${f.invitationId}`,
    allowed: ORGANIZER,
    ok: 204,
  },
  { method: 'delete', path: (f) => `${ev(f)}/staff/${f.people.judge.id}/judge`, allowed: ORGANIZER, ok: 204 },
  // Targets and join codes
  { method: 'get', path: (f) => `${se(f)}/targets`, allowed: STAFF, ok: 200 },
  { method: 'post', path: (f) => `${se(f)}/assign`, allowed: ORGANIZER, ok: 200 },
  {
    method: 'post',
    path: (f) => `${se(f)}/assignments/move`,
    body: (f) => ({ entryId: f.entryIds[0], targetNumber: 7, position: 'D' }),
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'post',
    path: (f) => `${se(f)}/assignments/swap`,
    body: (f) => ({ entryId: f.entryIds[0], otherEntryId: f.entryIds[1] }),
    allowed: ORGANIZER,
    ok: 200,
  },
  { method: 'delete', path: (f) => `${se(f)}/assignments/${f.entryIds[0]}`, allowed: ORGANIZER, ok: 200 },
  { method: 'post', path: (f) => `${se(f)}/join-codes`, allowed: ORGANIZER, ok: 200 },
  { method: 'post', path: (f) => `${se(f)}/targets/1/join-code`, allowed: ORGANIZER, ok: 200 },
  { method: 'delete', path: (f) => `${se(f)}/targets/1/join-code`, allowed: ORGANIZER, ok: 200 },
  // Printouts
  { method: 'get', path: (f) => `${se(f)}/scorecards.pdf`, allowed: STAFF, ok: 200 },
  { method: 'get', path: (f) => `${se(f)}/target-sheets.pdf`, allowed: STAFF, ok: 200 },
  // Field loop: the code opens a target group to anyone signed in; a push from someone without a
  // task there is accepted as a request and each of its changes rejected (tests/server/sync.push.test.ts).
  {
    method: 'post',
    path: () => '/api/join',
    body: (f) => ({ code: f.joinCode, task: 'follower' }),
    allowed: SIGNED_IN,
    ok: 200,
  },
  { method: 'get', path: (f) => `/api/targets/${f.sessionId}/1`, allowed: STAFF, ok: 200 },
  { method: 'get', path: (f) => `/api/targets/${f.sessionId}/1/ends`, allowed: STAFF, ok: 200 },
  { method: 'post', path: (f) => `/api/targets/${f.sessionId}/1/leave`, allowed: SIGNED_IN, ok: 204 },
  {
    method: 'post',
    path: () => '/api/sync/push',
    body: (f) => ({
      clientId: `table-${randomUUID()}`,
      mutations: [
        {
          id: randomUUID(),
          seq: 1,
          at: '2026-12-12T09:30:00.000Z',
          kind: 'end.write',
          args: { sessionId: f.sessionId, entryId: f.entryIds[0], endIndex: 0, slot: 1, arrows: ['10'] },
        },
      ],
    }),
    allowed: SIGNED_IN,
    ok: 200,
  },
  { method: 'get', path: () => '/api/sync/pull?cursor=0', allowed: SIGNED_IN, ok: 200 },
  // A phone registers its signing key for its own client id (tests/server/sync.import.test.ts).
  {
    method: 'post',
    path: () => '/api/sync/device-key',
    body: () => ({
      clientId: `keyed-${randomUUID()}`,
      publicJwk: { kty: 'EC', crv: 'P-256', x: 'x'.repeat(43), y: 'y'.repeat(43) },
    }),
    allowed: SIGNED_IN,
    ok: 204,
  },
  // A phone's saved changes, brought in by a judge of the event (tests/server/sync.import.test.ts).
  {
    method: 'post',
    path: (f) => `${ev(f)}/waiting-changes`,
    body: (f) => ({
      format: 'ringcall-waiting-changes',
      version: 1,
      exportedAt: '2026-12-12T10:00:00.000Z',
      clients: [
        {
          clientId: `saved-${randomUUID()}`,
          userId: f.people.judge.id,
          mutations: [
            {
              id: randomUUID(),
              seq: 1,
              at: '2026-12-12T09:30:00.000Z',
              kind: 'end.write',
              args: { sessionId: f.sessionId, entryId: f.entryIds[0], endIndex: 0, slot: 1, arrows: ['10'] },
            },
          ],
        },
      ],
    }),
    allowed: JUDGE,
    ok: 200,
  },
  // Judging: rulings and signatures are pushed mutations (tests/server/judging.rules.test.ts);
  // the public key and the verification of a signature are open to anyone.
  { method: 'get', path: () => '/.well-known/jwks.json', allowed: CALLERS, ok: 200 },
  { method: 'get', path: () => '/api/verify?sig=not.a.signature', allowed: CALLERS, ok: 200 },
  { method: 'get', path: (f) => `${se(f)}/judge-desk`, allowed: STAFF, ok: 200 },
  { method: 'get', path: (f) => `${se(f)}/card-board`, allowed: ORGANIZER, ok: 200 },
  { method: 'get', path: (f) => `${se(f)}/judge-desk?target=1`, allowed: STAFF, ok: 200 },
  { method: 'get', path: (f) => `${se(f)}/cards`, allowed: STAFF, ok: 200 },
  // The archer sees their own card (the fixture's archer keeps the first entry).
  { method: 'get', path: (f) => `/api/cards/${f.sessionId}/${f.entryIds[0]}`, allowed: EVENT_ROLES, ok: 200 },
  // Past the role check, the fixture's card is not final yet: 409 with the reason.
  {
    method: 'post',
    path: (f) => `/api/cards/${f.sessionId}/${f.entryIds[0]}/send`,
    allowed: ORGANIZER,
    ok: 409,
  },
  { method: 'post', path: (f) => `${ev(f)}/photos`, body: photo, allowed: STAFF, ok: 201 },
  { method: 'get', path: (f) => `/api/photos/${f.photoId}`, allowed: STAFF, ok: 200 },
];

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

/** A fresh event: organizer, judge, an archer with an entry, a stranger; a session laid out on targets; a pending invitation. */
async function makeFixture(): Promise<Fixture> {
  const { db, app } = server;
  const people = {
    organizer: await makePerson(db, 'Table Organizer'),
    judge: await makePerson(db, 'Table Judge'),
    archer: await makePerson(db, 'Table Archer'),
    stranger: await makePerson(db, 'Table Stranger'),
  };
  const eventId = await makeEvent(db, people.organizer);
  await giveRole(db, eventId, people.judge, 'judge');
  const api = (method: 'post', path: string, body: object) =>
    request(app)[method](`/api/events/${eventId}${path}`).set(people.organizer.auth).send(body);
  const divisionId = (await api('post', '/divisions', { bowStyle: 'recurve', className: 'Women' })).body.id;
  const emptyDivisionId = (await api('post', '/divisions', { bowStyle: 'compound', className: 'Men' })).body
    .id;
  const entryIds: number[] = [];
  entryIds.push(
    (await api('post', '/entries', { name: 'Table Archer', email: people.archer.email, divisionId })).body.id,
  );
  for (const name of ['Second Archer', 'Third Archer'])
    entryIds.push((await api('post', '/entries', { name, divisionId })).body.id);
  const sessionId = (
    await api('post', '/sessions', {
      name: 'Morning',
      startsAt: '2026-12-12T09:00',
      rounds: [{ divisionId, roundId: '70m' }],
    })
  ).body.id;
  await api('post', `/sessions/${sessionId}/assign`, {});
  const closedSessionId = (
    await api('post', '/sessions', { name: 'Closed', startsAt: '2026-12-12T15:00', rounds: [] })
  ).body.id;
  await api('post', `/sessions/${closedSessionId}/close`, {});
  const invitationId = (
    await api('post', '/staff', { email: `pending.${eventId}@example.org`, role: 'organizer' })
  ).body.id;
  const joinCode = (
    await db('join_codes')
      .where({ session_id: sessionId, target_number: 1 })
      .whereNull('revoked_at')
      .first('code')
  ).code;
  const upload = photo().upload;
  const photoId = (
    await request(app)
      .post(`/api/events/${eventId}/photos`)
      .set(people.organizer.auth)
      .attach(upload.field, upload.content as Buffer, { filename: upload.filename, contentType: 'image/png' })
  ).body.photoId;
  return {
    people,
    eventId,
    photoId,
    divisionId,
    emptyDivisionId,
    sessionId,
    closedSessionId,
    entryIds,
    invitationId,
    joinCode,
  };
}

function call(rule: RouteRule, f: Fixture, caller: Caller) {
  let req = request(server.app)[rule.method](rule.path(f));
  if (caller !== 'anonymous') req = req.set(f.people[caller].auth);
  const body = rule.body?.(f);
  if (body && 'upload' in body) {
    const { field, content, filename, contentType } = body.upload;
    return req.attach(field, Buffer.from(content), contentType ? { filename, contentType } : filename);
  }
  return body ? req.send(body) : req;
}

describe('authorization table: every route × every kind of caller', () => {
  it('the archer in the fixture holds the archer role (linked through their entry)', async () => {
    const f = await makeFixture();
    const role = await server
      .db('event_roles')
      .where({ event_id: f.eventId, user_id: f.people.archer.id })
      .first();
    expect(role.role).toBe('archer');
  });

  for (const rule of ROUTES) {
    const label = `${rule.method.toUpperCase()} ${rule.path({ eventId: ':eventId', sessionId: ':sessionId', divisionId: ':divisionId', emptyDivisionId: ':divisionId', entryIds: [':entryId' as unknown as number], invitationId: ':invitationId', photoId: ':photoId', people: { judge: { id: ':userId' } } } as unknown as Fixture)}`;
    it(`${label} → allowed: ${rule.allowed.join(', ')}`, async () => {
      const f = await makeFixture();
      const refused = CALLERS.filter((c) => !rule.allowed.includes(c));
      for (const caller of [...refused, ...rule.allowed]) {
        const res = await call(rule, f, caller);
        const expected = rule.allowed.includes(caller) ? rule.ok : caller === 'anonymous' ? 401 : 403;
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
];

describe('bad input is refused with a readable message', () => {
  let f: Fixture;
  beforeAll(async () => {
    f = await makeFixture();
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
