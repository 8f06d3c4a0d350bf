import type { RequestHandler } from 'express';
import type { Db } from './db';
import type { Mailer } from './mail/mailer';

/** What every route module receives: the database, the signing secret, mail, and settings. */
export type AppContext = {
  db: Db;
  secret: Uint8Array;
  mailer: Mailer;
  bcryptCost: number;
  publicUrl: string | undefined;
  /** True when mail goes to the app's own catcher (demo, development, tests). */
  mailCaught: boolean;
  dataDir: string;
  requireUser: RequestHandler;
};
