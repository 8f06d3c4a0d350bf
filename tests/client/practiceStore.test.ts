import 'fake-indexeddb/auto';
import { Dexie } from 'dexie';
import { describe, expect, it, vi } from 'vitest';
import { LocalDb } from '../../src/local/db';
import { forgetOthers } from '../../src/local/forgetOthers';
import {
  addPracticeArrow,
  deletePracticeSession,
  ownPractice,
  ownSessionParts,
  practiceEnds,
  progressSessions,
  restorePracticeSession,
  startPracticeSession,
  undoPracticeArrow,
} from '../../src/features/practice/practiceStore';
import { nextEndIndex } from '../../src/features/practice/plan';
import { PRACTICE_MAX_ENDS } from '../../src/core/practice/limits';
import { summarize } from '../../src/features/practice/summary';
import { FREE_PRACTICE } from './support/practiceSetup';

const free = FREE_PRACTICE;

describe('practice on the phone', () => {
  it('fills planned ends in order, closes the session on the last arrow, and undo reopens it', async () => {
    const db = new LocalDb('practice-store-1');
    const id = await startPracticeSession(free, db);
    for (const value of ['X', '10', '9', '9', '8', 'M'] as const) {
      expect(await addPracticeArrow(id, { value }, db)).toBe(true);
    }
    expect((await db.practiceSessions.get(id))?.finishedAt).toBeDefined();
    expect(await addPracticeArrow(id, { value: '7' }, db)).toBe(false);
    const ends = await practiceEnds(id, db);
    expect(ends.map((e) => e.arrows.map((a) => a.value))).toEqual([
      ['X', '10', '9'],
      ['9', '8', 'M'],
    ]);
    // X,10,9,9,8,M = 46 (see tests/core/practice.test.ts).
    expect(summarize(ends).tally.total).toBe(46);

    // Progress parts kept with the session: 6 arrows, 46 points at 18 m on the 40 cm face.
    expect((await db.practiceSessions.get(id))?.progress).toEqual([
      { distanceM: 18, faceId: 'full-40', arrows: 6, points: 46 },
    ]);

    await undoPracticeArrow(id, db);
    const session = await db.practiceSessions.get(id);
    expect(session?.finishedAt).toBeUndefined();
    // The M taken back: 5 arrows, still 46 points.
    expect(session?.progress).toEqual([{ distanceM: 18, faceId: 'full-40', arrows: 5, points: 46 }]);
    // A session stored before the parts were kept is worked out from its ends.
    await db.practiceSessions.update(id, { progress: undefined });
    expect(progressSessions(await ownSessionParts(undefined, db))[0]?.parts).toEqual([
      { distanceM: 18, faceId: 'full-40', arrows: 5, points: 46 },
    ]);
    expect(nextEndIndex(session!, await practiceEnds(id, db))).toBe(1);
    db.close();
  });

  it('an arrow after a write from elsewhere (a sync, another tab) builds on that write, and quick taps all land', async () => {
    const db = new LocalDb('practice-store-elsewhere');
    const id = await startPracticeSession(free, db);
    expect(await addPracticeArrow(id, { value: 'X' }, db)).toBe(true);
    // Another of the person's phones added an arrow to this end; a sync stores it here.
    const [end] = await practiceEnds(id, db);
    await db.practiceEnds.put({ ...end!, arrows: [...end!.arrows, { value: '10' }] });
    expect(await addPracticeArrow(id, { value: '9' }, db)).toBe(true);
    // Two taps before either commits.
    await Promise.all([addPracticeArrow(id, { value: '8' }, db), addPracticeArrow(id, { value: '7' }, db)]);
    expect((await practiceEnds(id, db)).map((e) => e.arrows.map((a) => a.value))).toEqual([
      ['X', '10', '9'],
      ['8', '7'],
    ]);
    expect((await db.practiceSessions.get(id))?.progress).toEqual([
      { distanceM: 18, faceId: 'full-40', arrows: 5, points: 44 },
    ]);
    db.close();
  });

  it('a tap taken while an earlier tap is still being written builds on that tap (keys typed fast)', async () => {
    const db = new LocalDb('practice-store-overlap');
    const id = await startPracticeSession(free, db);
    // "X" then "10" asked for at once, and "9" asked for as soon as "X" is stored, while "10" may
    // still be on its way: "9" must not be written on top of "X" alone.
    const first = addPracticeArrow(id, { value: 'X' }, db);
    const second = addPracticeArrow(id, { value: '10' }, db);
    await first;
    const third = addPracticeArrow(id, { value: '9' }, db);
    expect(await Promise.all([second, third])).toEqual([true, true]);
    expect((await practiceEnds(id, db)).map((e) => e.arrows.map((a) => a.value))).toEqual([['X', '10', '9']]);
    // A tap after the last one was stored builds on what this page wrote, with no read.
    const read = vi.spyOn(db.practiceSessions, 'get');
    expect(await addPracticeArrow(id, { value: '8' }, db)).toBe(true);
    expect(await addPracticeArrow(id, { value: '7' }, db)).toBe(true);
    expect(read).not.toHaveBeenCalled();
    expect((await practiceEnds(id, db)).map((e) => e.arrows.length)).toEqual([3, 2]);
    db.close();
  });

  it('a session wiped from the phone (a sign-out on a shared phone) is not written back from what a tap remembered', async () => {
    const db = new LocalDb('practice-store-wiped');
    const id = await startPracticeSession(free, db);
    expect(await addPracticeArrow(id, { value: 'X' }, db)).toBe(true);
    // The next person's sign-in clears the last one's practice, in a transaction of its own.
    await db.transaction('rw', db.practiceSessions, db.practiceEnds, async () => {
      await db.practiceEnds.where('sessionId').equals(id).delete();
      await db.practiceSessions.delete(id);
    });
    expect(await addPracticeArrow(id, { value: '9' }, db)).toBe(false);
    expect(await db.practiceSessions.get(id)).toBeUndefined();
    expect(await practiceEnds(id, db)).toEqual([]);
    db.close();
  });

  it('an open-ended session goes on until finished; a catalog round follows its distances', async () => {
    const db = new LocalDb('practice-store-2');
    const open = await startPracticeSession({ ...free, plannedEnds: null, arrowsPerEnd: 1 }, db);
    for (let i = 0; i < 40; i += 1) await addPracticeArrow(open, { value: '9' }, db);
    expect((await practiceEnds(open, db)).length).toBe(40);
    expect((await db.practiceSessions.get(open))?.finishedAt).toBeUndefined();
    // It stops at the most ends a session keeps (the account refuses a 201st), and is finished then.
    const stored = (await db.practiceSessions.get(open))!;
    const full = Array.from({ length: PRACTICE_MAX_ENDS }, (_, index) => ({
      key: `${open}:${index}`,
      sessionId: open,
      index,
      distanceM: 18,
      faceId: 'full-40' as const,
      arrows: [{ value: '9' as const }],
      at: stored.startedAt,
    }));
    expect(nextEndIndex(stored, full.slice(0, -1))).toBe(PRACTICE_MAX_ENDS - 1);
    expect(nextEndIndex(stored, full)).toBeUndefined();

    const round = await startPracticeSession({ ...free, roundId: '1440-men', venue: 'outdoor' }, db);
    // 90 m and 70 m in ends of six, then 50 m on the 80 cm face in ends of three (src/core/rounds.ts).
    for (let i = 0; i < 72 + 3; i += 1) await addPracticeArrow(round, { value: '8' }, db);
    const ends = await practiceEnds(round, db);
    expect(ends[0]).toMatchObject({ distanceM: 90, faceId: 'full-122' });
    expect(ends[12]).toMatchObject({ distanceM: 50, faceId: 'full-80' });
    expect(ends[12]?.arrows).toHaveLength(3);
    db.close();
  });

  it('delete removes the session and its ends; undo brings them back whole', async () => {
    const db = new LocalDb('practice-store-3');
    const id = await startPracticeSession(free, db);
    await addPracticeArrow(id, { value: '10', xMm: 3, yMm: -4 }, db);
    const gone = await deletePracticeSession(id, db);
    expect(await db.practiceSessions.count()).toBe(0);
    expect(await db.practiceEnds.count()).toBe(0);
    await restorePracticeSession(gone!, db);
    expect((await practiceEnds(id, db))[0]?.arrows).toEqual([{ value: '10', xMm: 3, yMm: -4 }]);
    db.close();
  });

  it('opening a phone database of version 2 keeps its data and adds the practice tables', async () => {
    const old = new Dexie('practice-upgrade');
    old.version(1).stores({ meta: 'key', targets: 'key, userId', endRecords: 'key, endKey, sessionId' });
    old.version(2).stores({ rulings: 'id, endKey, sessionId' });
    await old.open();
    await old.table('meta').put({ key: 'installId', value: 'kept' });
    old.close();

    const db = new LocalDb('practice-upgrade');
    expect((await db.meta.get('installId'))?.value).toBe('kept');
    expect(await db.practiceSessions.count()).toBe(0);
    db.close();
  });
});

describe('practice on a shared phone', () => {
  it('shows each person only their own practice; practice with no one signed in goes to the next person', async () => {
    const db = new LocalDb('practice-store-shared');
    // Recorded with no one signed in (phoneOwner() is undefined under this test).
    const anonymous = await startPracticeSession(free, db);
    await addPracticeArrow(anonymous, { value: '9' }, db);
    expect((await ownPractice(undefined, db)).sessions.map((s) => s.id)).toEqual([anonymous]);

    // Person 7 signs in: the practice becomes theirs, and no one else's.
    await forgetOthers(db, 7);
    expect((await ownPractice(7, db)).sessions.map((s) => s.id)).toEqual([anonymous]);
    expect((await ownPractice(7, db)).ends).toHaveLength(1);
    expect((await ownPractice(undefined, db)).sessions).toEqual([]);

    // Person 8 signs in on the same phone: 7's practice is hidden, not deleted (it exists only here).
    await forgetOthers(db, 8);
    expect((await ownPractice(8, db)).sessions).toEqual([]);
    expect(await db.practiceSessions.get(anonymous)).toMatchObject({ ownerId: 7 });
    // And at sign-out it stays 7's.
    await forgetOthers(db, undefined);
    expect((await ownPractice(undefined, db)).sessions).toEqual([]);
    expect((await ownPractice(7, db)).sessions.map((s) => s.id)).toEqual([anonymous]);
    db.close();
  });
});
