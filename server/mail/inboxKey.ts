import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

/**
 * The operator's key to the caught-mail inbox: MAIL_INBOX_SECRET, or made once in the data folder
 * (readable by the server's user only) and printed at start. No account or event role opens it.
 */
export function loadMailInboxKey(dataDir: string, fromEnv?: string): string {
  if (fromEnv) return fromEnv;
  const file = mailInboxKeyFile(dataDir);
  if (!existsSync(file)) {
    mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 });
  }
  return readFileSync(file, 'utf8').trim();
}

export const mailInboxKeyFile = (dataDir: string): string => join(dataDir, 'mail-inbox-secret');

/** Compares in constant time (hashes first, so the lengths match too). */
export function isMailInboxKey(given: string, key: string): boolean {
  const digest = (s: string) => createHash('sha256').update(s).digest();
  return timingSafeEqual(digest(given), digest(key));
}
