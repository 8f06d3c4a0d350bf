import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MyCards } from '../../src/contract/myCards';
import { startTestServer, type TestServer } from './support/testServer';
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
import { makePerson, type TestPerson } from './support/people';
import { Phone } from './support/phone';

/*
 * The scorer finds the cards they must sign: GET /api/me/cards lists, beside a person's own
 * cards, every card of the targets where they keep writer 1 or 2, never their own, until a scorer
 * has signed it. The archer may never sign their own card as scorer.
 */

let server: TestServer;
let j: JudgingField;
beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
});
afterAll(async () => {
  await server.close();
});

async function myCards(person: { auth: { Authorization: string } }): Promise<MyCards> {
  const res = await request(server.app).get('/api/me/cards').set(person.auth);
  expect(res.status).toBe(200);
  expect(res.headers['cache-control']).toBe('no-store');
  return res.body as MyCards;
}

const names = (cards: MyCards['toSign']) =>
  cards.map((c) => `${c.archerName} ${c.signedEnds}/${c.totalEnds}${c.ready ? ' ready' : ''}`);

describe('cards to sign as scorer', () => {
  it("lists each writer's target's cards, and nothing for the caller, the judge, the archer or a stranger", async () => {
    for (const writer of [j.people.writer1, j.people.writer2])
      expect(names((await myCards(writer)).toSign)).toEqual([
        'Ada Fletcher 0/12',
        'Bea Quill 0/12',
        'Cora Nock 0/12',
      ]);
    for (const other of [j.people.caller, j.field.judge, j.people.ada, j.people.stranger])
      expect((await myCards(other)).toSign).toEqual([]);
    expect((await myCards(j.people.ada)).cards.map((c) => c.entryId)).toEqual([j.ada.entryId]);
  });

  it('puts a card whose every end a judge signed first, as ready, until a scorer signs it', async () => {
    const ada = j.ada.entryId;
    await agreeEnds(j, ada, twelveEnds());
    expectApplied(await signEnds(server, j, ada, [...Array(12).keys()]));
    const listed = (await myCards(j.people.writer2)).toSign;
    expect(names(listed)).toEqual(['Ada Fletcher 12/12 ready', 'Bea Quill 0/12', 'Cora Nock 0/12']);
    expect(listed[0]).toMatchObject({ sessionId: j.sessionId, entryId: ada, targetNumber: 1, position: 'A' });

    const card = await request(server.app).get(`/api/cards/${j.sessionId}/${ada}`).set(j.people.writer2.auth);
    expectApplied([
      await pushOne(
        j.phones.writer2,
        j.phones.writer2.signCard({
          sessionId: j.sessionId,
          entryId: ada,
          role: 'scorer',
          total: card.body.totals.total,
        }),
      ),
    ]);
    for (const writer of [j.people.writer1, j.people.writer2])
      expect(names((await myCards(writer)).toSign)).toEqual(['Bea Quill 0/12', 'Cora Nock 0/12']);
  });

  it('refuses an archer who keeps a card on her own target signing her own card as scorer, and leaves it off her list', async () => {
    const dan = j.field.archer(2, 'A');
    const danPerson: TestPerson = await makePerson(server.db, 'Dan Vane');
    await server.db('entries').where({ id: dan.entryId }).update({ user_id: danPerson.id });
    const phone = new Phone(server.app, danPerson);
    await phone.join(j.field.targets.get(2)!.code, 'writer1');

    expect((await myCards(danPerson)).toSign.map((c) => c.archerName)).toEqual(['Eli Shaft', 'Fay Limb']);
    expectRejected(
      await pushOne(
        phone,
        phone.signCard({ sessionId: j.sessionId, entryId: dan.entryId, role: 'scorer', total: 0 }),
      ),
      /^You cannot sign your own card as scorer; the other writer signs it\.$/,
    );
    const view = await request(server.app)
      .get(`/api/cards/${j.sessionId}/${dan.entryId}`)
      .set(danPerson.auth);
    expect(view.body.canCountersign).not.toBe('scorer');
  });
});
