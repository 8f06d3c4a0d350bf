import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import knex, { type Knex } from 'knex';
import { migrationSource } from './migrationSource';

export type Db = Knex;

/**
 * Opens the SQLite database file (creating its folder) with WAL and foreign keys on.
 * Everything else goes through Knex's builder so a PostgreSQL deployment stays possible.
 */
export function openDb(file: string): Db {
  if (file !== ':memory:') mkdirSync(dirname(file), { recursive: true });
  return knex({
    client: 'better-sqlite3',
    connection: { filename: file },
    useNullAsDefault: true,
    pool: {
      min: 1,
      max: 1,
      afterCreate(
        conn: { pragma: (sql: string) => unknown },
        done: (err: Error | null, conn: unknown) => void,
      ) {
        try {
          // These two pragmas are the only SQLite-specific statements: durability (WAL) and integrity (FKs).
          conn.pragma('journal_mode = WAL');
          conn.pragma('foreign_keys = ON');
          conn.pragma('busy_timeout = 5000');
          done(null, conn);
        } catch (err) {
          done(err as Error, conn);
        }
      },
    },
  });
}

/** Brings the schema up to date; migrations are forward-only. */
export async function migrate(db: Db): Promise<void> {
  await db.migrate.latest({ migrationSource });
}
