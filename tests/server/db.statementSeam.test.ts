import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDb, type Db } from '../../server/db';
import { runStatement } from '../../server/statementSeam';

/* Knex's SQL run straight on the driver: reads answer rows, writes nothing, in the caller's transaction. */

let dir: string;
let db: Db;
beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'ringcall-seam-'));
  db = openDb(join(dir, 'seam.sqlite'));
  await db.schema.createTable('t', (t) => {
    t.integer('k').primary();
    t.boolean('flag').notNullable();
  });
});
afterAll(async () => {
  await db.destroy();
  rmSync(dir, { recursive: true, force: true });
});

// Knex puts the columns in the order of their names: flag, then k.
const insert = (on: Db) => on('t').insert({ k: 0, flag: false }).toSQL().sql;

describe('runStatement', () => {
  it('writes (booleans as 1/0, as Knex stores them) and reads back the rows', async () => {
    const sql = insert(db);
    expect(await runStatement(db, sql, [true, 1])).toEqual([]);
    expect(await runStatement(db, sql, [false, 2])).toEqual([]);
    const read = db('t').where('k', '>', 0).orderBy('k').select('k', 'flag').toSQL();
    expect(await runStatement(db, read.sql, [0])).toEqual([
      { k: 1, flag: 1 },
      { k: 2, flag: 0 },
    ]);
  });

  it('runs in the transaction it is given: undone with it', async () => {
    await expect(
      db.transaction(async (trx) => {
        await runStatement(trx, insert(trx), [true, 3]);
        expect(await trx('t').where({ k: 3 }).first()).toBeDefined();
        throw new Error('undo');
      }),
    ).rejects.toThrow('undo');
    expect(await db('t').where({ k: 3 }).first()).toBeUndefined();
  });
});
