import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { LocalDb } from '../../src/local/db';
import { recordChange } from '../../src/local/outbox';
import { syncOnce, type SyncTransport } from '../../src/local/syncEngine';
import type { ChangeDto, PullResponse, PushRequest } from '../../src/contract/sync';

let n = 0;
const dbs: LocalDb[] = [];
function freshDb(): LocalDb {
  n += 1;
  const db = new LocalDb(`round-trip-test-${n}`);
  dbs.push(db);
  return db;
}
afterEach(async () => {
  for (const db of dbs.splice(0)) await db.delete();
});

const tap = (arrows: ('X' | '9' | '8')[]) => ({
  kind: 'end.write' as const,
  args: { sessionId: 1, entryId: 7, endIndex: 0, slot: 1 as const, arrows, flags: [] },
});

const otherWriters = (version: number): ChangeDto => ({
  version,
  type: 'end',
  record: {
    sessionId: 1,
    entryId: 7,
    endIndex: 0,
    slot: 2,
    arrows: ['9'],
    flags: [],
    revision: version,
    writtenBy: 2,
    writtenAt: '2026-12-02T10:00:00.000Z',
  },
});

/** A server that answers pushes (with a pull when asked and `answerPull`) and counts separate pulls. */
function server(options: { answerPull: boolean; pages?: PullResponse[] }) {
  const pushes: PushRequest[] = [];
  const pulls: number[] = [];
  const pages = [...(options.pages ?? [])];
  const transport: SyncTransport = {
    push: async (body) => {
      pushes.push(body);
      const results = body.mutations.map((m) => ({ seq: m.seq, id: m.id, status: 'applied' as const }));
      const lastSeq = body.mutations.at(-1)!.seq;
      if (!options.answerPull || body.cursor === undefined) return { results, lastSeq };
      return { results, lastSeq, pull: { changes: [otherWriters(4)], cursor: 4, hasMore: pages.length > 0 } };
    },
    pull: async (cursor) => {
      pulls.push(cursor);
      return pages.shift() ?? { changes: [], cursor, hasMore: false };
    },
  };
  return { transport, pushes, pulls };
}

describe('one round trip per sync', () => {
  it('sends the pull cursor with the push and stores the pull from its answer, with no separate pull', async () => {
    const db = freshDb();
    await recordChange(db, 5, tap(['X']));
    await recordChange(db, 5, tap(['X', '9']));
    const { transport, pushes, pulls } = server({ answerPull: true });
    const report = await syncOnce(db, 5, transport);
    expect(pushes.map((p) => p.cursor)).toEqual([0]);
    expect(pulls).toEqual([]);
    expect(report).toMatchObject({ pushed: 2, applied: 2, pulled: 1 });
    expect((await db.cardRecords.toArray()).flatMap((c) => c.records.map((r) => r.arrows))).toEqual([['9']]);
    expect((await db.meta.get('pullCursor:5'))?.value).toBe(4);
  });

  it('pulls the rest from where the answer stopped when more is waiting', async () => {
    const db = freshDb();
    await recordChange(db, 5, tap(['8']));
    const { transport, pulls } = server({
      answerPull: true,
      pages: [{ changes: [otherWriters(9)], cursor: 9, hasMore: false }],
    });
    const report = await syncOnce(db, 5, transport);
    expect(pulls).toEqual([4]);
    expect(report.pulled).toBe(2);
    expect((await db.cardRecords.toArray()).flatMap((c) => c.records.map((r) => r.revision))).toEqual([9]);
  });

  it('pulls on its own from an older server that answers pushes without a pull', async () => {
    const db = freshDb();
    await recordChange(db, 5, tap(['8']));
    const { transport, pulls } = server({ answerPull: false });
    await syncOnce(db, 5, transport);
    expect(pulls).toEqual([0]);
  });

  it('pulls on its own when nothing waits to be sent', async () => {
    const db = freshDb();
    const { transport, pushes, pulls } = server({ answerPull: true });
    await syncOnce(db, 5, transport);
    expect(pushes).toEqual([]);
    expect(pulls).toEqual([0]);
  });
});

describe('a pull cursor set back during a round', () => {
  it('is kept for the next round, which pulls from there (the judge desk asks for every end again)', async () => {
    const db = freshDb();
    await db.meta.put({ key: 'pullCursor:5', value: 3 });
    const pulls: number[] = [];
    const transport: SyncTransport = {
      push: async () => ({ results: [], lastSeq: 0 }),
      pull: async (cursor) => {
        pulls.push(cursor);
        // The desk is prepared while this answer is on its way.
        if (pulls.length === 1) await db.meta.put({ key: 'pullCursor:5', value: 0 });
        return { changes: [otherWriters(9)], cursor: 9, hasMore: false };
      },
    };
    await syncOnce(db, 5, transport);
    expect((await db.meta.get('pullCursor:5'))?.value).toBe(0);
    await syncOnce(db, 5, transport);
    expect(pulls).toEqual([3, 0]);
    expect((await db.meta.get('pullCursor:5'))?.value).toBe(9);
  });
});
