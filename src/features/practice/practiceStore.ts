import { NO_ACCOUNT, localDb, type PracticeEndRow, type PracticeSessionRow } from '../../local/db';
import { phoneOwner } from '../../local/phoneOwner';
import type { PracticeArrow } from '../../core/practice';
import type { ProgressSession } from '../../core/practice/progress';
import { progressParts } from '../../core/practice/progressParts';
import { endSetup, nextEndIndex } from './plan';

export type NewPracticeSession = Omit<PracticeSessionRow, 'id' | 'ownerId' | 'startedAt' | 'finishedAt'>;

const endKey = (sessionId: string, index: number) => `${sessionId}:${index}`;

export async function startPracticeSession(session: NewPracticeSession, db = localDb()): Promise<string> {
  const id = crypto.randomUUID();
  const ownerId = phoneOwner() ?? NO_ACCOUNT;
  await db.practiceSessions.add({ ...session, id, ownerId, startedAt: new Date().toISOString() });
  return id;
}

/**
 * The practice of whoever uses the phone now (signed in, or no one), newest first, with its ends.
 * A shared phone shows no one else's: theirs stays on the phone, hidden, until they sign in again.
 */
export async function ownPractice(
  owner: number | undefined,
  db = localDb(),
): Promise<{ sessions: PracticeSessionRow[]; ends: PracticeEndRow[] }> {
  const sessions = (
    await db.practiceSessions
      .where('ownerId')
      .equals(owner ?? NO_ACCOUNT)
      .toArray()
  ).sort((a, b) => b.startedAt.localeCompare(a.startedAt));
  // The whole table in one read, kept to these sessions here: `anyOf` over hundreds of session
  // ids walks a cursor key by key, several times slower (bench/progress.bench.ts).
  const own = new Set(sessions.map((x) => x.id));
  const ends = (await db.practiceEnds.toArray()).filter((e) => own.has(e.sessionId));
  return { sessions, ends };
}

/**
 * What the progress screen needs of whoever uses the phone now: their sessions with progress
 * parts. Ends are read only for sessions stored before the parts were kept.
 */
export async function ownProgress(owner: number | undefined, db = localDb()): Promise<ProgressSession[]> {
  const sessions = await db.practiceSessions
    .where('ownerId')
    .equals(owner ?? NO_ACCOUNT)
    .toArray();
  const older = sessions.filter((s) => !s.progress).map((s) => s.id);
  const ends = older.length === 0 ? [] : await db.practiceEnds.where('sessionId').anyOf(older).toArray();
  return sessions.map((s) => ({
    id: s.id,
    startedAt: s.startedAt,
    bowStyle: s.bowStyle,
    parts: s.progress ?? progressParts(ends.filter((e) => e.sessionId === s.id)),
  }));
}

export async function practiceEnds(sessionId: string, db = localDb()): Promise<PracticeEndRow[]> {
  const ends = await db.practiceEnds.where('sessionId').equals(sessionId).toArray();
  return ends.sort((a, b) => a.index - b.index);
}

/**
 * Stores one arrow in the session's current end (a new end when the last is full) and closes the
 * session when its last planned end fills. Refused (false) when the session is already full.
 */
export function addPracticeArrow(sessionId: string, arrow: PracticeArrow, db = localDb()): Promise<boolean> {
  return db.transaction('rw', db.practiceSessions, db.practiceEnds, async () => {
    // Both reads at once: each round trip inside the transaction delays its commit.
    const [session, ends] = await Promise.all([
      db.practiceSessions.get(sessionId),
      practiceEnds(sessionId, db),
    ]);
    if (!session || session.finishedAt) return false;
    const index = nextEndIndex(session, ends);
    const setup = index === undefined ? undefined : endSetup(session, index);
    if (index === undefined || !setup) return false;
    const existing = ends.find((e) => e.index === index);
    const at = new Date().toISOString();
    const end: PracticeEndRow = existing
      ? { ...existing, arrows: [...existing.arrows, arrow], at }
      : {
          key: endKey(sessionId, index),
          sessionId,
          index,
          distanceM: setup.distanceM,
          faceId: setup.faceId,
          arrows: [arrow],
          at,
        };
    await db.practiceEnds.put(end);
    const now = [...ends.filter((e) => e.index !== index), end].sort((a, b) => a.index - b.index);
    // The session's progress parts change with every arrow; finished when its last end fills.
    await db.practiceSessions.update(sessionId, {
      progress: progressParts(now),
      ...(nextEndIndex(session, now) === undefined ? { finishedAt: at } : {}),
    });
    return true;
  });
}

/** Takes back the last arrow of the session (and reopens it if it was finished). */
export function undoPracticeArrow(sessionId: string, db = localDb()): Promise<void> {
  return db.transaction('rw', db.practiceSessions, db.practiceEnds, async () => {
    const ends = await practiceEnds(sessionId, db);
    const last = ends[ends.length - 1];
    if (!last) return;
    const shorter = { ...last, arrows: last.arrows.slice(0, -1) };
    if (shorter.arrows.length === 0) await db.practiceEnds.delete(last.key);
    else await db.practiceEnds.put(shorter);
    await db.practiceSessions.update(sessionId, {
      finishedAt: undefined,
      progress: progressParts([...ends.slice(0, -1), shorter]),
    });
  });
}

export async function finishPracticeSession(sessionId: string, db = localDb()): Promise<void> {
  await db.practiceSessions.update(sessionId, { finishedAt: new Date().toISOString() });
}

/** What a deletion removed, to put back on Undo. */
export type DeletedPractice = { session: PracticeSessionRow; ends: PracticeEndRow[] };

export function deletePracticeSession(
  sessionId: string,
  db = localDb(),
): Promise<DeletedPractice | undefined> {
  return db.transaction('rw', db.practiceSessions, db.practiceEnds, async () => {
    const session = await db.practiceSessions.get(sessionId);
    if (!session) return undefined;
    const ends = await practiceEnds(sessionId, db);
    await db.practiceEnds.bulkDelete(ends.map((e) => e.key));
    await db.practiceSessions.delete(sessionId);
    return { session, ends };
  });
}

export function restorePracticeSession({ session, ends }: DeletedPractice, db = localDb()): Promise<void> {
  return db.transaction('rw', db.practiceSessions, db.practiceEnds, async () => {
    await db.practiceSessions.put(session);
    await db.practiceEnds.bulkPut(ends);
  });
}
