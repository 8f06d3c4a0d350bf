import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { LocalDb } from '../../src/local/db';
import { recordChange } from '../../src/local/outbox';
import { SyncLoop } from '../../src/local/syncLoopRunner';
import type { SyncTransport } from '../../src/local/syncEngine';
import { ApiError } from '../../src/api/request';
import type { PushRequest } from '../../src/contract/sync';

// Only the loop's own clock is faked: fake-indexeddb schedules its work with setImmediate.
beforeEach(() => {
  vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'Date'] });
});
let n = 0;
const dbs: LocalDb[] = [];
afterEach(async () => {
  vi.useRealTimers();
  for (const db of dbs.splice(0)) await db.delete();
});
function freshDb(): LocalDb {
  n += 1;
  const db = new LocalDb(`sync-loop-test-${n}`);
  dbs.push(db);
  return db;
}

/** A transport that records each push and answers every change as applied. */
function recordingTransport() {
  const pushes: PushRequest[] = [];
  const transport: SyncTransport = {
    push: async (body) => {
      pushes.push(body);
      const results = body.mutations.map((m) => ({ seq: m.seq, id: m.id, status: 'applied' as const }));
      return { results, lastSeq: body.mutations.at(-1)?.seq ?? 0 } as Awaited<
        ReturnType<SyncTransport['push']>
      >;
    },
    pull: async (cursor) => ({ changes: [], cursor, hasMore: false }),
  };
  return { transport, pushes };
}

const tap = (db: LocalDb, arrows: string[]) =>
  recordChange(db, 5, {
    kind: 'end.write',
    args: { sessionId: 1, entryId: 7, endIndex: 0, slot: 1, arrows, flags: [] },
  } as Parameters<typeof recordChange>[2]);

/**
 * Moves the loop's clock, then lets a round it began finish without moving the clock again. Waited
 * for in real time: a round loads modules (the engine's practice and pull code), which a count of
 * IndexedDB's turns does not wait for.
 */
async function advance(loop: SyncLoop, ms: number) {
  await vi.advanceTimersByTimeAsync(ms);
  await vi.waitFor(
    () => {
      if (loop.getStatus().phase === 'syncing') throw new Error('The round is still running.');
    },
    { timeout: 5_000, interval: 2 },
  );
}

async function startedLoop(db: LocalDb, transport: SyncTransport) {
  const loop = new SyncLoop(db, transport);
  loop.setUser(5);
  await advance(loop, 0);
  return loop;
}

describe('the sync loop', () => {
  it('waits for a pause in typing and sends a burst of taps as one push', async () => {
    const db = freshDb();
    const { transport, pushes } = recordingTransport();
    const loop = await startedLoop(db, transport);
    const before = pushes.length;
    for (const arrows of [['X'], ['X', '9'], ['X', '9', '9']]) {
      await tap(db, arrows);
      loop.afterChange();
      await advance(loop, 300);
    }
    expect(pushes.length).toBe(before);
    await advance(loop, 600);
    expect(pushes.length).toBe(before + 1);
    expect(pushes.at(-1)!.mutations.map((m) => m.seq)).toEqual([1, 2, 3]);
  });

  it('never holds a long burst back for more than a few seconds', async () => {
    const db = freshDb();
    const { transport, pushes } = recordingTransport();
    const loop = await startedLoop(db, transport);
    const before = pushes.length;
    // A tap every half second never leaves a pause of 800 ms.
    for (let i = 0; i < 10 && pushes.length === before; i += 1) {
      await tap(db, ['9']);
      loop.afterChange();
      await advance(loop, 500);
    }
    expect(pushes.length).toBe(before + 1);
    expect(pushes.at(-1)!.mutations.length).toBeLessThanOrEqual(9);
  });

  it('backs off after failures, doubling the wait, and says the phone is offline', async () => {
    const db = freshDb();
    let calls = 0;
    const transport: SyncTransport = {
      push: async () => {
        throw new ApiError(0, 'offline', 'No connection');
      },
      pull: async () => {
        calls += 1;
        throw new ApiError(0, 'offline', 'No connection');
      },
    };
    const loop = await startedLoop(db, transport);
    expect(loop.getStatus()).toMatchObject({ phase: 'offline', retryInMs: 3_000 });
    expect(calls).toBe(1);
    await advance(loop, 2_900);
    expect(calls).toBe(1);
    await advance(loop, 200);
    expect(calls).toBe(2);
    expect(loop.getStatus().retryInMs).toBe(6_000);
    await advance(loop, 6_000);
    expect(calls).toBe(3);
    expect(loop.getStatus().retryInMs).toBe(12_000);
  });

  it('signal returning while a round fails on the way is not left waiting for the backoff', async () => {
    const db = freshDb();
    let online = false;
    let calls = 0;
    let failNow: (() => void) | undefined;
    const transport: SyncTransport = {
      push: async () =>
        ({ results: [], lastSeq: 0 }) as unknown as Awaited<ReturnType<SyncTransport['push']>>,
      pull: async (cursor) => {
        calls += 1;
        if (online) return { changes: [], cursor, hasMore: false };
        // Asked while offline; the answer (a failure) comes after signal is back.
        await new Promise<void>((resolve) => (failNow = resolve));
        throw new ApiError(0, 'offline', 'No connection');
      },
    };
    const loop = new SyncLoop(db, transport);
    loop.setUser(5);
    await vi.advanceTimersByTimeAsync(0);
    await vi.waitFor(() => expect(failNow).toBeDefined());
    // The 'online' event: the round under way still fails, and the next one follows at once.
    online = true;
    loop.kick();
    failNow!();
    await advance(loop, 0);
    await advance(loop, 0);
    expect(calls).toBe(2);
    expect(loop.getStatus().phase).toBe('idle');
  });

  /** A loop whose one waiting tap meets a 401 until `signIn` is called. */
  async function stoppedBy401() {
    const db = freshDb();
    await tap(db, ['X']);
    let signedIn = false;
    const { transport: good, pushes } = recordingTransport();
    const transport: SyncTransport = {
      push: async (body) => {
        if (!signedIn) throw new ApiError(401, 'signed_out', 'Sign in');
        return good.push(body);
      },
      pull: good.pull,
    };
    const loop = await startedLoop(db, transport);
    expect(loop.getStatus().phase).toBe('signed-out');
    return { db, loop, pushes, signIn: () => (signedIn = true) };
  }

  /** After a sign-in: the waiting tap was sent once and the loop is idle. */
  async function expectSent({ db, loop, pushes }: Awaited<ReturnType<typeof stoppedBy401>>) {
    await advance(loop, 0);
    expect(pushes).toHaveLength(1);
    expect(loop.getStatus().phase).toBe('idle');
    expect(await db.outbox.where('status').equals('applied').count()).toBe(1);
  }

  it('stops on a 401 without touching the outbox, and resumes when the person signs in again', async () => {
    const stopped = await stoppedBy401();
    await advance(stopped.loop, 10 * 60_000);
    expect(stopped.pushes).toHaveLength(0);
    expect(await stopped.db.outbox.where('status').equals('pending').count()).toBe(1);

    stopped.signIn();
    stopped.loop.setUser(5);
    await expectSent(stopped);
  });

  it('a loop a 401 stopped resumes when the same person has a sign-in again, without setUser', async () => {
    const stopped = await stoppedBy401();
    stopped.signIn();
    stopped.loop.signedIn(5);
    await expectSent(stopped);
  });

  it("another person's sign-in on a shared phone never sends the stopped person's changes", async () => {
    const stopped = await stoppedBy401();
    stopped.signIn();
    stopped.loop.signedIn(6);
    await advance(stopped.loop, 0);
    expect(stopped.pushes).toHaveLength(0);
    expect(stopped.loop.getStatus().phase).toBe('signed-out');
    expect(await stopped.db.outbox.where('status').equals('pending').count()).toBe(1);
  });
});
