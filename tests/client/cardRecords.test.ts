import 'fake-indexeddb/auto';
import { Dexie } from 'dexie';
import { afterEach, describe, expect, it } from 'vitest';
import type { EndRecordDto } from '../../src/contract/sync';
import { LocalDb, endKeyOf } from '../../src/local/db';
import { storeRecords } from '../../src/local/cardRecords';
import { loadSessionEnds } from '../../src/local/sessionEnds';
import { UNEVEN_ROUND } from '../support/rounds';
import type { JoinedTarget } from '../../src/local/db';

const opened: Dexie[] = [];
afterEach(async () => {
  for (const db of opened.splice(0)) await db.delete();
});

const record = (entryId: number, endIndex: number, slot: 1 | 2, revision: number, arrows: string[]) =>
  ({
    sessionId: 1,
    entryId,
    endIndex,
    slot,
    arrows,
    flags: [],
    revision,
    writtenBy: 5,
    writtenAt: '2026-06-01T09:00:00.000Z',
  }) as EndRecordDto;

const target = {
  key: '5:1:1',
  userId: 5,
  targetNumber: 1,
  session: { id: 1 },
  archers: [{ entryId: 7, position: 'A', name: 'Ada Fletcher', round: UNEVEN_ROUND }],
} as unknown as JoinedTarget;

describe("a card's writer records, one row per card", () => {
  it('keep the newest revision of each end and writer, whatever order they are stored in', async () => {
    const db = new LocalDb('card-records-merge');
    opened.push(db);
    await storeRecords(db.cardRecords, [record(7, 0, 1, 2, ['9']), record(7, 0, 2, 1, ['8'])]);
    await storeRecords(db.cardRecords, [
      record(7, 0, 1, 1, ['1']), // older than the stored one: kept out
      record(7, 0, 2, 3, ['X']),
      record(7, 1, 1, 1, ['7']),
      record(8, 0, 1, 1, ['6']),
    ]);
    const rows = await db.cardRecords.orderBy('cardKey').toArray();
    expect(
      rows.map((r) => [r.cardKey, r.records.map((x) => [x.endIndex, x.slot, x.revision, x.arrows])]),
    ).toEqual([
      [
        '1:7',
        [
          [0, 1, 2, ['9']],
          [0, 2, 3, ['X']],
          [1, 1, 1, ['7']],
        ],
      ],
      ['1:8', [[0, 1, 1, ['6']]]],
    ]);
  });

  it('are moved over when a phone opens the database of version 5, and read as before', async () => {
    // The phone's schema before version 7: a row per writer record.
    const old = new Dexie('card-records-upgrade');
    old.version(1).stores({
      meta: 'key',
      targets: 'key, userId',
      endRecords: 'key, endKey, sessionId',
      settlements: 'endKey, sessionId',
      outbox: '[clientId+seq], id, status, endKey, userId, [clientId+status]',
    });
    old.version(2).stores({
      rulings: 'id, endKey, sessionId',
      endSignatures: 'id, endKey, sessionId',
      cardSignatures: 'id, cardKey, sessionId',
    });
    old.version(3).stores({ practiceSessions: 'id, startedAt, ownerId', practiceEnds: 'key, sessionId' });
    old.version(5).stores({ matchPads: 'key, userId' });
    await old.open();
    const rows = [record(7, 0, 1, 2, ['X', '9']), record(7, 0, 2, 1, ['X', '8']), record(7, 1, 1, 1, ['7'])];
    await old.table('endRecords').bulkPut(
      rows.map((r) => ({
        ...r,
        key: `${endKeyOf(r.sessionId, r.entryId, r.endIndex)}:${r.slot}`,
        endKey: endKeyOf(r.sessionId, r.entryId, r.endIndex),
      })),
    );
    await old.table('meta').put({ key: 'pullCursor:5', value: 42 });
    old.close();

    const db = new LocalDb('card-records-upgrade');
    opened.push(db);
    expect(await db.cardRecords.toArray()).toEqual([{ cardKey: '1:7', sessionId: 1, records: rows }]);
    expect((await db.meta.get('pullCursor:5'))?.value).toBe(42);
    expect(db.tables.map((t) => t.name)).not.toContain('endRecords');
    const { ends } = await loadSessionEnds(db, 1, 5, [target]);
    expect(ends.get(endKeyOf(1, 7, 0))!.slots[2]!.arrows).toEqual(['X', '8']);
    expect(ends.get(endKeyOf(1, 7, 1))!.slots[1]!.arrows).toEqual(['7']);
  });
});
