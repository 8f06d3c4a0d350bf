import request from 'supertest';
import { expect } from 'vitest';
import type { ArrowValue } from '../../../src/core';
import type { EndWriteArgs, Mutation, MutationResult, TargetEndsView } from '../../../src/contract/sync';
import { giveRole, makePerson, type TestPerson } from './people';
import { setUpMixedField, type Field } from './fieldSetup';
import { Phone } from './phone';
import type { TestServer } from './testServer';

/*
 * A field with its people for the judging tests: on target 1 two writers and a caller, the
 * event's judge with a phone, and Ada Fletcher (1A) linked to an account of her own.
 */

export type JudgingField = {
  field: Field;
  people: Record<'writer1' | 'writer2' | 'caller' | 'ada' | 'stranger', TestPerson>;
  phones: Record<'writer1' | 'writer2' | 'caller' | 'judge' | 'ada' | 'organizer' | 'stranger', Phone>;
  /** Ada Fletcher, target 1 position A, 70 m round (12 ends of 6). */
  ada: { entryId: number; email: string };
  sessionId: number;
};

export const ADA_EMAIL = 'ada.fletcher@ringcall.example';

export async function setUpJudging(server: TestServer): Promise<JudgingField> {
  const { db, app } = server;
  const field = await setUpMixedField(db);
  const people = {
    writer1: await makePerson(db, 'Wren One'),
    writer2: await makePerson(db, 'Wyn Two'),
    caller: await makePerson(db, 'Cal Caller'),
    ada: await makePerson(db, 'Ada Fletcher'),
    stranger: await makePerson(db, 'Stray Person'),
  };
  const ada = field.archer(1, 'A');
  await db('entries').where({ id: ada.entryId }).update({ user_id: people.ada.id, email: ADA_EMAIL });
  await giveRole(db, field.eventId, people.ada, 'archer');
  const phones = {
    writer1: new Phone(app, people.writer1),
    writer2: new Phone(app, people.writer2),
    caller: new Phone(app, people.caller),
    judge: new Phone(app, field.judge),
    ada: new Phone(app, people.ada),
    organizer: new Phone(app, field.organizer),
    stranger: new Phone(app, people.stranger),
  };
  const code = field.targets.get(1)!.code;
  await phones.writer1.join(code, 'writer1');
  await phones.writer2.join(code, 'writer2');
  await phones.caller.join(code, 'caller');
  return {
    field,
    people,
    phones,
    ada: { entryId: ada.entryId, email: ADA_EMAIL },
    sessionId: field.sessionId,
  };
}

/** Pushes one change and returns its outcome. */
export async function pushOne(phone: Phone, mutation: Mutation): Promise<MutationResult> {
  const res = await phone.push([mutation]);
  return res.results[0]!;
}

export function expectApplied(results: MutationResult[]): void {
  for (const r of results) expect(r, JSON.stringify(r)).toMatchObject({ status: 'applied' });
}

export function expectRejected(result: MutationResult, reason: RegExp): void {
  expect(result.status, JSON.stringify(result)).toBe('rejected');
  if (result.status === 'rejected') expect(result.reason).toMatch(reason);
}

type Flags = EndWriteArgs['flags'];

/** Both writers write one end (the same values unless `second` is given). */
export async function writeBoth(
  j: JudgingField,
  entryId: number,
  endIndex: number,
  first: ArrowValue[],
  second: ArrowValue[] = first,
  flags: { first?: Flags; second?: Flags } = {},
): Promise<void> {
  const where = { sessionId: j.sessionId, entryId, endIndex };
  expectApplied(
    (
      await j.phones.writer1.push([
        j.phones.writer1.write({ ...where, slot: 1, arrows: first, flags: flags.first }),
      ])
    ).results,
  );
  expectApplied(
    (
      await j.phones.writer2.push([
        j.phones.writer2.write({ ...where, slot: 2, arrows: second, flags: flags.second }),
      ])
    ).results,
  );
}

/** Both writers write every given end the same, in one push each. */
export async function agreeEnds(j: JudgingField, entryId: number, ends: ArrowValue[][]): Promise<void> {
  for (const [phone, slot] of [
    [j.phones.writer1, 1],
    [j.phones.writer2, 2],
  ] as const) {
    const res = await phone.push(
      ends.map((arrows, endIndex) =>
        phone.write({ sessionId: j.sessionId, entryId, endIndex, slot, arrows }),
      ),
    );
    expectApplied(res.results);
  }
}

/** The judge signs the given ends with the values the server shows for them. */
export async function signEnds(server: TestServer, j: JudgingField, entryId: number, endIndexes: number[]) {
  const view = await targetView(server, j);
  const ends = view.archers.find((a) => a.entryId === entryId)!.ends;
  const res = await j.phones.judge.push(
    endIndexes.map((endIndex) =>
      j.phones.judge.sign({
        sessionId: j.sessionId,
        entryId,
        endIndex,
        arrows: ends[endIndex]!.view.arrows!,
      }),
    ),
  );
  return res.results;
}

export async function targetView(server: TestServer, j: JudgingField, target = 1): Promise<TargetEndsView> {
  const res = await request(server.app)
    .get(`/api/targets/${j.sessionId}/${target}/ends`)
    .set(j.field.judge.auth);
  expect(res.status).toBe(200);
  return res.body as TargetEndsView;
}

/** Twelve ends of the 70 m round: 6 arrows each, mostly high, with a few 10s and Xs. */
export function twelveEnds(): ArrowValue[][] {
  const pattern: ArrowValue[][] = [
    ['X', '10', '9', '9', '8', '7'],
    ['10', '10', '9', '8', '8', '6'],
    ['X', 'X', '10', '9', '7', 'M'],
  ];
  return Array.from({ length: 12 }, (_, i) => pattern[i % 3]!);
}
