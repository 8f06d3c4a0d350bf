import type { Dexie, Table } from 'dexie';
import { afterNextPaint } from './afterPaint';
import { announceWrites } from './dexieMutations';

export type QuickWrite = { table: Table; type: 'add' | 'put'; value: object };

/**
 * Writes rows in one IndexedDB transaction that is told to commit as soon as its writes are done.
 * Dexie's transactions commit only after each result has come back to the page, and on a busy
 * phone that return trip waits behind the frame the tap itself paints. Live queries are then told
 * of the change the way Dexie tells them of its own writes (dexieMutations.ts), so screens and
 * other tabs refresh: after the next paint, so their re-reads never hold up the tap's own frame.
 *
 * A failed write (an `add` whose key exists: ConstraintError) undoes the whole transaction.
 * The database must be opened with Dexie's live-query cache off (`cache: 'disabled'`, see LocalDb):
 * that cache is kept up to date by Dexie's own writes only, and would answer with stale rows.
 */
export function writeAtOnce(db: Dexie, writes: QuickWrite[]): Promise<void> {
  for (const w of writes) {
    // Only new index values are announced below; a put that moves a row between index values would not be.
    if (w.type === 'put' && w.table.schema.indexes.length > 0) {
      throw new Error(`writeAtOnce puts only into tables without indexes, not ${w.table.name}.`);
    }
  }
  // Open already on every tap after the first: the transaction then starts within the tap's own task.
  if (!db.isOpen()) return db.open().then(() => writeAtOnce(db, writes));
  const tx = db.backendDB().transaction(
    writes.map((w) => w.table.name),
    'readwrite',
  );
  const done = new Promise<void>((resolve, reject) => {
    tx.oncomplete = () => resolve();
    tx.onabort = () => reject(tx.error ?? new DOMException('The change was not stored.', 'AbortError'));
  });
  try {
    for (const w of writes) {
      const request = tx.objectStore(w.table.name)[w.type](w.value);
      // Not prevented, so the transaction aborts; the error is reported once, by `done`.
      request.onerror = (event) => event.stopPropagation();
    }
  } catch (error) {
    // A value the store refuses outright (a key it cannot read, storage refused): write nothing.
    done.catch(() => undefined);
    tx.abort();
    return Promise.reject(error instanceof Error ? error : new Error(String(error)));
  }
  tx.commit();
  return done.then(() => {
    // The caller learns of the commit first; the screens' refresh follows the next frame.
    afterNextPaint(() => announceWrites(db, writes));
  });
}
