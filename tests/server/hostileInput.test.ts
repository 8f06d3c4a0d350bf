import fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { ROUTES, type Caller, type RouteRule } from './support/routeRoles';
import { makeRouteFixture } from './support/routeFixture';
import { changedTables, storedState } from './support/storedState';
import { expectNoServerErrors } from './support/noServerErrors';

/*
 * Every route's valid body (the authorization table, support/routeRoles.ts) changed one place at a
 * time into what a broken or hostile client sends: a field dropped, given another type, an
 * out-of-range or huge value, an unknown or prototype key, an array or text for the whole body.
 * An allowed caller sends each. The server never fails (no 5xx, nothing logged as a server
 * failure); a body it refuses gets a message a person can read and changes nothing stored.
 */

const MUTATIONS_PER_ROUTE = Number(process.env.HOSTILE_BODY_RUNS ?? 24);

let server: TestServer;
expectNoServerErrors();
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

/** Values that have broken servers: wrong types, edges of numbers, huge or odd text. */
const HOSTILE: Json[] = [
  null,
  '',
  ' ',
  -1,
  0,
  1.5,
  1e308,
  -1e308,
  2 ** 53 + 1,
  true,
  [],
  {},
  [null],
  'x'.repeat(20_000),
  '\u0000',
  '\u202e<script>alert(1)</script>',
  '../../../etc/passwd',
  '1e400',
  'NaN',
  '🏹'.repeat(300),
  { toString: 'x', valueOf: 1 },
];

/** Every place in a JSON value, as the keys leading to it ([] is the whole body). */
function places(value: Json, at: (string | number)[] = []): (string | number)[][] {
  const here = [at];
  if (Array.isArray(value)) return [...here, ...value.flatMap((v, i) => places(v, [...at, i]))];
  if (value && typeof value === 'object')
    return [...here, ...Object.entries(value).flatMap(([k, v]) => places(v, [...at, k]))];
  return here;
}

/** `body` with the value at `place` replaced (or, with `undefined`, removed). */
function changedAt(body: Json, place: (string | number)[], to: Json | undefined): Json | undefined {
  if (place.length === 0) return to;
  const [key, ...rest] = place;
  const copy: Json = Array.isArray(body) ? [...body] : { ...(body as Record<string, Json>) };
  const inner = changedAt((copy as Record<string, Json>)[key as string]!, rest, to);
  if (inner === undefined) {
    if (Array.isArray(copy)) copy.splice(key as number, 1);
    else delete copy[key as string];
  } else (copy as Record<string, Json>)[key as string] = inner;
  return copy;
}

/** One change to a valid body, as the JSON text sent (a prototype key cannot be made otherwise). */
const mutation = (body: Json) => {
  const all = places(body);
  const at = fc.constantFrom(...all);
  const inner = all.filter((p) => p.length > 0);
  return fc.oneof(
    fc.tuple(at, fc.constantFrom(...HOSTILE)).map(([place, to]) => JSON.stringify(changedAt(body, place, to))),
    // An empty body has no field to drop: the whole body is dropped instead.
    inner.length > 0
      ? fc.constantFrom(...inner).map((place) => JSON.stringify(changedAt(body, place, undefined)))
      : fc.constant(''),
    fc
      .constantFrom('__proto__', 'constructor', 'prototype', 'unknownField')
      .map((key) => JSON.stringify(body).replace(/^\{/, `{"${key}":{"isOrganizer":true,"role":"organizer"},`)),
    fc.constantFrom('[]', 'null', '"text"', '12', '{"a":'.repeat(2000), JSON.stringify([body, body])),
  );
};

const withBodies = ROUTES.filter(
  (r): r is RouteRule & { body: NonNullable<RouteRule['body']> } =>
    r.body !== undefined && r.allowed.length > 0 && r.method !== 'get',
);

describe('a valid body changed into a hostile one, on every route that takes a body', () => {
  for (const [i, rule] of withBodies.entries()) {
    it(`${rule.method.toUpperCase()} ${rule.route}`, async () => {
      const f = await makeRouteFixture(server);
      const valid = rule.body(f);
      if ('upload' in valid) return;
      const caller: Caller = rule.allowed[0]!;
      const sent = fc.sample(mutation(valid as Json), { numRuns: MUTATIONS_PER_ROUTE, seed: 1_000 + i });
      for (const text of sent) {
        const before = await storedState(server.db);
        const req = request(server.app)[rule.method](rule.path(f));
        const res = await (caller === 'anonymous' ? req : req.set(f.people[caller].auth))
          .set('Content-Type', 'application/json')
          .send(text)
          .timeout(5_000);
        const what = `${rule.route} as ${caller} with ${text.slice(0, 200)}: ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`;
        expect(res.status, what).toBeLessThan(500);
        if (res.status >= 400) {
          expect(res.body.error?.message, what).toMatch(/\w{3,}.*\./);
          expect(changedTables(before, await storedState(server.db)), what).toEqual([]);
        }
      }
    });
  }
});

/** Ids no row has, or that are not ids at all, put in an address where the fixture's ids go. */
const HOSTILE_IDS = ['0', '-1', '1e3', '99999999999999999999', '1.5', 'abc', '%00', '..%2F..'];

describe('an address with an id no row has, or that is not an id, on every route', () => {
  for (const rule of ROUTES) {
    it(`${rule.method.toUpperCase()} ${rule.route}`, async () => {
      const f = await makeRouteFixture(server);
      const caller: Caller = rule.allowed[0] ?? 'organizer';
      for (const id of HOSTILE_IDS) {
        const odd = id as unknown as number;
        const path = rule.path({
          ...f,
          eventId: odd,
          sessionId: odd,
          closedSessionId: odd,
          divisionId: odd,
          emptyDivisionId: odd,
          entryIds: f.entryIds.map(() => odd),
          invitationId: odd,
          photoId: odd,
        });
        if (path === rule.path(f)) continue;
        const req = request(server.app)[rule.method](path);
        const valid = rule.body?.(f);
        const res = await (caller === 'anonymous' ? req : req.set(f.people[caller].auth)).send(
          valid && !('upload' in valid) ? valid : {},
        );
        const what = `${rule.method} ${path} as ${caller}: ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`;
        expect(res.status, what).toBeGreaterThanOrEqual(400);
        expect(res.status, what).toBeLessThan(500);
        expect(res.body.error?.message, what).toMatch(/\w{3,}.*\./);
      }
    });
  }
});
