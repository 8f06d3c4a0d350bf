import type { RequestHandler } from 'express';
import type { Db } from './db';
import type { Mailer } from './mail/mailer';
import type { SigningKeys } from './signing/serverKeys';

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
  /** The server's key pair for signatures on ends and cards (public half at /.well-known/jwks.json). */
  signingKeys: SigningKeys;
  requireUser: RequestHandler;
};
