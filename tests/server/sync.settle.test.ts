import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { endView, type ArrowValue, type EndFacts } from '../../src/core';
import type { ChangeDto, TargetEndsView } from '../../src/contract/sync';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson, type TestPerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';
import { Phone } from './support/phone';
import { STALE_BASIS_REASON } from '../../server/services/sync/applySettlement';

/*
 * The caller settles a mismatch between the two writers. The server checks the settlement
 * against the writers' current revisions and derives each end's state with the same core
 * function the phones use.
 */

let server: TestServer;
let field: Field;
let people: Record<'writer1' | 'writer2' | 'caller', TestPerson>;
let phones: Record<'writer1' | 'writer2' | 'caller', Phone>;

beforeAll(async () => {
  server = await startTestServer();
  field = await setUpMixedField(server.db);
  people = {
    writer1: await makePerson(server.db, 'Wren One'),
    writer2: await makePerson(server.db, 'Wyn Two'),
    caller: await makePerson(server.db, 'Cal Caller'),
  };
  phones = {
    writer1: new Phone(server.app, people.writer1),
    writer2: new Phone(server.app, people.writer2),
    caller: new Phone(server.app, people.caller),
  };
  const code = field.targets.get(1)!.code;
  await phones.writer1.join(code, 'writer1');
  await phones.writer2.join(code, 'writer2');
  await phones.caller.join(code, 'caller');
});
afterAll(async () => {
  await server.close();
});

const bea = () => field.archer(1, 'B');
let nextEnd = -1;
const freshEnd = () => (nextEnd += 1);

async function writeBoth(endIndex: number, first: ArrowValue[], second: ArrowValue[]) {
  const s = field.sessionId;
  const a = await phones.writer1.push([
    phones.writer1.write({ sessionId: s, entryId: bea().entryId, endIndex, slot: 1, arrows: first }),
  ]);
  const b = await phones.writer2.push([
    phones.writer2.write({ sessionId: s, entryId: bea().entryId, endIndex, slot: 2, arrows: second }),
  ]);
  expect([a.results[0]!.status, b.results[0]!.status]).toEqual(['applied', 'applied']);
}

async function settle(
  endIndex: number,
  arrows: ArrowValue[],
  basis: { first: number; second: number },
  disputed: number[] = [],
  phone = phones.caller,
) {
  const res = await phone.push([
    phone.settle({ sessionId: field.sessionId, entryId: bea().entryId, endIndex, arrows, basis, disputed }),
  ]);
  return res.results[0]!;
}

async function views(person: TestPerson = people.caller): Promise<TargetEndsView> {
  const res = await request(server.app).get(`/api/targets/${field.sessionId}/1/ends`).set(person.auth);
  expect(res.status).toBe(200);
  return res.body as TargetEndsView;
}
const viewOf = async (endIndex: number) =>
  (await views()).archers.find((a) => a.entryId === bea().entryId)!.ends[endIndex]!.view;

describe('settling a mismatch', () => {
  it('settles a mismatch with the caller’s values; the server’s view says settled', async () => {
    const end = freshEnd();
    await writeBoth(end, ['10', '9', '9', '8', '7', '7'], ['10', '9', '8', '8', '7', '7']);
    expect((await viewOf(end)).state).toBe('mismatch');
    const result = await settle(end, ['7', '10', '9', '9', '8', '7'], { first: 1, second: 1 });
    expect(result.status).toBe('applied');
    const view = await viewOf(end);
    expect(view).toMatchObject({
      state: 'settled',
      arrows: ['10', '9', '9', '8', '7', '7'],
      settlementStale: false,
    });
    const row = await server
      .db('end_settlements')
      .where({ session_id: field.sessionId, entry_id: bea().entryId, end_index: end })
      .first();
    expect(JSON.parse(row.arrows_json)).toEqual(['10', '9', '9', '8', '7', '7']);
    expect(row.settled_by).toBe(people.caller.id);
  });

  it('a later writer edit makes the settlement stale; the old basis is refused, the new one applies', async () => {
    const end = freshEnd();
    await writeBoth(end, ['9', '9', '9', '9', '9', '9'], ['9', '9', '9', '9', '9', '8']);
    expect((await settle(end, ['9', '9', '9', '9', '9', '9'], { first: 1, second: 1 })).status).toBe(
      'applied',
    );

    const edit = await phones.writer2.push([
      phones.writer2.write({
        sessionId: field.sessionId,
        entryId: bea().entryId,
        endIndex: end,
        slot: 2,
        arrows: ['9', '9', '9', '9', '8', '8'],
      }),
    ]);
    expect(edit.results[0]!.status).toBe('applied');
    const stale = await viewOf(end);
    expect(stale).toMatchObject({ state: 'mismatch', settlementStale: true });

    expect(await settle(end, ['9', '9', '9', '9', '9', '9'], { first: 1, second: 1 })).toMatchObject({
      status: 'rejected',
      reason: STALE_BASIS_REASON,
    });
    expect(await settle(end, ['9', '9', '9', '9', '9', '8'], { first: 1, second: 2 })).toMatchObject({
      status: 'applied',
    });
    expect(await viewOf(end)).toMatchObject({
      state: 'settled',
      arrows: ['9', '9', '9', '9', '9', '8'],
      settlementStale: false,
    });
  });

  it('settling the same mismatch again replaces the caller’s earlier settlement', async () => {
    const end = freshEnd();
    await writeBoth(end, ['8', '8', '8', '8', '8', '8'], ['8', '8', '8', '8', '8', '7']);
    await settle(end, ['8', '8', '8', '8', '8', '8'], { first: 1, second: 1 });
    expect(await settle(end, ['8', '8', '8', '8', '8', '7'], { first: 1, second: 1 })).toMatchObject({
      status: 'applied',
    });
    expect(await viewOf(end)).toMatchObject({ state: 'settled', arrows: ['8', '8', '8', '8', '8', '7'] });
    expect(
      await server
        .db('end_settlements')
        .where({ entry_id: bea().entryId, end_index: end })
        .count({ n: '*' })
        .first(),
    ).toMatchObject({ n: 1 });
  });

  it('positions sent to a judge make the end disputed', async () => {
    const end = freshEnd();
    await writeBoth(end, ['10', '10', '9', '9', '9', '9'], ['10', '9', '9', '9', '9', '9']);
    expect(
      await settle(end, ['10', '10', '9', '9', '9', '9'], { first: 1, second: 1 }, [1, 1]),
    ).toMatchObject({ status: 'applied' });
    expect(await viewOf(end)).toMatchObject({ state: 'disputed', settlementStale: false });
    const row = await server.db('end_settlements').where({ entry_id: bea().entryId, end_index: end }).first();
    expect(JSON.parse(row.disputed_json)).toEqual([1]);
  });
});

describe('settlements refused', () => {
  it('refuses to settle an end the writers agree on', async () => {
    const end = freshEnd();
    await writeBoth(end, ['X', '10', '9', '9', '8', '7'], ['7', '8', '9', '9', '10', 'X']);
    expect((await viewOf(end)).state).toBe('agreed');
    expect(await settle(end, ['X', '10', '9', '9', '8', '7'], { first: 1, second: 1 })).toEqual(
      expect.objectContaining({
        status: 'rejected',
        reason: `End ${end + 1} of Bea Quill: the two writers agree, so there is nothing to settle.`,
      }),
    );
  });

  it('refuses to settle before both writers’ entries are in', async () => {
    const end = freshEnd();
    await phones.writer1.push([
      phones.writer1.write({
        sessionId: field.sessionId,
        entryId: bea().entryId,
        endIndex: end,
        slot: 1,
        arrows: ['9', '9', '9', '9', '9', '9'],
      }),
    ]);
    expect(await settle(end, ['9', '9', '9', '9', '9', '9'], { first: 1, second: 0 })).toMatchObject({
      status: 'rejected',
      reason: `End ${end + 1} of Bea Quill cannot be settled until both writers' entries are in.`,
    });
  });

  it.each([
    [
      'an incomplete end',
      ['10', '9', '9', '8', '8'],
      [],
      /End has 5 arrows; this round has 6 per end\. Enter M for an arrow that missed\./,
    ],
    [
      'a disputed arrow the end does not have',
      ['10', '9', '9', '8', '8', '8'],
      [6],
      /arrow 7 cannot go to a judge; the end has 6 arrows\./,
    ],
  ] as [string, ArrowValue[], number[], RegExp][])('refuses %s', async (_label, arrows, disputed, reason) => {
    const end = freshEnd();
    await writeBoth(end, ['10', '9', '9', '8', '8', '8'], ['10', '9', '9', '8', '8', '7']);
    const result = await settle(end, arrows, { first: 1, second: 1 }, disputed);
    expect(result).toMatchObject({ status: 'rejected', reason: expect.stringMatching(reason) });
  });

  it('refuses a settlement from a writer', async () => {
    const end = freshEnd();
    await writeBoth(end, ['5', '5', '5', '5', '5', '5'], ['5', '5', '5', '5', '5', '4']);
    expect(
      await settle(end, ['5', '5', '5', '5', '5', '5'], { first: 1, second: 1 }, [], phones.writer1),
    ).toMatchObject({
      status: 'rejected',
      reason: 'Only the caller of target 1 can settle an end; you are writer 1.',
    });
  });
});

describe('the server’s cross-check is the phones’ cross-check', () => {
  it('derives the same view from the records a phone pulls as the server shows', async () => {
    const pulled: ChangeDto[] = [];
    for (let cursor = 0; ;) {
      const page = await phones.caller.pull(cursor, 7);
      pulled.push(...page.changes);
      cursor = page.cursor;
      if (!page.hasMore) break;
    }
    // Build each end's facts as a phone would, latest record per key.
    const facts = new Map<string, EndFacts>();
    const at = (entryId: number, endIndex: number) => {
      const key = `${entryId}:${endIndex}`;
      if (!facts.has(key)) facts.set(key, {});
      return facts.get(key)!;
    };
    for (const c of pulled) {
      if (c.type === 'end')
        at(c.record.entryId, c.record.endIndex)[c.record.slot === 1 ? 'first' : 'second'] = {
          arrows: c.record.arrows,
          revision: c.record.revision,
          flags: c.record.flags,
        };
      else if (c.type === 'settlement')
        at(c.record.entryId, c.record.endIndex).settlement = {
          arrows: c.record.arrows,
          disputed: c.record.disputed,
          basis: c.record.basis,
        };
    }
    const server = await views(field.judge);
    let compared = 0;
    for (const archer of server.archers) {
      for (const end of archer.ends) {
        expect(end.view, `${archer.name} end ${end.endIndex + 1}`).toEqual(
          endView(facts.get(`${archer.entryId}:${end.endIndex}`) ?? {}),
        );
        compared += 1;
      }
    }
    expect(compared).toBe(3 * 12);
    expect(server.archers.map((a) => a.position)).toEqual(['A', 'B', 'C']);
  });
});
