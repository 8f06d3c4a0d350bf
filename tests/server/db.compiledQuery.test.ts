import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDb, type Db } from '../../server/db';
import { compiledQuery } from '../../server/compiledQuery';

/* A numeric query compiled once runs with each call's own values, each in its own place. */

let dir: string;
let db: Db;
beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'ringcall-compiled-'));
  db = openDb(join(dir, 'compiled.sqlite'));
  await db.schema.createTable('t', (t) => {
    t.integer('a').notNullable();
    t.integer('b').notNullable();
  });
  await db('t').insert(Array.from({ length: 20 }, (_, i) => ({ a: i % 4, b: i })));
});
afterAll(async () => {
  await db.destroy();
  rmSync(dir, { recursive: true, force: true });
});

// The values are named out of the order Knex binds them in (limit last), so a mix-up shows.
const rows = compiledQuery<{ b: number }>(3, (q, [limit, a, above]) =>
  q('t').where('b', '>', above!).where({ a: a! }).orderBy('b').limit(limit!).select('b'),
);

describe('compiledQuery', () => {
  it('runs with each call’s values, in the places the builder put them', async () => {
    expect(await rows(db, [2, 1, 0])).toEqual([{ b: 1 }, { b: 5 }]);
    expect(await rows(db, [3, 3, 10])).toEqual([{ b: 11 }, { b: 15 }, { b: 19 }]);
    expect(await rows(db, [1, 0, 100])).toEqual([]);
  });

  it('refuses a build that does not bind every value', async () => {
    const inlined = compiledQuery(2, (q, [a]) => q('t').where({ a: a! }).select('b'));
    await expect(inlined(db, [1, 2])).rejects.toThrow('Each value must be bound once');
  });
});
