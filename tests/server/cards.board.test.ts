import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CardBoard } from '../../src/contract/cardBoard';
import type { CardView } from '../../src/contract/judging';
import {
  agreeEnds,
  expectApplied,
  pushOne,
  setUpJudging,
  signEnds,
  twelveEnds,
  type JudgingField,
} from './support/judging';
import { waitForMail } from './support/mail';
import { startTestServer, type TestServer } from './support/testServer';

let server: TestServer;
let j: JudgingField;

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
});
afterAll(() => server.close());

const board = (auth?: { Authorization: string }) => {
  const req = request(server.app).get(`/api/events/${j.field.eventId}/sessions/${j.sessionId}/card-board`);
  return auth ? req.set(auth) : req;
};

describe("the organizer's card board", () => {
  it('is for organizers only: judges, archers and strangers are refused', async () => {
    expect((await board()).status).toBe(401);
    for (const who of [j.field.judge, j.people.ada, j.people.stranger]) {
      const res = await board(who.auth);
      expect(res.status).toBe(403);
      expect(res.body.error.message).toBeTruthy();
    }
    expect(
      (
        await request(server.app)
          .get(`/api/events/${j.field.eventId}/sessions/999999/card-board`)
          .set(j.field.organizer.auth)
      ).status,
    ).toBe(404);
  });

  it("shows each card's ends in and signed, and the targets behind the furthest one", async () => {
    await agreeEnds(j, j.ada.entryId, twelveEnds().slice(0, 2));
    for (const position of ['B', 'C'] as const)
      await agreeEnds(j, j.field.archer(1, position).entryId, twelveEnds().slice(0, 2));
    const bea = j.field.archer(1, 'B').entryId;
    expectApplied(await signEnds(server, j, bea, [0]));
    const res = await board(j.field.organizer.auth);
    expect(res.status).toBe(200);
    const body = res.body as CardBoard;
    expect(body.leadingEnds).toBe(2);
    const ada = body.cards.find((c) => c.entryId === j.ada.entryId)!;
    expect(body.cards.find((c) => c.entryId === bea)).toMatchObject({ endsWithValues: 2, signedEnds: 1 });
    expect(ada).toMatchObject({
      endsWithValues: 2,
      signedEnds: 0,
      totalEnds: 12,
      final: false,
      mailedAt: null,
    });
    expect(body.targets.find((t) => t.targetNumber === 1)).toMatchObject({
      endsIn: 2,
      signedEnds: 0,
      behindBy: 0,
      cardsNotFinal: 3,
    });
    expect(body.targets.find((t) => t.targetNumber === 2)).toMatchObject({ endsIn: 0, behindBy: 2 });
  });

  it('shows a final card as mailed, and the organizer can send it again', async () => {
    await agreeEnds(j, j.ada.entryId, twelveEnds());
    expectApplied(await signEnds(server, j, j.ada.entryId, [...Array(12).keys()]));
    const card = (
      await request(server.app).get(`/api/cards/${j.sessionId}/${j.ada.entryId}`).set(j.people.ada.auth)
    ).body as CardView;
    const sign = (role: 'archer' | 'scorer') => ({
      sessionId: j.sessionId,
      entryId: j.ada.entryId,
      role,
      total: card.totals.total,
    });
    expectApplied([await pushOne(j.phones.ada, j.phones.ada.signCard(sign('archer')))]);
    expectApplied([await pushOne(j.phones.writer2, j.phones.writer2.signCard(sign('scorer')))]);
    const first = await waitForMail(server.db, j.ada.email);
    const mailed = async () =>
      ((await board(j.field.organizer.auth)).body as CardBoard).cards.find(
        (c) => c.entryId === j.ada.entryId,
      )!;
    for (let i = 0; i < 50 && (await mailed()).mailedAt === null; i += 1)
      await new Promise((r) => setTimeout(r, 50));
    expect(await mailed()).toMatchObject({ final: true, archerSigned: true, scorerSigned: true });
    expect((await mailed()).mailedAt).not.toBeNull();

    const send = (auth: { Authorization: string }) =>
      request(server.app).post(`/api/cards/${j.sessionId}/${j.ada.entryId}/send`).set(auth);
    expect((await send(j.field.judge.auth)).status).toBe(403);
    const again = await send(j.field.organizer.auth);
    expect(again.status).toBe(200);
    expect(again.body).toEqual({ sentTo: j.ada.email });
    const second = await waitForMail(server.db, j.ada.email, 5_000, first.id);
    expect(second.subject).toMatch(/Your final scorecard/);
  });
});
