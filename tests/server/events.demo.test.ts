import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { seedDemoIfEmpty } from '../../server/demo/seedDemo';
import { DEMO_ARCHER_EMAIL, DEMO_JUDGES, DEMO_ORGANIZER, DEMO_SESSION } from '../../server/demo/demoPeople';
import { signAccessToken } from '../../server/auth/tokens';
import { TEST_SECRET } from './support/people';
import type { TargetList } from '../../src/contract/events';
import type { CardView, JudgeDeskItem, SessionCards } from '../../src/contract/judging';
import { readFieldState, replayLog, sortFieldState } from '../../server/services/sync/rebuildFromLog';
import { Phone } from './support/phone';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
  expect(await seedDemoIfEmpty(server.db, server.signingKeys)).toBe(true);
});
afterAll(async () => {
  await server.close();
});

describe('the demo event’s setup', () => {
  it('has one session, every archer on a target with no conflicts, and a join code per target', async () => {
    const organizer = await server.db('users').where({ email: DEMO_ORGANIZER.email }).first();
    const { token } = await signAccessToken(TEST_SECRET, organizer.id);
    const auth = { Authorization: `Bearer ${token}` };
    const event = await server.db('events').first();
    const summary = await request(server.app).get(`/api/events/${event.id}`).set(auth);
    expect(summary.body.sessions).toHaveLength(1);
    const session = summary.body.sessions[0];
    expect(session).toMatchObject({ name: DEMO_SESSION.name, assignedCount: 36, targetCount: 12 });
    expect(
      Object.fromEntries(
        session.rounds.map((r: { bowStyle: string; round: { id: string } }) => [r.bowStyle, r.round.id]),
      ),
    ).toEqual(DEMO_SESSION.roundFor);
    const list = (
      await request(server.app).get(`/api/events/${event.id}/sessions/${session.id}/targets`).set(auth)
    ).body as TargetList;
    expect(list.conflicts).toEqual([]);
    expect(list.targets).toHaveLength(12);
    expect(list.targets.every((t) => t.archers.length <= 4 && t.joinCode !== null)).toBe(true);
  });
});

describe('the demo event partway through', () => {
  const as = async (email: string) => {
    const user = await server.db('users').where({ email }).first();
    const { token } = await signAccessToken(TEST_SECRET, user.id);
    return { id: user.id as number, email, token, auth: { Authorization: `Bearer ${token}` } };
  };

  it('has signed ends, a dispute, an incident, a mismatch, a ruling and ends to sign on the judge desk', async () => {
    const judge = await as(DEMO_JUDGES[0]!.email);
    const event = await server.db('events').first();
    const session = await server.db('event_sessions').first();
    const desk = await request(server.app)
      .get(`/api/events/${event.id}/sessions/${session.id}/judge-desk`)
      .set(judge.auth);
    expect(desk.status).toBe(200);
    const kinds = new Set((desk.body as JudgeDeskItem[]).map((i) => i.kind));
    expect(kinds).toEqual(new Set(['dispute', 'incident', 'mismatch', 'to-sign']));
    expect((desk.body as JudgeDeskItem[]).every((i) => i.targetNumber <= 3)).toBe(true);
    expect(Number((await server.db('end_signatures').count({ n: '*' }).first())!.n)).toBeGreaterThan(40);
    expect(await server.db('end_rulings')).toHaveLength(1);
    // Everything was pushed as mutations: the log replays to the same tables.
    expect(sortFieldState(await replayLog(server.db))).toEqual(await readFieldState(server.db));
  });

  it('has a card countersigned by its archer only, and the banner archer’s card ready for her signature', async () => {
    const organizer = await as(DEMO_ORGANIZER.email);
    const event = await server.db('events').first();
    const session = await server.db('event_sessions').first();
    const cards = (
      await request(server.app)
        .get(`/api/events/${event.id}/sessions/${session.id}/cards`)
        .set(organizer.auth)
    ).body as SessionCards;
    const countersigned = cards.cards.filter((c) => c.archerSigned);
    expect(countersigned).toHaveLength(1);
    expect(countersigned[0]).toMatchObject({
      scorerSigned: false,
      final: false,
      signedEnds: 12,
      totalEnds: 12,
    });

    const archer = await as(DEMO_ARCHER_EMAIL());
    const entry = await server.db('entries').where({ user_id: archer.id }).first();
    const view = (await request(server.app).get(`/api/cards/${session.id}/${entry.id}`).set(archer.auth))
      .body as CardView;
    expect(view).toMatchObject({ signedEnds: 12, state: 'running', canCountersign: 'archer' });
    const phone = new Phone(server.app, archer);
    const res = await phone.push([
      phone.signCard({ sessionId: session.id, entryId: entry.id, role: 'archer', total: view.totals.total }),
    ]);
    expect(res.results[0]!.status).toBe('applied');
  });
});
