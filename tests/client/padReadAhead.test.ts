import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { JoinedTarget } from '../../src/local/db';

/*
 * Opened on the pad, the app reads the pad's data as its code loads, before React draws: the pad
 * is then drawn whole at once. That read must be the pad's own: the same session, target and
 * person (a shared phone never shows another person's pad), and only when the page opened on it.
 */

function target(userId: number): JoinedTarget {
  return {
    key: `${userId}:9:3`,
    userId,
    joinedAt: '2026-12-02T09:00:00.000Z',
    event: { id: 3, name: 'Larchmere Open', venue: 'Field' },
    session: { id: 9, name: 'Morning', startsAt: '2026-12-02T09:00:00.000Z', closed: false },
    targetNumber: 3,
    task: 'writer1',
    members: [],
    archers: [],
  };
}

/** A page opened at `pathname` on a phone whose owner is `owner`, with the app's modules fresh. */
async function openedAt(pathname: string, owner: number) {
  vi.resetModules();
  const stored = new Map([['ringcall.owner', String(owner)]]);
  vi.stubGlobal('location', { pathname });
  vi.stubGlobal('localStorage', {
    getItem: (k: string) => stored.get(k) ?? null,
    setItem: (k: string, v: string) => stored.set(k, v),
    removeItem: (k: string) => stored.delete(k),
    key: (i: number) => [...stored.keys()][i] ?? null,
    get length() {
      return stored.size;
    },
  });
  const { localDb } = await import('../../src/local/db');
  const ahead = await import('../../src/features/pad/padReadAhead');
  return { db: localDb(), ...ahead };
}

afterEach(async () => {
  const { localDb } = await import('../../src/local/db');
  await localDb().delete();
  vi.unstubAllGlobals();
});

describe("the pad's read ahead", () => {
  it("reads the opened pad's target for the phone's person, and hands it only to that pad", async () => {
    const { db, readAheadSettled, readAheadFor } = await openedAt('/pad/9/3', 5);
    await db.targets.bulkPut([target(5), target(6)]);
    await readAheadSettled();
    const mine = readAheadFor({ sessionId: 9, targetNumber: 3, userId: 5 });
    expect(mine?.data?.target.userId).toBe(5);
    // Another person (signed in since), another target or session: read afresh by the pad.
    expect(readAheadFor({ sessionId: 9, targetNumber: 3, userId: 6 })).toBeUndefined();
    expect(readAheadFor({ sessionId: 9, targetNumber: 4, userId: 5 })).toBeUndefined();
    expect(readAheadFor({ sessionId: 8, targetNumber: 3, userId: 5 })).toBeUndefined();
  });

  it("never reads another person's target: a phone not joined by its person reads none", async () => {
    const { db, readAheadSettled, readAheadFor } = await openedAt('/pad/9/3', 7);
    await db.targets.put(target(6));
    await readAheadSettled();
    expect(readAheadFor({ sessionId: 9, targetNumber: 3, userId: 7 })?.data).toBeNull();
  });

  it('reads nothing on a page not opened on the pad', async () => {
    const { db, readAheadSettled, readAheadFor } = await openedAt('/cards', 5);
    await db.targets.put(target(5));
    await readAheadSettled();
    expect(readAheadFor({ sessionId: 9, targetNumber: 3, userId: 5 })).toBeUndefined();
  });
});
