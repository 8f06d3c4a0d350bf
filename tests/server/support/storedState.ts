import { createHash } from 'node:crypto';
import type { Db } from '../../../server/db';

/**
 * A digest of every table's rows, per table, to tell whether a request changed anything stored.
 * Tests run on SQLite, whose catalog lists the tables.
 */
export async function storedState(db: Db): Promise<Record<string, string>> {
  const tables: string[] = await db('sqlite_master')
    .where({ type: 'table' })
    .whereNot('name', 'like', 'sqlite_%')
    .orderBy('name')
    .pluck('name');
  const state: Record<string, string> = {};
  for (const table of tables) {
    const rows = await db(table).select();
    state[table] = createHash('sha256').update(JSON.stringify(rows)).digest('hex');
  }
  return state;
}

/** The tables whose rows differ between two digests. */
export const changedTables = (before: Record<string, string>, after: Record<string, string>): string[] =>
  Object.keys({ ...before, ...after }).filter((t) => before[t] !== after[t]);
