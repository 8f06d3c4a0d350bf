import 'fake-indexeddb/auto';
import { liveQuery } from 'dexie';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { LocalDb } from '../../src/local/db';
import { clientIdFor, exportWaiting, recordChange, waitingCount } from '../../src/local/outbox';
import { syncOnce, type SyncTransport } from '../../src/local/syncEngine';
import { ApiError } from '../../src/api/request';
import type { EndWriteArgs } from '../../src/contract/sync';

let n = 0;
const dbs: LocalDb[] = [];
function freshDb(): LocalDb {
  n += 1;
  const db = new LocalDb(`outbox-test-${n}`);
  dbs.push(db);
  return db;
}
afterEach(async () => {
  for (const db of dbs.splice(0)) await db.delete();
});

const write = (
  endIndex: number,
  arrows: EndWriteArgs['arrows'],
): { kind: 'end.write'; args: EndWriteArgs } => ({
  kind: 'end.write',
  args: { sessionId: 1, entryId: 7, endIndex, slot: 1, arrows, flags: [] },
});

describe('the outbox', () => {
  it('numbers changes 1, 2, 3… per person on one install, even when taps overlap', async () => {
    const db = freshDb();
    const rows = await Promise.all([
      recordChange(db, 5, write(0, ['X'])),
      recordChange(db, 5, write(0, ['X', '9'])),
      recordChange(db, 5, write(0, ['X', '9', '9'])),
    ]);
    expect(rows.map((r) => r.seq)).toEqual([1, 2, 3]);
    expect(new Set(rows.map((r) => r.clientId)).size).toBe(1);
    const other = await recordChange(db, 6, write(1, ['5']));
    expect(other.seq).toBe(1);
    expect(other.clientId).not.toBe(rows[0]!.clientId);
    expect(other.clientId.split('.')[0]).toBe(rows[0]!.clientId.split('.')[0]);
    expect(await waitingCount(db, 5)).toBe(3);
    expect(await waitingCount(db, 6)).toBe(1);
  });

  it('never repeats or skips a number when another tab of the app records changes too', async () => {
    const db = freshDb();
    const first = await recordChange(db, 5, write(0, ['X']));
    // Another tab (its own memory, same database) records changes 2 and 3 meanwhile.
    const otherTab = new LocalDb(db.name);
    dbs.push(otherTab);
    const seqKey = `nextSeq:${first.clientId}`;
    for (const seq of [2, 3]) {
      await otherTab.transaction('rw', otherTab.outbox, otherTab.meta, async () => {
        await otherTab.outbox.add({ ...first, seq, id: `other-tab-${seq}` });
        await otherTab.meta.put({ key: seqKey, value: seq + 1 });
      });
    }
    const taps = await Promise.all([
      recordChange(db, 5, write(0, ['X', '9'])),
      recordChange(db, 5, write(0, ['X', '9', '8'])),
    ]);
    expect(taps.map((r) => r.seq)).toEqual([4, 5]);
    const stored = await db.outbox
      .where('[clientId+seq]')
      .between([first.clientId, 0], [first.clientId, 99])
      .toArray();
    expect(stored.map((r) => r.seq)).toEqual([1, 2, 3, 4, 5]);
    expect(stored.map((r) => r.id).slice(1, 3)).toEqual(['other-tab-2', 'other-tab-3']);
    expect((await db.meta.get(seqKey))?.value).toBe(6);
  });

  it('tells live queries of a recorded change, so the pad and the waiting count refresh', async () => {
    const db = freshDb();
    await recordChange(db, 5, write(0, ['X']));
    const counts: number[] = [];
    const lists: string[][] = [];
    // A count and a list, as the header and the pad read them: neither may answer from before the write.
    const subscriptions = [
      liveQuery(() => db.outbox.where('status').equals('pending').count()).subscribe((n) => counts.push(n)),
      liveQuery(() => db.outbox.where('status').equals('pending').toArray()).subscribe((rows) =>
        lists.push(rows.map((r) => (r.args as EndWriteArgs).arrows.join(' '))),
      ),
    ];
    await vi.waitFor(() => expect(counts).toEqual([1]));
    await vi.waitFor(() => expect(lists).toEqual([['X']]));
    await recordChange(db, 5, write(0, ['X', '9']));
    // A query may run again and answer the same (a busy machine); never with what was before the write.
    const answers = <T>(all: T[]) =>
      all.filter((a, i) => i === 0 || JSON.stringify(a) !== JSON.stringify(all[i - 1]));
    await vi.waitFor(() => expect(answers(counts)).toEqual([1, 2]));
    await vi.waitFor(() => expect(answers(lists)).toEqual([['X'], ['X', 'X 9']]));
    subscriptions.forEach((s) => s.unsubscribe());
  });

  it('survives closing and reopening the database (a reload)', async () => {
    const db = freshDb();
    await recordChange(db, 5, write(0, ['8']));
    db.close();
    const reopened = new LocalDb(db.name);
    dbs.push(reopened);
    expect(await waitingCount(reopened, 5)).toBe(1);
    const next = await recordChange(reopened, 5, write(0, ['8', '7']));
    expect(next.seq).toBe(2);
    expect(next.clientId).toBe(await clientIdFor(reopened, 5));
  });

  it('keeps every change waiting when the server cannot be reached', async () => {
    const db = freshDb();
    await recordChange(db, 5, write(0, ['8']));
    const offline: SyncTransport = {
      push: async () => {
        throw new ApiError(0, 'network', 'No connection');
      },
      pull: async () => {
        throw new ApiError(0, 'network', 'No connection');
      },
    };
    await expect(syncOnce(db, 5, offline)).rejects.toThrow('No connection');
    expect(await waitingCount(db, 5)).toBe(1);
  });

  it('keeps every change waiting when the sign-in has expired (401)', async () => {
    const db = freshDb();
    await recordChange(db, 5, write(0, ['8']));
    const signedOut: SyncTransport = {
      push: async () => {
        throw new ApiError(401, 'unauthorized', 'Please sign in again.');
      },
      pull: async () => ({ changes: [], cursor: 0, hasMore: false }),
    };
    await expect(syncOnce(db, 5, signedOut)).rejects.toMatchObject({ status: 401 });
    const rows = await db.outbox.toArray();
    expect(rows.map((r) => r.status)).toEqual(['pending']);
  });

  it('marks refused changes with the reason and keeps them, applied ones as applied', async () => {
    const db = freshDb();
    await recordChange(db, 5, write(0, ['8']));
    await recordChange(db, 5, write(1, ['4']));
    const transport: SyncTransport = {
      push: async (body) => ({
        results: [
          { seq: body.mutations[0]!.seq, id: body.mutations[0]!.id, status: 'applied' },
          {
            seq: body.mutations[1]!.seq,
            id: body.mutations[1]!.id,
            status: 'rejected',
            reason: '4 is not a value on the 80 cm six-ring face.',
          },
        ],
        lastSeq: 2,
      }),
      pull: async () => ({ changes: [], cursor: 0, hasMore: false }),
    };
    const report = await syncOnce(db, 5, transport);
    expect(report).toMatchObject({ pushed: 2, applied: 1, rejected: 1 });
    const rows = await db.outbox.orderBy('[clientId+seq]').toArray();
    expect(rows.map((r) => [r.status, r.reason])).toEqual([
      ['applied', undefined],
      ['rejected', '4 is not a value on the 80 cm six-ring face.'],
    ]);
    const file = JSON.parse((await exportWaiting(db, 5)).json);
    expect(file.clients[0].mutations).toHaveLength(1);
    expect(file.clients[0].mutations[0]).toMatchObject({ seq: 2, status: 'rejected' });
  });
});
