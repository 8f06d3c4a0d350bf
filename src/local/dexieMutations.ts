import { Dexie, RangeSet, type IndexableType, type Table } from 'dexie';

/**
 * The one place that relies on Dexie's internals: how Dexie tells live queries (in this tab and
 * others) which rows a write touched. A write Dexie did not make itself (writeAtOnce) is
 * announced the same way. `tests/client/dexieMutations.test.ts` compares these parts with the
 * ones Dexie fires for its own write, so a Dexie upgrade that changes them fails there first.
 */
export type AnnouncedWrite = { table: Table; value: object };

/** Dexie's record of what writes touched: `idb://db/table/index` → the keys, '' for primary keys. */
export function changedParts(dbName: string, writes: readonly AnnouncedWrite[]): Record<string, RangeSet> {
  const parts: Record<string, RangeSet> = {};
  const mark = (table: string, index: string, key: unknown) => {
    // A row without a value for an index is not in that index.
    if (key === undefined || (Array.isArray(key) && key.includes(undefined))) return;
    (parts[`idb://${dbName}/${table}/${index}`] ??= new RangeSet()).addKey(key as IndexableType);
  };
  for (const { table, value } of writes) {
    const { primKey, indexes } = table.schema;
    const key: unknown = Dexie.getByKeyPath(value, primKey.keyPath as string | string[]);
    mark(table.name, '', key);
    // As Dexie does for a write whose earlier row it did not read.
    mark(table.name, ':dels', key);
    for (const index of indexes) {
      const indexKey: unknown = Dexie.getByKeyPath(value, index.keyPath as string | string[]);
      if (index.multi && Array.isArray(indexKey)) indexKey.forEach((k) => mark(table.name, index.name, k));
      else mark(table.name, index.name, indexKey);
    }
  }
  return parts;
}

/** Tells live queries of these writes, as Dexie tells them of its own. */
export function announceWrites(db: Dexie, writes: readonly AnnouncedWrite[]): void {
  Dexie.on.storagemutated.fire(changedParts(db.name, writes));
}
