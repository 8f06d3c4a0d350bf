import type { AddressInfo } from 'node:net';
import { createServer, type Server } from 'node:http';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EVENT_LIMITS } from '../../server/services/organizer/eventLimits';
import { nowIso } from '../../server/time';
import { startTestServer, type TestServer } from './support/testServer';
import { addArchers, pdfPageCount, setUpEvent, type SetUpEvent } from './support/eventSetup';

/*
 * Every size that comes from a request is bounded by what the sport uses, and the largest event
 * allowed is still served without holding up other requests.
 */

let server: TestServer;
let setup: SetUpEvent;
let divisionId: number;

beforeAll(async () => {
  server = await startTestServer();
  setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Women' }]);
  divisionId = setup.divisions['Recurve Women']!;
});
afterAll(async () => {
  await server.close();
});

/** The largest round allowed: 8 distances of 36 ends of one arrow (288 ends, 288 arrows). */
const distance = {
  label: '30 m',
  distanceM: 30,
  faceId: 'full-80',
  arrows: 36,
  arrowsPerEnd: 1,
  secondsPerEnd: 60,
};
const round = (over: object = {}, distances = Array.from({ length: 8 }, () => distance)) => ({
  id: 'club-long',
  name: 'Club long round',
  venue: 'outdoor',
  bowStyles: ['recurve'],
  distances,
  ...over,
});
let sessionCount = 0;
const createSession = (customRound: object) => {
  sessionCount += 1;
  return setup.api('post', '/sessions', {
    name: `Session ${sessionCount}`,
    startsAt: '2026-12-12T09:00',
    rounds: [{ divisionId, customRound }],
  });
};

describe('rounds larger than the sport shoots', () => {
  it.each([
    [
      '360,000,000 arrows',
      round({}, [{ ...distance, arrows: 360_000_000, arrowsPerEnd: 6 }]),
      /arrows must be a whole number from 1 to 216/,
    ],
    ['100,000 ends', round({}, [{ ...distance, arrows: 100_000 }]), /at most 36 ends/],
    [
      'ends of 12',
      round({}, [{ ...distance, arrowsPerEnd: 12 }]),
      /arrows per end must be a whole number from 1 to 6/,
    ],
    [
      '1,000 distances',
      round(
        {},
        Array.from({ length: 1000 }, () => distance),
      ),
      /at most 8 distances/,
    ],
    ['a name of 10,000 letters', round({ name: 'n'.repeat(10_000) }), /at most 120 characters/],
  ])('%s: refused with a readable 400', async (_label, customRound, message) => {
    const res = await createSession(customRound);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(message);
  });
});

describe('how much one event holds', () => {
  it.each([
    ['entries', () => setup.api('post', '/entries', { name: 'One too many', divisionId })],
    ['divisions', () => setup.api('post', '/divisions', { bowStyle: 'barebow', className: 'One too many' })],
    ['sessions', () => createSession(round())],
  ] as const)('%s: refused with 422 at the limit', async (kind, add) => {
    const table = { entries: 'entries', divisions: 'divisions', sessions: 'event_sessions' }[kind];
    const at = nowIso();
    const rows = Array.from({ length: EVENT_LIMITS[kind] }, (_, i) => {
      const name = `Filler ${kind} ${i}`;
      if (kind === 'entries')
        return { event_id: setup.eventId, division_id: divisionId, name, club: '', created_at: at };
      if (kind === 'divisions')
        return { event_id: setup.eventId, bow_style: 'recurve', class_name: name, name };
      return { event_id: setup.eventId, name, starts_at: '2026-12-12T09:00' };
    });
    const ids: number[] = [];
    for (let i = 0; i < rows.length; i += 200)
      ids.push(
        ...(
          (await server
            .db(table)
            .insert(rows.slice(i, i + 200))
            .returning('id')) as { id: number }[]
        ).map((r) => r.id),
      );
    try {
      const res = await add();
      expect(res.status).toBe(422);
      expect(res.body.error.message).toMatch(new RegExp(`at most ${EVENT_LIMITS[kind]}`));
    } finally {
      await server.db(table).whereIn('id', ids).delete();
    }
  });
});

describe('the largest round allowed', () => {
  let sessionId: number;
  let http: Server;
  let base: string;

  beforeAll(async () => {
    const created = await createSession(round());
    expect(created.status).toBe(201);
    sessionId = created.body.id;
    await addArchers(setup, 'Recurve Women', 16);
    expect((await setup.api('post', `/sessions/${sessionId}/assign`)).status).toBe(200);
    http = createServer(server.app);
    await new Promise<void>((resolve) => http.listen(0, '127.0.0.1', resolve));
    base = `http://127.0.0.1:${(http.address() as AddressInfo).port}`;
  });
  afterAll(async () => {
    await new Promise((resolve) => http.close(resolve));
  });

  it('prints its scorecards while other requests are still answered', async () => {
    // Health checks one after another for as long as the printout takes: none may wait for it.
    // (Relative, not a time limit: a printout made in one block makes one check wait all along.)
    const started = performance.now();
    let done = false;
    const pdf = fetch(`${base}/api/events/${setup.eventId}/sessions/${sessionId}/scorecards.pdf`, {
      headers: setup.organizer.auth,
    }).then(async (res) => {
      expect(res.status).toBe(200);
      const body = Buffer.from(await res.arrayBuffer());
      done = true;
      return body;
    });
    const waits: number[] = [];
    while (!done) {
      const asked = performance.now();
      expect((await fetch(`${base}/api/health`)).status).toBe(200);
      waits.push(performance.now() - asked);
    }
    const body = await pdf;
    const total = performance.now() - started;
    expect(Math.max(...waits)).toBeLessThan(total / 2);
    expect(body.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdfPageCount(body)).toBe(16);
  }, 120_000);

  it('shows a card of 288 ends', async () => {
    const entry = await server
      .db('entries')
      .where({ event_id: setup.eventId, division_id: divisionId })
      .orderBy('id', 'desc')
      .first('id');
    const res = await request(server.app)
      .get(`/api/cards/${sessionId}/${entry.id}`)
      .set(setup.organizer.auth);
    expect(res.status).toBe(200);
    expect(res.body.ends).toHaveLength(288);
    expect(res.body.round.maxScore).toBe(2880);
  });
});
