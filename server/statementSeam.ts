import type { Database } from 'better-sqlite3';
import type { Knex } from 'knex';
import type { Db } from './db';

/**
 * Runs SQL that Knex wrote for this dialect (a builder's `toSQL()`, kept) with new values: the
 * one seam between the hottest statements (rowInserts.ts, compiledQuery.ts) and the driver.
 * On SQLite it goes straight to the connection's prepared statement (statementCache.ts),
 * skipping Knex's work around each query (a query object, its events, the bindings rewritten,
 * several promise turns), which cost more than SQLite's own work for a small indexed read; on any
 * other database it goes through Knex's `raw`, so a PostgreSQL deployment runs the same code.
 * Answers the rows of a read, nothing for a write.
 */
export async function runStatement<Row>(db: Db, sql: string, values: Knex.Value[]): Promise<Row[]> {
  if (db.client.driverName !== 'better-sqlite3') {
    const result = (await db.raw(sql, values)) as Row[] | { rows?: Row[] };
    // PostgreSQL's driver answers with a result holding the rows.
    return Array.isArray(result) ? result : (result.rows ?? []);
  }
  // In a transaction this is the transaction's own connection (Knex hands it out at once).
  const conn = (await db.client.acquireConnection()) as Database;
  try {
    // better-sqlite3 takes no booleans: stored as 1/0, as Knex stores them.
    for (let i = 0; i < values.length; i += 1)
      if (typeof values[i] === 'boolean') values[i] = Number(values[i]);
    const statement = conn.prepare(sql);
    if (statement.reader) return statement.all(values) as Row[];
    statement.run(values);
    return [];
  } finally {
    await db.client.releaseConnection(conn);
  }
}
