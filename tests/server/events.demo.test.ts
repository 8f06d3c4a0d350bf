import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { seedDemoIfEmpty } from '../../server/demo/seedDemo';
import { DEMO_ORGANIZER, DEMO_SESSION } from '../../server/demo/demoPeople';
import { signAccessToken } from '../../server/auth/tokens';
import { TEST_SECRET } from './support/people';
import type { TargetList } from '../../src/contract/events';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
  expect(await seedDemoIfEmpty(server.db)).toBe(true);
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
