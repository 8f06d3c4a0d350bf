import Database from 'better-sqlite3';
import { describe, expect, it } from 'vitest';
import { cacheStatements } from '../../server/statementCache';

/* Knex prepares every query; the connection hands back the statement prepared before for the same SQL. */

function connection(size?: number) {
  const conn = new Database(':memory:');
  cacheStatements(conn, size);
  conn.exec('create table t (x integer)');
  return conn;
}

describe('statement cache', () => {
  it('returns the statement prepared earlier for the same SQL, and it runs again and again', () => {
    const conn = connection();
    const insert = conn.prepare('insert into t (x) values (?)');
    expect(conn.prepare('insert into t (x) values (?)')).toBe(insert);
    for (let x = 0; x < 3; x += 1) conn.prepare('insert into t (x) values (?)').run(x);
    expect(conn.prepare('select count(*) as n from t').get()).toEqual({ n: 3 });
  });

  it('forgets the least recently used statement when full', () => {
    const conn = connection(2);
    const a = conn.prepare('select 1');
    const b = conn.prepare('select 2');
    conn.prepare('select 1'); // a is now the most recent
    conn.prepare('select 3'); // b goes
    expect(conn.prepare('select 1')).toBe(a);
    expect(conn.prepare('select 2')).not.toBe(b);
  });

  it('does not keep savepoints, which Knex names anew for each nested transaction', () => {
    const conn = connection();
    conn.prepare('begin').run();
    const savepoint = conn.prepare('SAVEPOINT trx1;');
    expect(conn.prepare('SAVEPOINT trx1;')).not.toBe(savepoint);
    conn.prepare('rollback').run();
  });

  it('keeps working after the schema changes under a kept statement', () => {
    const conn = connection();
    conn.prepare('insert into t (x) values (?)').run(1);
    expect(conn.prepare('select * from t order by x').all()).toEqual([{ x: 1 }]);
    conn.exec('alter table t add column y integer');
    conn.prepare('insert into t (x) values (?)').run(2);
    expect(conn.prepare('select * from t order by x').all()).toEqual([
      { x: 1, y: null },
      { x: 2, y: null },
    ]);
  });
});
