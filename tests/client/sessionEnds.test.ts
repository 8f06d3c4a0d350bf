import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { LocalDb, endKeyOf, type JoinedTarget } from '../../src/local/db';
import { loadSessionEnds } from '../../src/local/sessionEnds';
import { UNEVEN_ROUND as UNEVEN } from '../support/rounds';

const db = new LocalDb('session-ends-test');
afterEach(async () => {
  await db.delete();
});

const target: JoinedTarget = {
  key: '5:1:3',
  userId: 5,
  joinedAt: '2026-06-01T09:00:00.000Z',
  event: { id: 1, name: 'Test', venue: 'Field' },
  session: { id: 1, name: 'Qualification', startsAt: '2026-06-01T09:00:00.000Z', closed: false },
  targetNumber: 3,
  task: 'writer1',
  members: [],
  archers: [
    {
      entryId: 7,
      position: 'A',
      name: 'Ada Fletcher',
      club: 'C',
      division: 'R',
      bowStyle: 'recurve',
      round: UNEVEN,
    },
  ],
};

describe('the ends the phone reads for a target', () => {
  it('are the core count of the round: a shorter last end is one of them', async () => {
    await db.endRecords.put({
      key: `${endKeyOf(1, 7, 1)}:1`,
      endKey: endKeyOf(1, 7, 1),
      sessionId: 1,
      entryId: 7,
      endIndex: 1,
      slot: 1,
      arrows: ['9', '9', '8', '7'],
      flags: [],
      revision: 1,
      writtenBy: 5,
      writtenAt: '2026-06-01T09:10:00.000Z',
    });
    const { ends } = await loadSessionEnds(db, 1, 5, [target]);
    expect([...ends.keys()]).toEqual([endKeyOf(1, 7, 0), endKeyOf(1, 7, 1)]);
    expect(ends.get(endKeyOf(1, 7, 1))!.slots[1]!.arrows).toEqual(['9', '9', '8', '7']);
  });
});
