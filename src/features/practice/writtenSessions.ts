import { Dexie } from 'dexie';
import type { LocalDb, PracticeEndRow, PracticeSessionRow } from '../../local/db';

export type SessionRows = { session: PracticeSessionRow; ends: PracticeEndRow[] };
/** Rows a write left stored, with the page's practice write count as that write's transaction opened. */
export type WrittenRows = SessionRows & { writes: number };

/*
 * A session's rows as this page last wrote them, so the next arrow is written without reading
 * them back first: that read's answer waits behind the frame the tap paints on a busy phone, and
 * the pad's tap writes with no read at all (bench/practice-plot.bench.ts). They hold only if no
 * other practice write came between: forgotten when any write is announced (this tab's, another
 * tab's, a sync's), and used only by a write whose own transaction is the next one this page
 * opened over practice (buildsOnWritten), since a tap typed while another is still on its way
 * must build on that one.
 */
const written = new Map<string, WrittenRows>();
let watching = false;

const keyOf = (dbName: string, sessionId: string) => `${dbName}:${sessionId}`;
const PRACTICE_TABLE = /^idb:\/\/[^/]*\/practice(Sessions|Ends)\//;

/** Remembers what a committed write left stored; call it after the commit (its announcement comes first). */
export function rememberWritten(dbName: string, rows: WrittenRows): void {
  if (!watching) {
    watching = true;
    Dexie.on('storagemutated', (parts) => {
      if (Object.keys(parts).some((part) => PRACTICE_TABLE.test(part))) written.clear();
    });
  }
  written.set(keyOf(dbName, rows.session.id), rows);
}

/** The rows last written for the session, if nothing else wrote practice since; forgotten here. */
export function takeWritten(dbName: string, sessionId: string): WrittenRows | undefined {
  const key = keyOf(dbName, sessionId);
  const rows = written.get(key);
  written.delete(key);
  return rows;
}

/** Inside a write's transaction: whether `known` is still what is stored (no other write opened since). */
export const buildsOnWritten = (db: LocalDb, known: WrittenRows | undefined): known is WrittenRows =>
  known !== undefined && db.practiceWrites === known.writes + 1;
