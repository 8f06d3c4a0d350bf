import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { LocalDb } from '../../src/local/db';
import { STORED_KEPT_MS, storedAnswer, watchStored } from '../../src/features/practice/useStored';

const until = async (check: () => boolean) => {
  for (let i = 0; i < 200 && !check(); i += 1) await new Promise((r) => setTimeout(r, 10));
  expect(check()).toBe(true);
};

describe('reads shared between screens (useStored)', () => {
  it('one read for every listener of a key, handed over to the next screen, ended when no one listens', async () => {
    const db = new LocalDb('use-stored-1');
    const query = () => db.practiceSessions.count();
    // What a second read of the same key would run: never, the first watch answers for all.
    let readAgain = 0;
    const again = () => {
      readAgain += 1;
      return db.practiceSessions.count();
    };
    const heard: string[] = [];
    // The log and progress both listen: the table is read for one of them.
    const leaveLog = watchStored('sessions', query, () => heard.push('log'));
    const leaveProgress = watchStored('sessions', again, () => heard.push('progress'));
    await until(() => storedAnswer('sessions') !== undefined);
    expect(storedAnswer('sessions')).toEqual({ value: 0 });
    expect(heard).toContain('log');
    expect(heard).toContain('progress');

    // Both leave, a screen opens under the same key: the answer is there at once, not read again.
    leaveLog();
    leaveProgress();
    const leaveNext = watchStored('sessions', again, () => undefined);
    expect(storedAnswer('sessions')).toEqual({ value: 0 });
    await new Promise((r) => setTimeout(r, 50));
    expect(readAgain).toBe(0);

    // Still watched: a change is read again and heard.
    await db.practiceSessions.put({
      id: 's1',
      ownerId: 0,
      startedAt: '2026-01-05T17:00:00.000Z',
      bowStyle: 'recurve',
      venue: 'indoor',
      distanceM: 18,
      faceId: 'full-40',
      arrowsPerEnd: 3,
      plannedEnds: null,
      shaftDiameterMm: 5.5,
    });
    await until(() => storedAnswer('sessions')?.value === 1);

    // No one listens: after a while the watch ends and its answer goes (no stale answer kept).
    leaveNext();
    expect(storedAnswer('sessions')).toEqual({ value: 1 });
    await new Promise((r) => setTimeout(r, STORED_KEPT_MS + 100));
    expect(storedAnswer('sessions')).toBeUndefined();
    db.close();
  });
});
