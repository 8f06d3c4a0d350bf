import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { LocalDb, cardKeyOf, endKeyOf, type JoinedTarget } from '../../src/local/db';
import { loadSessionEnds, type EndCache } from '../../src/local/sessionEnds';
import { recordChange } from '../../src/local/outbox';
import { UNEVEN_ROUND as UNEVEN } from '../support/rounds';

const db = new LocalDb('session-ends-test');
afterEach(async () => {
  await db.delete();
  // Each test starts on an empty database.
  await db.open();
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
    await db.cardRecords.put({
      cardKey: cardKeyOf(1, 7),
      sessionId: 1,
      records: [
        {
          sessionId: 1,
          entryId: 7,
          endIndex: 1,
          slot: 1,
          arrows: ['9', '9', '8', '7'],
          flags: [],
          revision: 1,
          writtenBy: 5,
          writtenAt: '2026-06-01T09:10:00.000Z',
        },
      ],
    });
    const { ends } = await loadSessionEnds(db, 1, 5, [target]);
    expect([...ends.keys()]).toEqual([endKeyOf(1, 7, 0), endKeyOf(1, 7, 1)]);
    expect(ends.get(endKeyOf(1, 7, 1))!.slots[1]!.arrows).toEqual(['9', '9', '8', '7']);
  });

  it('hand back an end the change did not touch as the same object, and a changed end anew', async () => {
    const cache: EndCache = new Map();
    const write = (endIndex: number, arrows: string[]) =>
      recordChange(db, 5, {
        kind: 'end.write',
        args: { sessionId: 1, entryId: 7, endIndex, slot: 1, arrows, flags: [] },
      } as Parameters<typeof recordChange>[2]);
    await write(0, ['X']);
    const first = await loadSessionEnds(db, 1, 5, [target], cache);
    await write(1, ['9']);
    const second = await loadSessionEnds(db, 1, 5, [target], cache);
    expect(second.ends.get(endKeyOf(1, 7, 0))).toBe(first.ends.get(endKeyOf(1, 7, 0)));
    expect(second.ends.get(endKeyOf(1, 7, 1))).not.toBe(first.ends.get(endKeyOf(1, 7, 1)));
    expect(second.ends.get(endKeyOf(1, 7, 1))!.slots[1]!.arrows).toEqual(['9']);
    await write(0, ['X', '10']);
    const third = await loadSessionEnds(db, 1, 5, [target], cache);
    expect(third.ends.get(endKeyOf(1, 7, 0))!.slots[1]!.arrows).toEqual(['X', '10']);
    expect(third.ends.get(endKeyOf(1, 7, 1))).toBe(second.ends.get(endKeyOf(1, 7, 1)));
  });

  it("count this person's unsent changes on the target, a card signature among them", async () => {
    await recordChange(db, 5, {
      kind: 'end.write',
      args: { sessionId: 1, entryId: 7, endIndex: 0, slot: 1, arrows: ['X'], flags: [] },
    } as Parameters<typeof recordChange>[2]);
    await recordChange(db, 5, {
      kind: 'card.sign',
      args: { sessionId: 1, entryId: 7, slot: 1 },
    } as unknown as Parameters<typeof recordChange>[2]);
    // Another archer's change (entry 8, not on this target) is not counted.
    await recordChange(db, 5, {
      kind: 'end.write',
      args: { sessionId: 1, entryId: 8, endIndex: 0, slot: 1, arrows: ['9'], flags: [] },
    } as Parameters<typeof recordChange>[2]);
    const { unsent } = await loadSessionEnds(db, 1, 5, [target]);
    expect(unsent).toBe(2);
  });
});
