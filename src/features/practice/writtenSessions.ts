import { Dexie } from 'dexie';
import type { PracticeEndRow, PracticeSessionRow } from '../../local/db';

export type SessionRows = { session: PracticeSessionRow; ends: PracticeEndRow[] };

/*
 * A session's rows as this page last wrote them, so the next arrow is written without reading
 * them back first: that read's answer waits behind the frame the tap paints on a busy phone, and
 * the pad's tap writes with no read at all (bench/practice-plot.bench.ts). Forgotten as soon as
 * any other write touches practice (this tab's, another tab's, a sync's: Dexie announces each),
 * and taken while a write is on its way, so a second tap before the first commits reads them.
 */
const written = new Map<string, SessionRows>();
let watching = false;

const keyOf = (dbName: string, sessionId: string) => `${dbName}:${sessionId}`;
const PRACTICE_TABLE = /^idb:\/\/[^/]*\/practice(Sessions|Ends)\//;

/** Remembers what a committed write left stored; call it after the commit (its announcement comes first). */
export function rememberWritten(dbName: string, rows: SessionRows): void {
  if (!watching) {
    watching = true;
    Dexie.on('storagemutated', (parts) => {
      if (Object.keys(parts).some((part) => PRACTICE_TABLE.test(part))) written.clear();
    });
  }
  written.set(keyOf(dbName, rows.session.id), rows);
}

/** The rows last written for the session, if nothing else wrote practice since; forgotten here. */
export function takeWritten(dbName: string, sessionId: string): SessionRows | undefined {
  const key = keyOf(dbName, sessionId);
  const rows = written.get(key);
  written.delete(key);
  return rows;
}
