import 'fake-indexeddb/auto';
import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { LocalDb } from '../../src/local/db';
import { forgetOthers } from '../../src/local/forgetOthers';
import { recordChange } from '../../src/local/outbox';
import { refusedPractice } from '../../src/local/practiceSync';
import { claimPhone, ownerSettled, releasePhone } from '../../src/local/phoneOwner';
import { syncOnce, type SyncTransport } from '../../src/local/syncEngine';
import { waitingInWords } from '../../src/local/waitingInWords';
import {
  addPracticeArrow,
  deletePracticeSession,
  ownPractice,
  practiceEnds,
  restorePracticeSession,
  startPracticeSession,
  undoPracticeArrow,
} from '../../src/features/practice/practiceStore';
import type { PullResponse, PushResponse } from '../../src/contract/sync';
import { makePerson, type TestPerson } from '../server/support/people';
import { startTestServer, type TestServer } from '../server/support/testServer';
import { FREE_PRACTICE } from './support/practiceSetup';

/*
 * The practice log between a person's phones: each write records its outbox rows, the real
 * server applies them, and another phone of the same person pulls them into its practice tables.
 */

let server: TestServer;
let archer: TestPerson;
let n = 0;
const dbs: LocalDb[] = [];
const freshDb = () => {
  n += 1;
  const db = new LocalDb(`practice-sync-test-${n}`);
  dbs.push(db);
  return db;
};

beforeAll(async () => {
  server = await startTestServer();
  archer = await makePerson(server.db, 'Practice Archer');
});
afterEach(async () => {
  await releasePhone();
  for (const db of dbs.splice(0)) await db.delete();
});
afterAll(() => server.close());

const transportFor = (person: TestPerson): SyncTransport => ({
  push: async (body) =>
    (await request(server.app).post('/api/sync/push').set(person.auth).send(body)).body as PushResponse,
  pull: async (cursor) =>
    (await request(server.app).get('/api/sync/pull').query({ cursor }).set(person.auth)).body as PullResponse,
});

const free = { ...FREE_PRACTICE, note: 'Evening' };

const signIn = async (person: TestPerson) => {
  claimPhone(person.id);
  await ownerSettled();
};

describe('practice in the outbox', () => {
  it('records each practice write as an outbox row of the person signed in, in the same transaction', async () => {
    await signIn(archer);
    const db = freshDb();
    const id = await startPracticeSession(free, db);
    await addPracticeArrow(id, { value: '10' }, db);
    await addPracticeArrow(id, { value: '9', xMm: 12.5, yMm: -3 }, db);
    await undoPracticeArrow(id, db);
    await deletePracticeSession(id, db);
    const rows = await db.outbox.orderBy('[clientId+seq]').toArray();
    expect(rows.map((r) => r.kind)).toEqual([
      'practice.session',
      'practice.end',
      'practice.end',
      'practice.end',
      'practice.delete',
    ]);
    expect(rows.map((r) => r.seq)).toEqual([1, 2, 3, 4, 5]);
    expect(rows.every((r) => r.userId === archer.id && r.status === 'pending')).toBe(true);
    // Each end change carries the whole end: sent again, it changes nothing.
    expect(rows[2]!.args).toMatchObject({ index: 0, arrows: [{ value: '10' }, { value: '9', xMm: 12.5 }] });
    expect(rows[3]!.args).toMatchObject({ index: 0, arrows: [{ value: '10' }] });
    expect(await waitingInWords(db, archer.id)).toEqual(['Your practice log']);
  });

  it('records nothing with no one signed in, and sends that practice whole once someone signs in and adopts it', async () => {
    const db = freshDb();
    const id = await startPracticeSession(free, db);
    await addPracticeArrow(id, { value: 'X' }, db);
    expect(await db.outbox.count()).toBe(0);
    // The kept copy of someone's tournament cards is theirs alone: it goes when the phone changes hands.
    await db.meta.put({ key: 'tournamentCards:99', value: [] });
    await forgetOthers(db, archer.id);
    expect(await db.meta.get('tournamentCards:99')).toBeUndefined();
    const rows = await db.outbox.toArray();
    expect(rows.map((r) => [r.kind, r.userId])).toEqual([
      ['practice.session', archer.id],
      ['practice.end', archer.id],
    ]);
  });
});

describe('practice kept before practice synced', () => {
  it('is sent whole on the person’s first sync on this phone, once', async () => {
    // A person of their own: what the other tests' phones pull is not mixed in.
    const person = await makePerson(server.db, 'Older Archer');
    const db = freshDb();
    // As an older version stored it: the person's session, with no outbox rows.
    const id = crypto.randomUUID();
    await db.practiceSessions.add({
      ...FREE_PRACTICE,
      id,
      ownerId: person.id,
      startedAt: '2026-11-02T10:00:00.000Z',
    });
    await db.practiceEnds.add({
      key: `${id}:0`,
      sessionId: id,
      index: 0,
      distanceM: 18,
      faceId: 'full-40',
      arrows: [{ value: '10' }, { value: '9' }, { value: '9' }],
      at: '2026-11-02T10:05:00.000Z',
    });
    await syncOnce(db, person.id, transportFor(person));
    expect((await db.outbox.toArray()).map((r) => [r.kind, r.status])).toEqual([
      ['practice.session', 'applied'],
      ['practice.end', 'applied'],
    ]);
    const stored = await server.db('practice_ends').where({ session_id: id });
    expect(stored).toHaveLength(1);
    await syncOnce(db, person.id, transportFor(person));
    expect(await db.outbox.count()).toBe(2);
  });
});

describe('practice between a person’s phones', () => {
  it('shows a session recorded on one phone on the other after its pull, with its progress, and takes it away when deleted', async () => {
    await signIn(archer);
    const first = freshDb();
    const second = freshDb();
    const id = await startPracticeSession(free, first);
    for (const value of ['X', '10', '9', '9', '8', 'M'] as const)
      await addPracticeArrow(id, { value }, first);
    await syncOnce(first, archer.id, transportFor(archer));
    expect(await first.outbox.where('status').equals('applied').count()).toBe(8);

    await syncOnce(second, archer.id, transportFor(archer));
    const pulled = await ownPractice(archer.id, second);
    expect(pulled.sessions).toHaveLength(1);
    expect(pulled.sessions[0]).toMatchObject({
      id,
      ownerId: archer.id,
      note: 'Evening',
      finishedAt: expect.any(String),
    });
    expect(pulled.sessions[0]!.progress).toEqual([
      { distanceM: 18, faceId: 'full-40', arrows: 6, points: 46 },
    ]);
    expect(pulled.ends.map((e) => e.arrows.map((a) => a.value))).toEqual([
      ['X', '10', '9'],
      ['9', '8', 'M'],
    ]);

    // Undo on the second phone drops the arrow on the first after both sync.
    await undoPracticeArrow(id, second);
    await syncOnce(second, archer.id, transportFor(archer));
    await syncOnce(first, archer.id, transportFor(archer));
    expect((await ownPractice(archer.id, first)).ends.map((e) => e.arrows.length)).toEqual([3, 2]);
    expect((await first.practiceSessions.get(id))?.finishedAt).toBeUndefined();

    const gone = await deletePracticeSession(id, first);
    await syncOnce(first, archer.id, transportFor(archer));
    await syncOnce(second, archer.id, transportFor(archer));
    expect(await ownPractice(archer.id, second)).toEqual({ sessions: [], ends: [] });

    // Undo of the deletion sends it whole again.
    await restorePracticeSession(gone!, first);
    await syncOnce(first, archer.id, transportFor(archer));
    await syncOnce(second, archer.id, transportFor(archer));
    expect((await ownPractice(archer.id, second)).ends.map((e) => e.arrows.length)).toEqual([3, 2]);
  });

  it('keeps an arrow made while a sync travelled: a pulled copy never replaces a session with changes still waiting', async () => {
    await signIn(archer);
    const db = freshDb();
    const id = await startPracticeSession({ ...free, plannedEnds: null }, db);
    await addPracticeArrow(id, { value: '10' }, db);
    const transport = transportFor(archer);
    let tapped = false;
    const slowPush: SyncTransport = {
      ...transport,
      // The push carries no cursor here, so the round ends with a separate pull.
      push: async ({ cursor: _cursor, ...body }) => transport.push(body),
      pull: async (cursor) => {
        const page = await transport.pull(cursor);
        // The archer keeps another arrow while the pulled copy (of one arrow) travels back.
        if (!tapped) await addPracticeArrow(id, { value: '9' }, db);
        tapped = true;
        return page;
      },
    };
    await syncOnce(db, archer.id, slowPush);
    expect((await practiceEnds(id, db))[0]!.arrows.map((a) => a.value)).toEqual(['10', '9']);
    await syncOnce(db, archer.id, transport);
    expect((await practiceEnds(id, db))[0]!.arrows.map((a) => a.value)).toEqual(['10', '9']);
    expect(await db.outbox.where('status').equals('pending').count()).toBe(0);
  });

  it('lets an end kept offline win over a deletion on another phone: both phones end with the whole session, and the log says why it is back', async () => {
    // A person of their own: what the other tests' phones pull is not mixed in.
    const racer = await makePerson(server.db, 'Racing Archer');
    await signIn(racer);
    const first = freshDb();
    const second = freshDb();
    const id = await startPracticeSession({ ...free, plannedEnds: null }, first);
    for (const value of ['10', '9', '9'] as const) await addPracticeArrow(id, { value }, first);
    await syncOnce(first, racer.id, transportFor(racer));
    await syncOnce(second, racer.id, transportFor(racer));

    // The first phone, offline, keeps a second end while the second phone deletes the session.
    for (const value of ['X', '8', '7'] as const) await addPracticeArrow(id, { value }, first);
    await deletePracticeSession(id, second);
    await syncOnce(second, racer.id, transportFor(racer));
    expect(await ownPractice(racer.id, second)).toEqual({ sessions: [], ends: [] });

    await syncOnce(first, racer.id, transportFor(racer));
    await syncOnce(second, racer.id, transportFor(racer));
    expect(await refusedPractice(first, racer.id)).toEqual([]);
    for (const phone of [first, second]) {
      const { sessions, ends } = await ownPractice(racer.id, phone);
      expect(ends.map((e) => e.arrows.map((a) => a.value))).toEqual([
        ['10', '9', '9'],
        ['X', '8', '7'],
      ]);
      expect(sessions[0]!.progress).toEqual([{ distanceM: 18, faceId: 'full-40', arrows: 6, points: 53 }]);
      expect(sessions[0]!.revivedAt).toEqual(expect.any(String));
    }
    // Synced again (a reload): nothing more is sent, the note is not sent back.
    await syncOnce(first, racer.id, transportFor(racer));
    expect(await first.outbox.where('status').equals('pending').count()).toBe(0);

    // The second phone may delete it again: it goes from both.
    await deletePracticeSession(id, second);
    await syncOnce(second, racer.id, transportFor(racer));
    await syncOnce(first, racer.id, transportFor(racer));
    expect(await ownPractice(racer.id, first)).toEqual({ sessions: [], ends: [] });
  });

  it('tells the person which practice their account refused, with its reason', async () => {
    const db = freshDb();
    // An end of a session the server does not hold (deleted on another phone, say).
    await recordChange(db, archer.id, {
      kind: 'practice.end',
      args: {
        sessionId: crypto.randomUUID(),
        index: 0,
        distanceM: 18,
        faceId: 'full-40',
        arrows: [{ value: '9' }],
        at: '2026-11-30T09:00:00.000Z',
      },
    });
    expect(await refusedPractice(db, archer.id)).toEqual([]);
    await syncOnce(db, archer.id, transportFor(archer));
    const reasons = await refusedPractice(db, archer.id);
    expect(reasons).toHaveLength(1);
    expect(reasons[0]).toMatch(/not on your account/);
    // No one else on the phone is told.
    expect(await refusedPractice(db, undefined)).toEqual([]);
  });
});
