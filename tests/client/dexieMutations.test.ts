import 'fake-indexeddb/auto';
import { Dexie, RangeSet, rangesOverlap, type IndexableType, type ObservabilitySet } from 'dexie';
import { afterEach, describe, expect, it } from 'vitest';
import { LocalDb, type OutboxRow } from '../../src/local/db';
import { changedParts } from '../../src/local/dexieMutations';

/*
 * writeAtOnce writes taps past Dexie and tells live queries as Dexie would (dexieMutations.ts).
 * If a Dexie upgrade changes how it tells them, screens would stop refreshing after a tap:
 * these tests compare our announcement with the one Dexie makes for its own write.
 */

const dbs: LocalDb[] = [];
afterEach(async () => {
  for (const db of dbs.splice(0)) await db.delete();
});

const row = (seq: number): OutboxRow => ({
  clientId: 'install.5',
  seq,
  id: `id-${seq}`,
  userId: 5,
  kind: 'end.write',
  args: { sessionId: 1, entryId: 7, endIndex: 0, slot: 1, arrows: ['X'], flags: [] },
  at: '2026-12-02T10:00:00.000Z',
  endKey: '1:7:0',
  status: 'pending',
});

/** The parts Dexie itself announces for `write`, as part name → whether it holds `key`. */
async function dexieAnnounces(db: LocalDb, write: () => Promise<unknown>): Promise<Record<string, RangeSet>> {
  const heard: Record<string, RangeSet>[] = [];
  const listen = (parts: ObservabilitySet) => void heard.push(parts as Record<string, RangeSet>);
  Dexie.on('storagemutated', listen);
  try {
    await write();
    await new Promise((r) => setTimeout(r, 10));
  } finally {
    Dexie.on('storagemutated').unsubscribe(listen);
  }
  return Object.assign({}, ...heard.filter((p) => Object.keys(p).some((k) => k.includes(db.name))));
}

const holds = (set: RangeSet | undefined, key: unknown) =>
  !!set && rangesOverlap(set, new RangeSet().addKey(key as IndexableType));

describe("what Dexie's live queries are told of a write", () => {
  it('names the same parts and keys for a new outbox row as Dexie does for its own add', async () => {
    const db = new LocalDb('dexie-mutations-test-1');
    dbs.push(db);
    await db.open();
    const added = row(1);
    const dexie = await dexieAnnounces(db, () => db.outbox.add(added));
    const ours = changedParts(db.name, [{ table: db.outbox, value: row(1) }]);
    // The primary key, the deletion marker and each of the outbox's five indexes.
    expect(Object.keys(dexie)).toHaveLength(7);
    expect(Object.keys(ours).sort()).toEqual(Object.keys(dexie).sort());
    for (const part of Object.keys(dexie)) {
      const index = part.split('/').at(-1)!;
      const keyPath = index === '' || index === ':dels' ? ['clientId', 'seq'] : index;
      const key = Dexie.getByKeyPath(added, index.startsWith('[') ? index.slice(1, -1).split('+') : keyPath);
      expect([part, holds(ours[part], key)]).toEqual([part, holds(dexie[part], key)]);
    }
  });

  it('names the same parts as Dexie for a put into a table without indexes (the sequence counter)', async () => {
    const db = new LocalDb('dexie-mutations-test-2');
    dbs.push(db);
    await db.open();
    const dexie = await dexieAnnounces(db, () => db.meta.put({ key: 'nextSeq:x', value: 2 }));
    const ours = changedParts(db.name, [{ table: db.meta, value: { key: 'nextSeq:x', value: 2 } }]);
    expect(Object.keys(ours).sort()).toEqual(Object.keys(dexie).sort());
  });
});
