import request from 'supertest';
import { expect } from 'vitest';
import { roundEndCount, getRound } from '../../../src/core';
import type { MatchDto, MatchJoinCodeDto, BracketDto } from '../../../src/contract/matches';
import type { MutationResult } from '../../../src/contract/sync';
import { setUpField, writeAgreedEnds, type Field } from './fieldSetup';
import { giveRole, makeEvent, makePerson, type TestPerson } from './people';
import type { TestServer } from './testServer';

/** Four recurve archers with accounts, seeded into a bracket of 4 with each open match's join code. */
export type MatchWritersField = {
  field: Field;
  stranger: TestPerson;
  /** A judge of another event: that role opens none of this event's matches. */
  otherJudge: TestPerson;
  otherEventId: number;
  /** The archers of the first semi-final (seed 1 v 4) and of the second (2 v 3), by line. */
  archers: Record<'a' | 'b' | 'c' | 'd', TestPerson>;
  first: MatchDto;
  second: MatchDto;
  codes: Map<number, string>;
};

export async function setUpMatchWriters(server: TestServer): Promise<MatchWritersField> {
  const names = [1, 2, 3, 4].map((i) => ({ name: `Recurve ${i}`, division: 'Recurve Men', drop: i }));
  const field = await setUpField(server.db, {
    divisions: [{ name: 'Recurve Men', bowStyle: 'recurve', roundId: '18m' }],
    targets: [{ number: 1, archers: names }],
  });
  const ends = roundEndCount(getRound('18m'));
  await writeAgreedEnds(server.db, field, ends, (a) => names.find((n) => n.name === a.name)!.drop);
  const divisionId = (await server.db('divisions').where({ event_id: field.eventId }).first('id'))
    .id as number;
  const made = await request(server.app)
    .post(`/api/events/${field.eventId}/brackets`)
    .set(field.organizer.auth)
    .send({ sessionId: field.sessionId, divisionId, size: 4 });
  expect(made.status).toBe(201);
  const matches = (made.body.brackets as BracketDto[])[0]!.matches;
  const first = matches.find((m) => m.round === 0 && m.slot === 0)!;
  const second = matches.find((m) => m.round === 0 && m.slot === 1)!;
  // The archers of the entry list have accounts: each entry is linked to its person.
  const archers = {} as Record<'a' | 'b' | 'c' | 'd', TestPerson>;
  const lines = [
    ['a', first.sides.a!],
    ['b', first.sides.b!],
    ['c', second.sides.a!],
    ['d', second.sides.b!],
  ] as const;
  for (const [key, side] of lines) {
    archers[key] = await makePerson(server.db, `Archer ${key}`);
    await server.db('entries').where({ id: side.archers[0]!.entryId }).update({ user_id: archers[key].id });
  }
  const stranger = await makePerson(server.db, 'Stranger');
  const otherEventId = await makeEvent(server.db, field.organizer, 'Other Shoot');
  const otherJudge = await makePerson(server.db, 'Other Judge');
  await giveRole(server.db, otherEventId, otherJudge, 'judge');
  const res = await request(server.app)
    .get(`/api/events/${field.eventId}/matches/join-codes`)
    .set(field.organizer.auth);
  expect(res.status).toBe(200);
  const codes = new Map((res.body.codes as MatchJoinCodeDto[]).map((c) => [c.matchId, c.code]));
  return { field, stranger, otherJudge, otherEventId, archers, first, second, codes };
}

/** The event's brackets as its organizer reads them. */
export async function organizerBrackets(server: TestServer, field: Field): Promise<BracketDto[]> {
  const res = await request(server.app)
    .get(`/api/events/${field.eventId}/brackets`)
    .set(field.organizer.auth);
  return res.body.brackets as BracketDto[];
}

/** One match of the event's first bracket, as its organizer reads it. */
export const matchOf = async (server: TestServer, field: Field, matchId: number): Promise<MatchDto> =>
  (await organizerBrackets(server, field))[0]!.matches.find((m) => m.id === matchId)!;

/** The reason a pushed change was refused with, if it was. */
export const reasonOf = (r: MutationResult | undefined) => (r && 'reason' in r ? r.reason : undefined);
