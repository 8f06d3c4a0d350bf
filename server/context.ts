import type { RequestHandler } from 'express';
import type { LinkAddress } from '../src/contract/linkAddress';
import type { Db } from './db';
import type { Mailer } from './mail/mailer';
import type { SigningKeys } from './services/signing/serverKeys';

/** What every route module receives: the database, the signing secret, mail, and settings. */
export type AppContext = {
  db: Db;
  secret: Uint8Array;
  mailer: Mailer;
  bcryptCost: number;
  /** The address links in mail and on paper use, fixed at start (never a request's Host header). */
  linkAddress: LinkAddress;
  /** The operator's key to the mail catcher's inbox; undefined when mail is not caught. */
  mailInboxKey: string | undefined;
  dataDir: string;
  /** The server's key pair for signatures on ends and cards (public half at /.well-known/jwks.json). */
  signingKeys: SigningKeys;
  requireUser: RequestHandler;
};
