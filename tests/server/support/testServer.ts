import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import type { LinkAddress } from '../../../src/contract/linkAddress';
import { createApp } from '../../../server/app';
import { migrate, openDb, type Db } from '../../../server/db';
import { startMailCatcher } from '../../../server/mail/mailCatcher';
import { createMailer } from '../../../server/mail/mailer';
import { loadSigningKeys, type SigningKeys } from '../../../server/services/signing/serverKeys';
import { TEST_SECRET } from './people';

export type TestServer = {
  app: Express;
  db: Db;
  dir: string;
  file: string;
  /** The key pair the app signs with (made in the temp folder, as on a first start). */
  signingKeys: SigningKeys;
  close: () => Promise<void>;
};

/** The operator's key to the caught-mail inbox in tests. */
export const TEST_MAIL_INBOX_KEY = 'operator-key-for-tests-only-0123456789';
/** Links in mail and on paper point here in tests (a documentation address, RFC 5737). */
export const TEST_LINK_ADDRESS: LinkAddress = {
  url: 'http://192.0.2.10:3000',
  from: 'network',
  phonesCanOpen: true,
};

/** bcrypt cost for tests only: production uses 12 (asserted in tests/server/auth.test.ts). */
export const TEST_BCRYPT_COST = 4;

/** A fresh, migrated SQLite file in its own temp folder, a mail catcher, and the app built on them. */
export async function startTestServer(
  options: { clientDir?: string; bcryptCost?: number; trustProxy?: boolean | number | string } = {},
): Promise<TestServer> {
  const dir = mkdtempSync(join(tmpdir(), 'ringcall-test-'));
  const file = join(dir, 'test.sqlite');
  const db = openDb(file);
  await migrate(db);
  const catcher = await startMailCatcher(db, 0);
  const signingKeys = await loadSigningKeys(dir);
  const app = createApp({
    db,
    version: 'test',
    secret: TEST_SECRET,
    mailer: createMailer(catcher.smtpUrl, 'Ringcall test <test@ringcall.example>'),
    mailInboxKey: TEST_MAIL_INBOX_KEY,
    dataDir: dir,
    signingKeys,
    linkAddress: TEST_LINK_ADDRESS,
    bcryptCost: options.bcryptCost ?? TEST_BCRYPT_COST,
    logRequests: false,
    ...(options.clientDir ? { clientDir: options.clientDir } : {}),
    ...(options.trustProxy !== undefined ? { trustProxy: options.trustProxy } : {}),
  });
  return {
    app,
    db,
    dir,
    file,
    signingKeys,
    close: async () => {
      await catcher.close();
      await db.destroy();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
