import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { ChangeDto } from '../../src/contract/sync';
import { startTestServer, type TestServer } from './support/testServer';
import { giveRole, makePerson, type TestPerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';
import { Phone } from './support/phone';

/*
 * Pull: the changes after a cursor that the person may see — their own target groups, and
 * every target of the events they judge or organize — oldest first, in pages.
 */

let server: TestServer;
let field: Field;
let other: Field;
let people: Record<'t1writer' | 't2writer' | 'late' | 'judge' | 'archer' | 'stranger', TestPerson>;

/** The newest version in the change log: where a pull that has nothing more waiting leaves the cursor. */
const top = async () => Number((await server.db('changes').max({ v: 'version' }).first())?.v ?? 0);

async function pullAll(person: TestPerson, limit?: number): Promise<{ changes: ChangeDto[]; pages: number }> {
  const phone = new Phone(server.app, person);
  const changes: ChangeDto[] = [];
  let pages = 0;
  for (let cursor = 0; ;) {
    const page = await phone.pull(cursor, limit);
    pages += 1;
    changes.push(...page.changes);
    // With more waiting, the cursor is the last change given; with nothing more, the newest version looked at.
    expect(page.cursor).toBe(page.hasMore ? page.changes.at(-1)!.version : await top());
    cursor = page.cursor;
    if (!page.hasMore) break;
  }
  return { changes, pages };
}

beforeAll(async () => {
  server = await startTestServer();
  const { db } = server;
  field = await setUpMixedField(db);
  other = await setUpMixedField(db);
  people = {
    t1writer: await makePerson(db, 'Tia Writer'),
    t2writer: await makePerson(db, 'Teo Writer'),
    late: await makePerson(db, 'Lars Late'),
    judge: await makePerson(db, 'Jude Judge'),
    archer: await makePerson(db, 'Ari Archer'),
    stranger: await makePerson(db, 'Stray Person'),
  };
  await giveRole(db, field.eventId, people.judge, 'judge');
  await giveRole(db, field.eventId, people.archer, 'archer');

  const w1 = new Phone(server.app, people.t1writer);
  const w2 = new Phone(server.app, people.t2writer);
  await w1.join(field.targets.get(1)!.code, 'writer1');
  await w2.join(field.targets.get(2)!.code, 'writer1');
  const three: ArrowValue[] = ['10', '9', '8'];
  // Interleave the two targets so visibility, not order, separates them.
  for (let end = 0; end < 4; end += 1) {
    for (const position of ['A', 'B', 'C'] as const) {
      const r1 = await w1.push([
        w1.write({
          sessionId: field.sessionId,
          entryId: field.archer(1, position).entryId,
          endIndex: end,
          slot: 1,
          arrows: ['10', '9', '8', '7', '6', '5'],
        }),
      ]);
      const r2 = await w2.push([
        w2.write({
          sessionId: field.sessionId,
          entryId: field.archer(2, position).entryId,
          endIndex: end,
          slot: 1,
          arrows: position === 'C' ? ['10', '9', '8', '7', '6', '5'] : three,
        }),
      ]);
      expect([r1.results[0]!.status, r2.results[0]!.status]).toEqual(['applied', 'applied']);
    }
  }
  // Another event's target: never visible to this event's people.
  const elsewhere = new Phone(server.app, await makePerson(db, 'Else Where'));
  await elsewhere.join(other.targets.get(1)!.code, 'writer1');
  await elsewhere.push([
    elsewhere.write({
      sessionId: other.sessionId,
      entryId: other.archer(1, 'A').entryId,
      endIndex: 0,
      slot: 1,
      arrows: ['X'],
    }),
  ]);
});
afterAll(async () => {
  await server.close();
});

const entryIdsOf = (f: Field, target: number) =>
  new Set(f.targets.get(target)!.archers.map((a) => a.entryId));

describe('who sees what', () => {
  it('a writer sees only their own target’s changes', async () => {
    const { changes } = await pullAll(people.t1writer);
    expect(changes).toHaveLength(12);
    const mine = entryIdsOf(field, 1);
    expect(changes.every((c) => 'entryId' in c.record && mine.has(c.record.entryId))).toBe(true);
  });

  it('a judge and an organizer see every change of their event, and nothing of another event', async () => {
    for (const person of [people.judge, field.organizer]) {
      const { changes } = await pullAll(person);
      expect(changes).toHaveLength(24);
      expect(changes.every((c) => 'sessionId' in c.record && c.record.sessionId === field.sessionId)).toBe(true);
    }
  });

  it('an archer of the event who is in no group, and a stranger, see nothing', async () => {
    for (const person of [people.archer, people.stranger]) {
      expect(await new Phone(server.app, person).pull(0)).toEqual({
        changes: [],
        cursor: await top(),
        hasMore: false,
      });
    }
  });

  it('someone who joins later gets the target’s earlier changes when pulling from 0, and nothing new after leaving', async () => {
    const phone = new Phone(server.app, people.late);
    await phone.join(field.targets.get(2)!.code, 'follower');
    const { changes } = await pullAll(people.late);
    expect(changes).toHaveLength(12);
    const last = changes.at(-1)!.version;
    const left = await request(server.app)
      .post(`/api/targets/${field.sessionId}/2/leave`)
      .set(people.late.auth);
    expect(left.status).toBe(204);
    expect(await phone.pull(0)).toEqual({ changes: [], cursor: await top(), hasMore: false });
    expect((await phone.pull(last)).changes).toEqual([]);
  });

  it('records arrive as the contract’s shapes, versions rising', async () => {
    const { changes } = await pullAll(people.judge);
    const versions = changes.map((c) => c.version);
    expect(versions).toEqual([...versions].sort((a, b) => a - b));
    expect(new Set(versions).size).toBe(versions.length);
    expect(changes[0]).toEqual({
      version: expect.any(Number),
      type: 'end',
      record: {
        sessionId: field.sessionId,
        entryId: field.archer(1, 'A').entryId,
        endIndex: 0,
        slot: 1,
        arrows: ['10', '9', '8', '7', '6', '5'],
        flags: [],
        revision: 1,
        writtenBy: people.t1writer.id,
        writtenAt: expect.any(String),
      },
    });
  });
});

describe('paging', () => {
  it('pages with limit and hasMore, and the pages add up to the whole', async () => {
    const whole = await pullAll(people.judge);
    const paged = await pullAll(people.judge, 5);
    expect(paged.pages).toBe(5);
    expect(paged.changes).toEqual(whole.changes);
  });

  it('a page exactly at the end says there is no more', async () => {
    const page = await new Phone(server.app, people.t1writer).pull(0, 12);
    expect(page.changes).toHaveLength(12);
    expect(page.hasMore).toBe(false);
  });

  it.each([
    ['cursor=abc', /cursor must be a whole number/],
    ['cursor=-1', /cursor must be a whole number/],
    ['cursor=1.5', /cursor must be a whole number/],
    ['cursor=1&cursor=2', /cursor must be a whole number/],
    ['limit=0', /limit must be a whole number from 1 to 2000\./],
    ['limit=2001', /limit must be a whole number from 1 to 2000\./],
    ['limit=ten', /limit must be a whole number from 1 to 2000\./],
  ])('refuses %s with a readable 400', async (query, message) => {
    const res = await request(server.app).get(`/api/sync/pull?${query}`).set(people.judge.auth);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/^The request was not accepted\. /);
    expect(res.body.error.message).toMatch(message);
  });

  it('moves the cursor past changes the person cannot see, so a quiet target is not read again', async () => {
    const watcher = await makePerson(server.db, 'Wanda Watcher');
    const phone = new Phone(server.app, watcher);
    await phone.join(field.targets.get(1)!.code, 'follower');
    const caughtUp = await phone.pull(0);
    expect(caughtUp.changes).toHaveLength(12);
    // Target 2 writes on; the follower of target 1 sees none of it, but its cursor moves on.
    const writer = new Phone(server.app, people.t2writer);
    await writer.push([
      writer.write({
        sessionId: field.sessionId,
        entryId: field.archer(2, 'A').entryId,
        endIndex: 5,
        slot: 1,
        arrows: ['10'],
      }),
    ]);
    const next = await phone.pull(caughtUp.cursor);
    expect(next).toEqual({ changes: [], cursor: await top(), hasMore: false });
    expect(next.cursor).toBeGreaterThan(caughtUp.cursor);
    await request(server.app).post(`/api/targets/${field.sessionId}/1/leave`).set(watcher.auth);
  });

  it('a cursor beyond the newest change (a server restored from an older copy) comes back as the newest version', async () => {
    const page = await new Phone(server.app, people.judge).pull(1_000_000);
    expect(page).toEqual({ changes: [], cursor: await top(), hasMore: false });
  });

  it('refuses anonymous pulls with 401', async () => {
    expect((await request(server.app).get('/api/sync/pull')).status).toBe(401);
  });
});
