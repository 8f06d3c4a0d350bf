import type { Database, Statement } from 'better-sqlite3';

/** Enough for every query shape the app runs; `whereIn` lists of other lengths push the oldest out. */
const DEFAULT_SIZE = 500;

// Knex names each nested transaction's savepoint uniquely: keeping those would only push out useful statements.
const savepoint = /^\s*(savepoint|release|rollback)\b/i;

/**
 * Makes `conn.prepare` reuse the statement prepared earlier for the same SQL (least recently
 * used ones go first). Knex's better-sqlite3 dialect prepares every query it runs, and
 * preparing costs about as much as running a small insert. Reuse is safe: better-sqlite3 runs
 * a statement to completion synchronously (`run`/`all`), so no two queries share one at once,
 * and SQLite prepares a statement again by itself after a schema change. (Knex's per-query
 * `safeIntegers` option would stick to a shared statement; the app does not use it.)
 */
export function cacheStatements(conn: Database, size = DEFAULT_SIZE): void {
  const prepare = conn.prepare.bind(conn);
  const statements = new Map<string, Statement>();
  conn.prepare = ((sql: string) => {
    const cached = statements.get(sql);
    if (cached) {
      statements.delete(sql);
      statements.set(sql, cached);
      return cached;
    }
    const statement = prepare(sql);
    if (savepoint.test(sql)) return statement;
    statements.set(sql, statement);
    if (statements.size > size) statements.delete(statements.keys().next().value!);
    return statement;
  }) as Database['prepare'];
}
