import { randomUUID } from 'node:crypto';
import type { TestPerson } from './people';

/*
 * Who may call which route: one row per call tried, each naming the route it covers, so
 * tests/server/authorization.test.ts can check that every route the app serves has a row.
 *
 * To add a route, add a row: its method and route, a path built from the fixture, a valid body
 * (or upload), the callers allowed, and the status an allowed call answers.
 */

export type Caller = 'organizer' | 'judge' | 'archer' | 'stranger' | 'anonymous';
export const CALLERS: Caller[] = ['organizer', 'judge', 'archer', 'stranger', 'anonymous'];
const SIGNED_IN: Caller[] = ['organizer', 'judge', 'archer', 'stranger'];
const EVENT_ROLES: Caller[] = ['organizer', 'judge', 'archer'];
const STAFF: Caller[] = ['organizer', 'judge'];
const ORGANIZER: Caller[] = ['organizer'];
const JUDGE: Caller[] = ['judge'];

export type Fixture = {
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
export type RouteRule = {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** The route this row covers, as the router names it. */
  route: string;
  path: (f: Fixture) => string;
  body?: (f: Fixture) => object | Upload;
  allowed: Caller[];
  /** What an allowed call answers. */
  ok: number;
  /** What every caller not allowed gets, when it is not the usual 403 (signed in) / 401 (anonymous). */
  refused?: number;
};

const csv = 'name,club,email,division\nUpload Archer,Test Club,,Recurve Women\n';
/** A 1 × 1 PNG; each upload gets its own trailing bytes, so each is a new photo. */
export const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==',
  'base64',
);
let photoCount = 0;
export const photo = (): Upload => ({
  upload: {
    field: 'photo',
    content: Buffer.concat([PNG, Buffer.from(`#${(photoCount += 1)}`)]),
    filename: 'target.png',
    contentType: 'image/png',
  },
});
export const ev = (f: Fixture) => `/api/events/${f.eventId}`;
export const se = (f: Fixture) => `${ev(f)}/sessions/${f.sessionId}`;

/** A password good enough for sign-up, and a mailed link's token no link ever had. */
const PASSWORD = 'correct horse battery staple 42';
const LINK_TOKEN = 'x'.repeat(43);
const unique = () => randomUUID().slice(0, 8);

export const ROUTES: RouteRule[] = [
  // Events
  {
    method: 'post',
    route: '/api/events',
    path: () => '/api/events',
    body: () => ({ name: 'New', startsOn: '2027-01-01', endsOn: '2027-01-01', timeZone: 'UTC' }),
    allowed: SIGNED_IN,
    ok: 201,
  },
  { method: 'get', route: '/api/events', path: () => '/api/events', allowed: SIGNED_IN, ok: 200 },
  { method: 'get', route: '/api/events/:eventId', path: ev, allowed: EVENT_ROLES, ok: 200 },
  {
    method: 'patch',
    route: '/api/events/:eventId',
    path: ev,
    body: () => ({ venue: 'Elsewhere' }),
    allowed: ORGANIZER,
    ok: 200,
  },
  // Divisions
  {
    method: 'get',
    route: '/api/events/:eventId/divisions',
    path: (f) => `${ev(f)}/divisions`,
    allowed: EVENT_ROLES,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/divisions',
    path: (f) => `${ev(f)}/divisions`,
    body: () => ({ bowStyle: 'barebow', className: 'Open' }),
    allowed: ORGANIZER,
    ok: 201,
  },
  {
    method: 'put',
    route: '/api/events/:eventId/divisions/:divisionId',
    path: (f) => `${ev(f)}/divisions/${f.divisionId}`,
    body: () => ({ bowStyle: 'recurve', className: 'Ladies' }),
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'delete',
    route: '/api/events/:eventId/divisions/:divisionId',
    path: (f) => `${ev(f)}/divisions/${f.emptyDivisionId}`,
    allowed: ORGANIZER,
    ok: 204,
  },
  // Sessions
  {
    method: 'get',
    route: '/api/events/:eventId/sessions',
    path: (f) => `${ev(f)}/sessions`,
    allowed: EVENT_ROLES,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/sessions',
    path: (f) => `${ev(f)}/sessions`,
    body: (f) => ({
      name: 'Second',
      startsAt: '2026-12-12T14:00',
      rounds: [{ divisionId: f.divisionId, roundId: '18m' }],
    }),
    allowed: ORGANIZER,
    ok: 201,
  },
  {
    method: 'patch',
    route: '/api/events/:eventId/sessions/:sessionId',
    path: se,
    body: () => ({ name: 'Renamed' }),
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'delete',
    route: '/api/events/:eventId/sessions/:sessionId',
    path: se,
    allowed: ORGANIZER,
    ok: 204,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/sessions/:sessionId/close',
    path: (f) => `${se(f)}/close`,
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/sessions/:sessionId/reopen',
    path: (f) => `${ev(f)}/sessions/${f.closedSessionId}/reopen`,
    allowed: ORGANIZER,
    ok: 200,
  },
  // Entries
  {
    method: 'get',
    route: '/api/events/:eventId/entries',
    path: (f) => `${ev(f)}/entries`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'get',
    route: '/api/events/:eventId/entries/template.csv',
    path: (f) => `${ev(f)}/entries/template.csv`,
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/entries',
    path: (f) => `${ev(f)}/entries`,
    body: (f) => ({ name: 'Form Archer', divisionId: f.divisionId }),
    allowed: ORGANIZER,
    ok: 201,
  },
  {
    method: 'patch',
    route: '/api/events/:eventId/entries/:entryId',
    path: (f) => `${ev(f)}/entries/${f.entryIds[0]}`,
    body: () => ({ club: 'Other Club' }),
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'delete',
    route: '/api/events/:eventId/entries/:entryId',
    path: (f) => `${ev(f)}/entries/${f.entryIds[0]}`,
    allowed: ORGANIZER,
    ok: 204,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/entries/import/preview',
    path: (f) => `${ev(f)}/entries/import/preview`,
    body: () => ({ upload: { field: 'file', content: csv, filename: 'e.csv' } }),
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/entries/import',
    path: (f) => `${ev(f)}/entries/import`,
    body: () => ({
      rows: [{ row: 2, name: 'Import Archer', club: 'Test Club', email: '', division: 'Recurve Women' }],
    }),
    allowed: ORGANIZER,
    ok: 201,
  },
  // Staff
  {
    method: 'get',
    route: '/api/events/:eventId/staff',
    path: (f) => `${ev(f)}/staff`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/staff',
    path: (f) => `${ev(f)}/staff`,
    body: () => ({ email: 'new.judge@example.org', role: 'judge' }),
    allowed: ORGANIZER,
    ok: 201,
  },
  {
    method: 'delete',
    route: '/api/events/:eventId/staff/invitations/:invitationId',
    path: (f) => `${ev(f)}/staff/invitations/${f.invitationId}`,
    allowed: ORGANIZER,
    ok: 204,
  },
  {
    method: 'delete',
    route: '/api/events/:eventId/staff/:userId/:role',
    path: (f) => `${ev(f)}/staff/${f.people.judge.id}/judge`,
    allowed: ORGANIZER,
    ok: 204,
  },
  // Targets and join codes
  {
    method: 'get',
    route: '/api/events/:eventId/sessions/:sessionId/targets',
    path: (f) => `${se(f)}/targets`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/sessions/:sessionId/assign',
    path: (f) => `${se(f)}/assign`,
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/sessions/:sessionId/assignments/move',
    path: (f) => `${se(f)}/assignments/move`,
    body: (f) => ({ entryId: f.entryIds[0], targetNumber: 7, position: 'D' }),
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/sessions/:sessionId/assignments/swap',
    path: (f) => `${se(f)}/assignments/swap`,
    body: (f) => ({ entryId: f.entryIds[0], otherEntryId: f.entryIds[1] }),
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'delete',
    route: '/api/events/:eventId/sessions/:sessionId/assignments/:entryId',
    path: (f) => `${se(f)}/assignments/${f.entryIds[0]}`,
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/sessions/:sessionId/join-codes',
    path: (f) => `${se(f)}/join-codes`,
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/sessions/:sessionId/targets/:targetNumber/join-code',
    path: (f) => `${se(f)}/targets/1/join-code`,
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'delete',
    route: '/api/events/:eventId/sessions/:sessionId/targets/:targetNumber/join-code',
    path: (f) => `${se(f)}/targets/1/join-code`,
    allowed: ORGANIZER,
    ok: 200,
  },
  // Printouts
  {
    method: 'get',
    route: '/api/events/:eventId/sessions/:sessionId/scorecards.pdf',
    path: (f) => `${se(f)}/scorecards.pdf`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'get',
    route: '/api/events/:eventId/sessions/:sessionId/target-sheets.pdf',
    path: (f) => `${se(f)}/target-sheets.pdf`,
    allowed: STAFF,
    ok: 200,
  },
  // Field loop: the code opens a target group to anyone signed in; a push from someone without a
  // task there is accepted as a request and each of its changes rejected (tests/server/sync.push.test.ts).
  {
    method: 'post',
    route: '/api/join',
    path: () => '/api/join',
    body: (f) => ({ code: f.joinCode, task: 'follower' }),
    allowed: SIGNED_IN,
    ok: 200,
  },
  // A match's code: the fixture has no match, so a signed-in caller is told no match has it.
  // Who may join a match: tests/server/matches.writers.test.ts.
  {
    method: 'post',
    route: '/api/join/match',
    path: () => '/api/join/match',
    body: () => ({ code: 'ZZZZZZ' }),
    allowed: SIGNED_IN,
    ok: 404,
  },
  {
    method: 'get',
    route: '/api/targets/:sessionId',
    path: (f) => `/api/targets/${f.sessionId}`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'get',
    route: '/api/targets/:sessionId/:targetNumber',
    path: (f) => `/api/targets/${f.sessionId}/1`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'get',
    route: '/api/targets/:sessionId/:targetNumber/ends',
    path: (f) => `/api/targets/${f.sessionId}/1/ends`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/targets/:sessionId/:targetNumber/leave',
    path: (f) => `/api/targets/${f.sessionId}/1/leave`,
    allowed: SIGNED_IN,
    ok: 204,
  },
  {
    method: 'post',
    route: '/api/sync/push',
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
  {
    method: 'get',
    route: '/api/sync/pull',
    path: () => '/api/sync/pull?cursor=0',
    allowed: SIGNED_IN,
    ok: 200,
  },
  // A phone registers its signing key for its own client id (tests/server/sync.import.test.ts).
  {
    method: 'post',
    route: '/api/sync/device-key',
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
    route: '/api/events/:eventId/waiting-changes',
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
  {
    method: 'get',
    route: '/.well-known/jwks.json',
    path: () => '/.well-known/jwks.json',
    allowed: CALLERS,
    ok: 200,
  },
  {
    method: 'get',
    route: '/api/verify',
    path: () => '/api/verify?sig=not.a.signature',
    allowed: CALLERS,
    ok: 200,
  },
  {
    method: 'get',
    route: '/api/events/:eventId/sessions/:sessionId/judge-desk',
    path: (f) => `${se(f)}/judge-desk`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'get',
    route: '/api/events/:eventId/sessions/:sessionId/card-board',
    path: (f) => `${se(f)}/card-board`,
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'get',
    route: '/api/events/:eventId/sessions/:sessionId/judge-desk',
    path: (f) => `${se(f)}/judge-desk?target=1`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'get',
    route: '/api/events/:eventId/sessions/:sessionId/cards',
    path: (f) => `${se(f)}/cards`,
    allowed: STAFF,
    ok: 200,
  },
  // The archer sees their own card (the fixture's archer keeps the first entry).
  {
    method: 'get',
    route: '/api/cards/:sessionId/:entryId',
    path: (f) => `/api/cards/${f.sessionId}/${f.entryIds[0]}`,
    allowed: EVENT_ROLES,
    ok: 200,
  },
  // An archer's live place: until published, the archer themself and the event's staff.
  {
    method: 'get',
    route: '/api/places/:sessionId/:entryId',
    path: (f) => `/api/places/${f.sessionId}/${f.entryIds[0]}`,
    allowed: EVENT_ROLES,
    ok: 200,
  },
  // Past the role check, the fixture's card is not final yet: 409 with the reason.
  {
    method: 'post',
    route: '/api/cards/:sessionId/:entryId/send',
    path: (f) => `/api/cards/${f.sessionId}/${f.entryIds[0]}/send`,
    allowed: ORGANIZER,
    ok: 409,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/photos',
    path: (f) => `${ev(f)}/photos`,
    body: photo,
    allowed: STAFF,
    ok: 201,
  },
  {
    method: 'get',
    route: '/api/photos/:photoId',
    path: (f) => `/api/photos/${f.photoId}`,
    allowed: STAFF,
    ok: 200,
  },
  // Accounts: sign-up, sign-in and the mailed links are open to anyone; what they answer depends
  // on the body (a wrong password, an unknown link: 410), never on who asks. The refresh cookie, not
  // the bearer token, is refresh's credential.
  { method: 'get', route: '/api/health', path: () => '/api/health', allowed: CALLERS, ok: 200 },
  {
    method: 'post',
    route: '/api/auth/sign-up',
    path: () => '/api/auth/sign-up',
    body: () => ({
      email: `table.${unique()}@example.org`,
      password: PASSWORD,
      displayName: 'Table Newcomer',
    }),
    allowed: CALLERS,
    ok: 201,
  },
  {
    method: 'post',
    route: '/api/auth/sign-in',
    path: () => '/api/auth/sign-in',
    body: () => ({ email: `nobody.${unique()}@example.org`, password: PASSWORD }),
    allowed: CALLERS,
    ok: 401,
  },
  { method: 'post', route: '/api/auth/refresh', path: () => '/api/auth/refresh', allowed: CALLERS, ok: 401 },
  {
    method: 'post',
    route: '/api/auth/sign-out',
    path: () => '/api/auth/sign-out',
    allowed: CALLERS,
    ok: 204,
  },
  {
    method: 'post',
    route: '/api/auth/verify-email',
    path: () => '/api/auth/verify-email',
    body: () => ({ token: LINK_TOKEN }),
    allowed: CALLERS,
    ok: 410,
  },
  {
    method: 'post',
    route: '/api/auth/forgot-password',
    path: () => '/api/auth/forgot-password',
    body: () => ({ email: `forgetful.${unique()}@example.org` }),
    allowed: CALLERS,
    ok: 202,
  },
  {
    method: 'post',
    route: '/api/auth/reset-password',
    path: () => '/api/auth/reset-password',
    body: () => ({ token: LINK_TOKEN, password: PASSWORD }),
    allowed: CALLERS,
    ok: 410,
  },
  { method: 'get', route: '/api/me', path: () => '/api/me', allowed: SIGNED_IN, ok: 200 },
  { method: 'get', route: '/api/me/cards', path: () => '/api/me/cards', allowed: SIGNED_IN, ok: 200 },
  // Each person's own cards only (tests/server/practice.cards.test.ts shows no one gets another's).
  {
    method: 'get',
    route: '/api/me/practice-cards',
    path: () => '/api/me/practice-cards',
    allowed: SIGNED_IN,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/me/send-verification',
    path: () => '/api/me/send-verification',
    allowed: SIGNED_IN,
    ok: 202,
  },
  {
    method: 'post',
    route: '/api/invitations/accept',
    path: () => '/api/invitations/accept',
    body: () => ({ token: LINK_TOKEN }),
    allowed: SIGNED_IN,
    ok: 410,
  },
  // The operator's inbox opens with the operator's key only (tests/server/mail.operator.test.ts).
  ...(
    [
      ['', ''],
      ['/:id', '/1'],
      ['/:id/attachments/:index', '/1/attachments/0'],
    ] as const
  ).map(([route, rest]): RouteRule => ({
    method: 'get',
    route: `/api/operator/mail${route}`,
    path: () => `/api/operator/mail${rest}`,
    allowed: [],
    ok: 200,
    refused: 401,
  })),
  // Results (docs/results.md): readable by the event's people until published; sign-in is optional
  // there, so an anonymous reader of unpublished results gets 403 too.
  {
    method: 'get',
    route: '/api/results/:eventId',
    path: (f) => `/api/results/${f.eventId}`,
    allowed: EVENT_ROLES,
    ok: 200,
    refused: 403,
  },
  {
    method: 'get',
    route: '/api/results/:eventId/csv',
    path: (f) => `/api/results/${f.eventId}/csv`,
    allowed: EVENT_ROLES,
    ok: 200,
    refused: 403,
  },
  // The PDF: organizers only until the results are published.
  {
    method: 'get',
    route: '/api/results/:eventId/pdf',
    path: (f) => `/api/results/${f.eventId}/pdf`,
    allowed: ORGANIZER,
    ok: 200,
    refused: 403,
  },
  // Sending results links the public page, so past the role check unpublished results answer 409.
  {
    method: 'post',
    route: '/api/events/:eventId/results/send',
    path: (f) => `${ev(f)}/results/send`,
    body: () => ({}),
    allowed: ORGANIZER,
    ok: 409,
  },
  // Eliminations (docs/matches.md): brackets are read like the results. The fixture has no
  // match, so past the role check a match route answers 404: the role is checked first.
  // Matches of another event: tests/server/matches.*.test.ts.
  {
    method: 'get',
    route: '/api/events/:eventId/brackets',
    path: (f) => `${ev(f)}/brackets`,
    allowed: EVENT_ROLES,
    ok: 200,
    refused: 403,
  },
  {
    method: 'get',
    route: '/api/events/:eventId/brackets/pdf',
    path: (f) => `${ev(f)}/brackets/pdf`,
    allowed: EVENT_ROLES,
    ok: 200,
    refused: 403,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/brackets',
    path: (f) => `${ev(f)}/brackets`,
    body: (f) => ({ sessionId: f.sessionId, divisionId: f.divisionId, size: 'everyone' }),
    allowed: ORGANIZER,
    // Past the role check: the fixture's archers have ends to shoot, so there is nothing to seed.
    ok: 409,
  },
  // Which matches alternate: tests/server/matches.turns.test.ts.
  {
    method: 'patch',
    route: '/api/events/:eventId/brackets/:bracketId',
    path: (f) => `${ev(f)}/brackets/999999`,
    body: () => ({ alternate: 'semi-finals' }),
    allowed: ORGANIZER,
    ok: 404,
  },
  {
    method: 'patch',
    route: '/api/events/:eventId/matches/:matchId/target',
    path: (f) => `${ev(f)}/matches/999999/target`,
    body: () => ({ targetNumber: 3 }),
    allowed: ORGANIZER,
    ok: 404,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/matches/:matchId/walkover',
    path: (f) => `${ev(f)}/matches/999999/walkover`,
    body: () => ({ side: 'a', reason: 'no-show' }),
    allowed: ORGANIZER,
    ok: 404,
  },
  {
    method: 'put',
    route: '/api/events/:eventId/matches/:matchId/ends/:endIndex',
    path: (f) => `${ev(f)}/matches/999999/ends/0`,
    body: () => ({ a: ['10', '9', '8'], b: ['9', '9', '9'] }),
    allowed: JUDGE,
    ok: 404,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/matches/:matchId/ends/:endIndex/sign',
    path: (f) => `${ev(f)}/matches/999999/ends/0/sign`,
    allowed: JUDGE,
    ok: 404,
  },
  {
    method: 'put',
    route: '/api/events/:eventId/matches/:matchId/shoot-off',
    path: (f) => `${ev(f)}/matches/999999/shoot-off`,
    body: () => ({ a: { value: '10' }, b: { value: '9' } }),
    allowed: JUDGE,
    ok: 404,
  },
  {
    method: 'get',
    route: '/api/events/:eventId/matches/join-codes',
    path: (f) => `${ev(f)}/matches/join-codes`,
    allowed: ORGANIZER,
    ok: 200,
  },
  {
    method: 'put',
    route: '/api/events/:eventId/matches/:matchId/scorers',
    path: (f) => `${ev(f)}/matches/999999/scorers`,
    body: () => ({ slot: 1, email: null }),
    allowed: ORGANIZER,
    ok: 404,
  },
  // A match's writers only (checked past sign-in, tests/server/matches.writers.test.ts): no such match here.
  {
    method: 'get',
    route: '/api/events/:eventId/matches/:matchId/pad',
    path: (f) => `${ev(f)}/matches/999999/pad`,
    allowed: SIGNED_IN,
    ok: 404,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/matches/:matchId/sign',
    path: (f) => `${ev(f)}/matches/999999/sign`,
    allowed: JUDGE,
    ok: 404,
  },
  {
    method: 'patch',
    route: '/api/events/:eventId/results-settings',
    path: (f) => `${ev(f)}/results-settings`,
    body: () => ({ teamSize: 3 }),
    allowed: ORGANIZER,
    ok: 200,
  },
  // Closing a session: the check before, and late values a judge decides (past the role check,
  // the fixture has no late value: 404 with the reason).
  {
    method: 'get',
    route: '/api/events/:eventId/sessions/:sessionId/close-check',
    path: (f) => `${se(f)}/close-check`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'get',
    route: '/api/events/:eventId/sessions/:sessionId/late-values',
    path: (f) => `${se(f)}/late-values`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/late-values/:lateId/accept',
    path: (f) => `${ev(f)}/late-values/999999/accept`,
    allowed: JUDGE,
    ok: 404,
  },
  {
    method: 'post',
    route: '/api/events/:eventId/late-values/:lateId/reject',
    path: (f) => `${ev(f)}/late-values/999999/reject`,
    body: () => ({ reason: 'Entered after the session closed.' }),
    allowed: JUDGE,
    ok: 404,
  },
  // Who keeps which task on a target (the fixture's archer has not joined target 1: 404).
  {
    method: 'get',
    route: '/api/events/:eventId/sessions/:sessionId/targets/:targetNumber/members',
    path: (f) => `${se(f)}/targets/1/members`,
    allowed: STAFF,
    ok: 200,
  },
  {
    method: 'put',
    route: '/api/events/:eventId/sessions/:sessionId/targets/:targetNumber/members/:userId',
    path: (f) => `${se(f)}/targets/1/members/${f.people.archer.id}`,
    body: () => ({ task: 'none' }),
    allowed: STAFF,
    ok: 404,
  },
];
