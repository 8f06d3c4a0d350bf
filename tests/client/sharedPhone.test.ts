import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { LocalDb, localDb, targetKeyOf, type JoinedTarget } from '../../src/local/db';
import { forgetOthers } from '../../src/local/forgetOthers';
import { exportWaiting, recordChange, waitingCount } from '../../src/local/outbox';
import { waitingInWords } from '../../src/local/waitingInWords';
import type { EndWriteArgs } from '../../src/contract/sync';

/*
 * A phone shared by several people keeps each person's data to themselves: another person's
 * rows go when someone else signs in, everything goes at sign-out, and only changes that have
 * not reached the server stay (hidden) for their person.
 */

const ORGANIZER = 1;
const ARCHER = 2;

let n = 0;
const dbs: LocalDb[] = [];
function freshDb(): LocalDb {
  n += 1;
  const db = new LocalDb(`shared-phone-${n}`);
  dbs.push(db);
  return db;
}
afterEach(async () => {
  for (const db of dbs.splice(0)) await db.delete();
  vi.unstubAllGlobals();
  vi.resetModules();
});

function target(userId: number, targetNumber: number, entryIds: number[]): JoinedTarget {
  return {
    key: targetKeyOf(userId, 9, targetNumber),
    userId,
    joinedAt: '2026-12-02T09:00:00.000Z',
    event: { id: 3, name: 'Larchmere Open', venue: 'Field' },
    session: { id: 9, name: 'Morning', startsAt: '2026-12-02T09:00:00.000Z', closed: false },
    targetNumber,
    task: 'writer1',
    members: [],
    archers: entryIds.map((entryId, i) => ({
      entryId,
      position: (['A', 'B', 'C', 'D'] as const)[i]!,
      name: `Archer ${entryId}`,
      club: 'Club',
      division: 'Recurve Women',
      bowStyle: 'recurve' as const,
      round: {
        id: '70m',
        name: '70 m',
        face: '122cm',
        distances: [],
      } as unknown as JoinedTarget['archers'][number]['round'],
    })),
  };
}

const write = (entryId: number, endIndex: number): { kind: 'end.write'; args: EndWriteArgs } => ({
  kind: 'end.write',
  args: { sessionId: 9, entryId, endIndex, slot: 1, arrows: ['9'], flags: [] },
});

async function phoneUsedByTwo(db: LocalDb) {
  await db.targets.bulkPut([
    target(ORGANIZER, 1, [11, 12]),
    target(ORGANIZER, 2, [21]),
    target(ARCHER, 3, [31]),
  ]);
  // The organizer's change on target 1 reached the server; one on target 2 did not.
  const sent = await recordChange(db, ORGANIZER, write(11, 0));
  await db.outbox.update([sent.clientId, sent.seq], { status: 'applied' });
  await recordChange(db, ORGANIZER, write(21, 0));
  await recordChange(db, ORGANIZER, write(21, 0));
  await recordChange(db, ARCHER, write(31, 4));
  await db.cardRecords.put({
    cardKey: '9:11',
    sessionId: 9,
    records: [
      {
        sessionId: 9,
        entryId: 11,
        endIndex: 0,
        slot: 1,
        arrows: ['9'],
        flags: [],
        revision: 1,
        writtenBy: ORGANIZER,
        writtenAt: '2026-12-02T09:00:00.000Z',
      },
    ],
  });
  await db.rulings.put({
    id: 1,
    endKey: '9:11:0',
    sessionId: 9,
    entryId: 11,
    endIndex: 0,
    arrows: ['9'],
    reason: 'Line call',
    photoId: null,
    judgedBy: 7,
    judgedByName: 'Field Judge',
    judgedAt: '2026-12-02T09:00:00.000Z',
  });
  await db.meta.bulkPut([
    { key: `pullCursor:${ORGANIZER}`, value: 40 },
    { key: `pullCursor:${ARCHER}`, value: 12 },
  ]);
}

describe('a phone shared by several people', () => {
  it("when someone else signs in, drops the previous person's targets, sent changes and the pulled copies, and keeps their waiting changes hidden", async () => {
    const db = freshDb();
    await phoneUsedByTwo(db);
    await forgetOthers(db, ARCHER);

    // Target 2 stays: a change about it has not reached the server yet.
    expect((await db.targets.toArray()).map((t) => t.key).sort()).toEqual([
      targetKeyOf(ORGANIZER, 9, 2),
      targetKeyOf(ARCHER, 9, 3),
    ]);
    const outbox = await db.outbox.toArray();
    expect(outbox.map((r) => [r.userId, r.status])).toEqual(
      expect.arrayContaining([
        [ORGANIZER, 'pending'],
        [ORGANIZER, 'pending'],
        [ARCHER, 'pending'],
      ]),
    );
    expect(outbox).toHaveLength(3);
    expect(await db.cardRecords.count()).toBe(0);
    expect(await db.rulings.count()).toBe(0);
    expect(await db.meta.where('key').startsWith('pullCursor:').count()).toBe(0);

    // The archer sees, counts and exports only her own changes.
    expect(await waitingCount(db, ARCHER)).toBe(1);
    expect(await waitingInWords(db, ARCHER)).toEqual(['End 5 of Archer 31']);
    const file = JSON.parse((await exportWaiting(db, ARCHER)).json) as { clients: { userId: number }[] };
    expect(file.clients.map((c) => c.userId)).toEqual([ARCHER]);
    // The organizer's two taps on one end are one line for them.
    expect(await waitingInWords(db, ORGANIZER)).toEqual(['End 1 of Archer 21']);
  });

  it('at sign-out keeps nothing but changes still waiting for the server, and numbers later changes on', async () => {
    const db = freshDb();
    await phoneUsedByTwo(db);
    await forgetOthers(db, undefined);
    expect((await db.targets.toArray()).map((t) => t.key).sort()).toEqual([
      targetKeyOf(ORGANIZER, 9, 2),
      targetKeyOf(ARCHER, 9, 3),
    ]);
    expect((await db.outbox.toArray()).every((r) => r.status === 'pending')).toBe(true);
    const next = await recordChange(db, ORGANIZER, write(21, 1));
    expect(next.seq).toBe(4);
  });

  it("clears the previous person's data from storage when a different person signs in, without a sign-out first", async () => {
    const stored = new Map<string, string>([
      ['ringcall.owner', String(ORGANIZER)],
      ['ringcall.query-cache', '{"clientState":{"queries":[{"queryKey":["events"]}]}}'],
      [`ringcall.pad-end.${ORGANIZER}:9:1`, '3'],
      ['ringcall.theme', 'sun'],
    ]);
    vi.stubGlobal('localStorage', {
      get length() {
        return stored.size;
      },
      key: (i: number) => [...stored.keys()][i] ?? null,
      getItem: (k: string) => stored.get(k) ?? null,
      setItem: (k: string, v: string) => void stored.set(k, v),
      removeItem: (k: string) => void stored.delete(k),
    });
    const owner = await import('../../src/local/phoneOwner');
    await phoneUsedByTwo(localDb());
    const heard = vi.fn();
    owner.onOwnerChange(heard);
    expect(owner.phoneOwner()).toBe(ORGANIZER);

    owner.claimPhone(ORGANIZER);
    expect(heard).not.toHaveBeenCalled();

    owner.claimPhone(ARCHER);
    expect(heard).toHaveBeenCalledTimes(1);
    expect(owner.phoneOwner()).toBe(ARCHER);
    expect([...stored.keys()].sort()).toEqual(['ringcall.owner', 'ringcall.theme']);
    await owner.ownerSettled();
    expect(await localDb().cardRecords.count()).toBe(0);
    expect(await localDb().targets.where('userId').equals(ORGANIZER).count()).toBe(1);

    await owner.releasePhone();
    expect(owner.phoneOwner()).toBeUndefined();
    expect(stored.has('ringcall.owner')).toBe(false);
    expect(await localDb().targets.where('userId').equals(ARCHER).count()).toBe(1);
    await localDb().delete();
  });
});
