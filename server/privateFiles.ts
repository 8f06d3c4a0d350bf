import { closeSync, mkdirSync, openSync } from 'node:fs';

/**
 * The data folder holds the database, the signing keys and the sign-in secret: what the server
 * creates there is readable by the server's own user only (folders 0700, files 0600).
 */
export function makePrivateDir(dir: string): void {
  mkdirSync(dir, { recursive: true, mode: 0o700 });
}

/** Creates an empty file with mode 0600 unless it exists (SQLite then gives its -wal and -shm the same mode). */
export function makePrivateFile(file: string): void {
  closeSync(openSync(file, 'a', 0o600));
}
