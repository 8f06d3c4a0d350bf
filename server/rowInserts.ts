import type { Knex } from 'knex';
import type { Db } from './db';
import { runStatement } from './statementSeam';

/** The most rows one statement takes (a power of two; 128 rows of a dozen columns stay far under SQLite's 32,766 bindings). */
const MAX_ROWS = 128;

/** `on conflict (conflict) do update` of the `merge` columns (every inserted column when left out). */
export type Upsert = { conflict: string[]; merge?: string[] };

type Template = { head: string; tuple: string; tail: string; columns: string[]; sqlOf: Map<number, string> };
const templates = new Map<string, Template>();

/**
 * Knex's own SQL for one row, split around its `values (…)`: the columns in the order Knex put
 * them, so any number of rows can follow in the same statement. Identifier quoting, the
 * conflict clause and the placeholders are Knex's, so the statement stays the dialect's own.
 */
function templateOf(db: Db, table: string, columns: string[], upsert: Upsert | undefined): Template {
  const key = `${db.client.dialect}\n${table}\n${columns.join(',')}\n${JSON.stringify(upsert ?? null)}`;
  let template = templates.get(key);
  if (!template) {
    // Each column's value is its own index, so the bindings tell the columns' order in the SQL.
    const builder = db(table).insert(Object.fromEntries(columns.map((c, i) => [c, i])));
    const { sql, bindings } = (
      upsert
        ? upsert.merge
          ? builder.onConflict(upsert.conflict).merge(upsert.merge)
          : builder.onConflict(upsert.conflict).merge()
        : builder
    ).toSQL();
    const values = /\bvalues\s*(\((?:\?\s*,\s*)*\?\))/i.exec(sql);
    if (!values) throw new Error(`Cannot find the values of: ${sql}`);
    template = {
      head: sql.slice(0, values.index) + 'values ',
      tuple: values[1]!,
      tail: sql.slice(values.index + values[0].length),
      columns: (bindings as number[]).slice(0, columns.length).map((i) => columns[i]!),
      sqlOf: new Map(),
    };
    templates.set(key, template);
  }
  return template;
}

/**
 * Inserts rows (an upsert with `upsert`) with multi-row `insert … values (…), (…)` statements of
 * a few fixed sizes, powers of two up to MAX_ROWS, so each statement is prepared once and then
 * reused (server/statementCache.ts). Knex's builder writes a multi-row insert for SQLite as a
 * compound `select … union all select …`, which costs more to prepare than to run, and every new
 * number of rows is a new statement to prepare. A column a row lacks is null, as with Knex. Run
 * through statementSeam.ts.
 */
export async function insertRows(
  db: Db,
  table: string,
  rows: readonly object[],
  upsert?: Upsert,
): Promise<void> {
  if (rows.length === 0) return;
  const columns = [...new Set(rows.flatMap((row) => Object.keys(row)))].sort();
  const template = templateOf(db, table, columns, upsert);
  const { columns: order, sqlOf } = template;
  for (let at = 0; at < rows.length;) {
    let size = MAX_ROWS;
    while (size > rows.length - at) size /= 2;
    let sql = sqlOf.get(size);
    if (sql === undefined) {
      sql = template.head + Array(size).fill(template.tuple).join(', ') + template.tail;
      sqlOf.set(size, sql);
    }
    const values: Knex.Value[] = [];
    for (let r = at; r < at + size; r += 1) {
      const row = rows[r] as Record<string, Knex.Value>;
      for (const column of order) values.push(row[column] ?? null);
    }
    await runStatement(db, sql, values);
    at += size;
  }
}
