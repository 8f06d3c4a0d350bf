import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import { createApp } from '../../../server/app';
import { migrate, openDb, type Db } from '../../../server/db';

export type TestServer = { app: Express; db: Db; dir: string; file: string; close: () => Promise<void> };

/** A fresh, migrated SQLite file in its own temp folder, and the app built on it. */
export async function startTestServer(options: { clientDir?: string } = {}): Promise<TestServer> {
  const dir = mkdtempSync(join(tmpdir(), 'ringcall-test-'));
  const file = join(dir, 'test.sqlite');
  const db = openDb(file);
  await migrate(db);
  const app = createApp({ db, version: 'test', logRequests: false, ...(options.clientDir ? { clientDir: options.clientDir } : {}) });
  return {
    app,
    db,
    dir,
    file,
    close: async () => {
      await db.destroy();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
