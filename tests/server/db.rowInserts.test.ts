import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Database } from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDb, type Db } from '../../server/db';
import { insertRows } from '../../server/rowInserts';

/* Rows go in with multi-row statements of a few fixed sizes, each prepared once; upserts merge only what they name. */

let dir: string;
let db: Db;
beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'ringcall-rows-'));
  db = openDb(join(dir, 'rows.sqlite'));
  await db.schema.createTable('t', (t) => {
    t.integer('k').primary();
    t.string('name').notNullable();
    t.integer('n').nullable();
    t.string('note').nullable();
  });
});
afterAll(async () => {
  await db.destroy();
  rmSync(dir, { recursive: true, force: true });
});

/** The SQL each statement run during `work` was prepared from (they go straight to the driver: statementSeam.ts). */
const statements = async (work: () => Promise<void>) => {
  const seen: string[] = [];
  const conn = (await db.client.acquireConnection()) as Database;
  await db.client.releaseConnection(conn);
  const prepare = conn.prepare;
  conn.prepare = ((sql: string) => {
    seen.push(sql);
    return prepare.call(conn, sql);
  }) as Database['prepare'];
  try {
    await work();
  } finally {
    conn.prepare = prepare;
  }
  return seen;
};

describe('insertRows', () => {
  it('writes every row, in statements of powers of two, the same SQL for the same size', async () => {
    const rows = Array.from({ length: 300 }, (_, k) => ({ k, name: `row ${k}`, n: k * 2 }));
    const sql = await statements(() => insertRows(db, 't', rows));
    // 300 = 128 + 128 + 32 + 8 + 4
    expect(sql.map((s) => s.split('(?, ?, ?)').length - 1)).toEqual([128, 128, 32, 8, 4]);
    expect(new Set(sql).size).toBe(4);
    const stored = await db('t').orderBy('k').select('k', 'name', 'n', 'note');
    expect(stored).toEqual(rows.map((r) => ({ ...r, note: null })));
  });

  it('merges only the named columns on a conflict, and makes a column a row lacks null', async () => {
    await insertRows(
      db,
      't',
      [
        { k: 1, name: 'renamed', n: 99, note: 'kept' },
        { k: 1000, name: 'new' },
      ],
      { conflict: ['k'], merge: ['n', 'note'] },
    );
    expect(await db('t').whereIn('k', [1, 1000]).orderBy('k').select('k', 'name', 'n', 'note')).toEqual([
      { k: 1, name: 'row 1', n: 99, note: 'kept' },
      { k: 1000, name: 'new', n: null, note: null },
    ]);
  });

  it('merges every column when none is named, and does nothing for no rows', async () => {
    await insertRows(db, 't', [{ k: 2, name: 'two', n: 2, note: 'x' }], { conflict: ['k'] });
    expect(await db('t').where({ k: 2 }).first('name', 'n', 'note')).toEqual({
      name: 'two',
      n: 2,
      note: 'x',
    });
    expect(await statements(() => insertRows(db, 't', []))).toEqual([]);
  });
});
