import { dirname } from 'node:path';
import type { Database } from 'better-sqlite3';
import knex, { type Knex } from 'knex';
import { migrationSource } from './migrationSource';
import { cacheStatements } from './statementCache';
import { makePrivateDir, makePrivateFile } from './privateFiles';

export type Db = Knex;

/**
 * Opens the SQLite database file (creating it and its folder for the server's user only) with
 * WAL, full sync and foreign keys on.
 * Everything else goes through Knex's builder so a PostgreSQL deployment stays possible.
 */
export function openDb(file: string): Db {
  if (file !== ':memory:') {
    makePrivateDir(dirname(file));
    makePrivateFile(file);
  }
  return knex({
    client: 'better-sqlite3',
    connection: { filename: file },
    useNullAsDefault: true,
    pool: {
      min: 1,
      max: 1,
      afterCreate(conn: Database, done: (err: Error | null, conn: unknown) => void) {
        try {
          // The only SQLite-specific statements: WAL, a disk flush at every commit, foreign keys.
          // FULL is SQLite's own default, but better-sqlite3 builds SQLite to use NORMAL in WAL,
          // where a power cut can take back commits already answered: phones would then have
          // marked as delivered changes the server no longer holds.
          conn.pragma('journal_mode = WAL');
          conn.pragma('synchronous = FULL');
          conn.pragma('foreign_keys = ON');
          conn.pragma('busy_timeout = 5000');
          cacheStatements(conn);
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
