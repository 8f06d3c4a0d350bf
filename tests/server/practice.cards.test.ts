import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { TournamentCards } from '../../src/contract/myCards';
import {
  agreeEnds,
  expectApplied,
  setUpJudging,
  signEnds,
  twelveEnds,
  type JudgingField,
} from './support/judging';
import { giveRole, makeEvent, makePerson, type TestPerson } from './support/people';
import { startTestServer, type TestServer } from './support/testServer';

/*
 * `GET /api/me/practice-cards`: a person's own tournament cards for the practice log, the ends a
 * judge signed at their distance and face; only ever the person's own.
 */

let server: TestServer;
let j: JudgingField;
/** The organizer also shoots (entry 1B, linked to their account) and has a card of their own. */
let organizerEntryId: number;

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
  await agreeEnds(j, j.ada.entryId, twelveEnds().slice(0, 3));
  expectApplied(await signEnds(server, j, j.ada.entryId, [0, 1]));
  organizerEntryId = j.field.archer(1, 'B').entryId;
  await server.db('entries').where({ id: organizerEntryId }).update({ user_id: j.field.organizer.id });
  await agreeEnds(j, organizerEntryId, twelveEnds().slice(0, 1));
  expectApplied(await signEnds(server, j, organizerEntryId, [0]));
});
afterAll(() => server.close());

const cardsOf = async (person: TestPerson): Promise<TournamentCards> => {
  const res = await request(server.app).get('/api/me/practice-cards').set(person.auth);
  expect(res.status).toBe(200);
  return res.body as TournamentCards;
};

describe('tournament cards in the practice log', () => {
  it('gives the archer their card’s signed ends at the round’s distance and face, not yet final', async () => {
    const { cards } = await cardsOf(j.people.ada);
    expect(cards).toHaveLength(1);
    const card = cards[0]!;
    expect(card).toMatchObject({
      entryId: j.ada.entryId,
      sessionId: j.sessionId,
      final: false,
      bowStyle: 'recurve',
    });
    // Two ends signed by the judge; the third, agreed but not signed, is not on the card yet.
    expect(card.ends.map((e) => e.index)).toEqual([0, 1]);
    expect(card.ends[0]).toMatchObject({ distanceM: 70, faceId: 'full-122' });
    expect(card.ends[0]!.values).toEqual(expect.arrayContaining(['X', '10', '9', '9', '8', '7']));
  });

  it('gives no one else that card: a writer of the target, the judge, the organizer, a stranger', async () => {
    for (const person of [j.people.writer1, j.field.judge, j.field.organizer, j.people.stranger]) {
      const { cards } = await cardsOf(person);
      expect(cards.some((c) => c.entryId === j.ada.entryId)).toBe(false);
    }
  });

  it('gives an organizer who shoots only their own card, whatever the query string asks for', async () => {
    const res = await request(server.app)
      .get('/api/me/practice-cards')
      .query({ userId: j.people.ada.id, entryId: j.ada.entryId, user: 'all' })
      .set(j.field.organizer.auth);
    expect(res.status).toBe(200);
    expect((res.body as TournamentCards).cards.map((c) => c.entryId)).toEqual([organizerEntryId]);
  });

  it('gives an archer of another event none of this event’s cards', async () => {
    const otherEvent = await makeEvent(server.db, j.field.organizer, 'Another Shoot');
    const archer = await makePerson(server.db, 'Other Event Archer');
    await giveRole(server.db, otherEvent, archer, 'archer');
    const res = await request(server.app)
      .get(`/api/me/practice-cards?userId=${j.people.ada.id}`)
      .set(archer.auth);
    expect((res.body as TournamentCards).cards).toEqual([]);
  });

  it('refuses a caller who is not signed in', async () => {
    const res = await request(server.app).get('/api/me/practice-cards');
    expect(res.status).toBe(401);
  });
});
