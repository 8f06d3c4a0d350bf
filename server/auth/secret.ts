import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { makePrivateDir } from '../privateFiles';
import { randomBytes } from 'node:crypto';

/**
 * The secret that signs access tokens: from AUTH_SECRET, or created once in the data folder
 * so restarts keep phones signed in.
 */
export function loadAuthSecret(dataDir: string, fromEnv?: string): Uint8Array {
  if (fromEnv) {
    if (fromEnv.length < 32) throw new Error('AUTH_SECRET must be at least 32 characters.');
    return new TextEncoder().encode(fromEnv);
  }
  const file = join(dataDir, 'auth-secret');
  if (!existsSync(file)) {
    makePrivateDir(dataDir);
    writeFileSync(file, randomBytes(48).toString('base64url'), { mode: 0o600 });
  }
  return new TextEncoder().encode(readFileSync(file, 'utf8').trim());
}
