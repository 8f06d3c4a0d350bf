import type { Knex } from 'knex';
import type { Db } from './db';
import { runStatement } from './statementSeam';

/** Values no real query here uses, so the compiled bindings show which value goes where. */
const MARK = 1_000_000_007;

/**
 * A query whose values are all numbers, built with Knex's builder once per dialect and then run
 * with new values (statementSeam.ts): building and compiling a query costs more than SQLite takes to
 * answer a small indexed read, and the hottest reads (a pull's pages) run once per push.
 * `build` gets stand-in values and must use each of them as a binding (never inlined).
 */
export function compiledQuery<Row>(
  arity: number,
  build: (db: Db, values: number[]) => Knex.QueryBuilder,
): (db: Db, values: number[]) => Promise<Row[]> {
  const compiled = new Map<string, { sql: string; order: number[] }>();
  return async (db, values) => {
    const dialect = String(db.client.dialect);
    let query = compiled.get(dialect);
    if (!query) {
      const marks = Array.from({ length: arity }, (_, i) => MARK + i);
      const { sql, bindings } = build(db, marks).toSQL();
      const order = (bindings as unknown[]).map((b) => Number(b) - MARK);
      if (order.some((i) => !(i >= 0 && i < arity)) || new Set(order).size !== arity)
        throw new Error(`Each value must be bound once in: ${sql}`);
      query = { sql, order };
      compiled.set(dialect, query);
    }
    return runStatement<Row>(
      db,
      query.sql,
      query.order.map((i) => values[i]!),
    );
  };
}
