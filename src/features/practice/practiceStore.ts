import { Dexie } from 'dexie';
import {
  NO_ACCOUNT,
  localDb,
  type LocalDb,
  type PracticeEndRow,
  type PracticeSessionRow,
} from '../../local/db';
import { phoneOwner } from '../../local/phoneOwner';
import type { PracticeArrow } from '../../core/practice';
import type { ProgressSession } from '../../core/practice/progress';
import { progressParts, type ProgressPart } from '../../core/practice/progressParts';
import { endSetup, nextEndIndex } from './plan';
import { buildsOnWritten, rememberWritten, takeWritten } from './writtenSessions';
import {
  practiceEndDto,
  practiceSender,
  practiceSessionDto,
  sendPractice,
  wholeSession,
} from '../../local/practiceSync';

export type NewPracticeSession = Omit<PracticeSessionRow, 'id' | 'ownerId' | 'startedAt' | 'finishedAt'>;

const endKey = (sessionId: string, index: number) => `${sessionId}:${index}`;

/*
 * Each write below also records, in its own transaction, the outbox rows that send it to the
 * account of the person using the phone (src/local/practiceSync.ts); with no one signed in it
 * stays on the phone until someone signs in and adopts it (forgetOthers).
 */
const practiceTables = (db: LocalDb) => [db.practiceSessions, db.practiceEnds, db.outbox, db.meta];

export async function startPracticeSession(session: NewPracticeSession, db = localDb()): Promise<string> {
  const id = crypto.randomUUID();
  const ownerId = phoneOwner() ?? NO_ACCOUNT;
  const sender = await practiceSender(db, ownerId);
  const row: PracticeSessionRow = { ...session, id, ownerId, startedAt: new Date().toISOString() };
  await db.transaction('rw', practiceTables(db), async () => {
    await db.practiceSessions.add(row);
    await sendPractice(db, sender, ownerId, [{ kind: 'practice.session', args: practiceSessionDto(row) }]);
  });
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
 * The sessions of whoever uses the phone now, each with its progress parts (arrows and points
 * per distance and face): what the log's list and progress show, without reading 20,000 arrows
 * for a year of practice. Ends are read only for sessions stored before the parts were kept.
 */
export async function ownSessionParts(
  owner: number | undefined,
  db = localDb(),
): Promise<{ session: PracticeSessionRow; parts: ProgressPart[] }[]> {
  const sessions = await db.practiceSessions
    .where('ownerId')
    .equals(owner ?? NO_ACCOUNT)
    .toArray();
  const older = sessions.filter((s) => !s.progress).map((s) => s.id);
  const ends = older.length === 0 ? [] : await db.practiceEnds.where('sessionId').anyOf(older).toArray();
  return sessions.map((session) => ({
    session,
    parts: session.progress ?? progressParts(ends.filter((e) => e.sessionId === session.id)),
  }));
}

/** What the progress screen needs of the sessions ownSessionParts read: their parts. */
export const progressSessions = (
  own: readonly { session: PracticeSessionRow; parts: ProgressPart[] }[],
): ProgressSession[] =>
  own.map(({ session, parts }) => ({
    id: session.id,
    startedAt: session.startedAt,
    bowStyle: session.bowStyle,
    parts,
  }));

export async function practiceEnds(sessionId: string, db = localDb()): Promise<PracticeEndRow[]> {
  const ends = await db.practiceEnds.where('sessionId').equals(sessionId).toArray();
  return ends.sort((a, b) => a.index - b.index);
}

/** Commits the current Dexie transaction once its last request is asked for (IndexedDB's commit()). */
function commitNow(): void {
  try {
    Dexie.currentTransaction?.idbtrans.commit();
  } catch {
    // Already committing, or a browser without commit(): it commits when its requests are done.
  }
}

/**
 * Stores one arrow in the session's current end (a new end when the last is full) and closes the
 * session when its last planned end fills. Refused (false) when the session is already full.
 */
export async function addPracticeArrow(
  sessionId: string,
  arrow: PracticeArrow,
  db = localDb(),
): Promise<boolean> {
  const sender = await practiceSender(db, phoneOwner());
  const known = takeWritten(db.name, sessionId);
  const stored = await db.transaction('rw', practiceTables(db), async () => {
    const writes = db.practiceWrites;
    // Both reads at once, when this page did not write them last: each round trip inside the
    // transaction delays its commit.
    const [session, ends] = buildsOnWritten(db, known)
      ? [known.session, known.ends]
      : await Promise.all([db.practiceSessions.get(sessionId), practiceEnds(sessionId, db)]);
    if (!session || session.finishedAt) return undefined;
    const index = nextEndIndex(session, ends);
    const setup = index === undefined ? undefined : endSetup(session, index);
    if (index === undefined || !setup) return undefined;
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
    const now = [...ends.filter((e) => e.index !== index), end].sort((a, b) => a.index - b.index);
    // The session's progress parts change with every arrow; finished when its last end fills.
    const finished = nextEndIndex(session, now) === undefined;
    const closed = finished ? { ...session, finishedAt: at } : session;
    const row = { ...closed, progress: progressParts(now) };
    // Every write asked for at once, the session whole (an update reads it again first).
    const asked = Promise.all([db.practiceEnds.put(end), db.practiceSessions.put(row)]);
    await sendPractice(db, sender, session.ownerId, [
      { kind: 'practice.end', args: practiceEndDto(end) },
      ...(finished ? [{ kind: 'practice.session' as const, args: practiceSessionDto(closed) }] : []),
    ]);
    // Nothing more to write: committed now, without waiting for the writes' answers to come back
    // to the page first (on a busy phone they queue behind the frame the tap paints).
    commitNow();
    await asked;
    return { session: row, ends: now, writes };
  });
  if (stored) rememberWritten(db.name, stored);
  return stored !== undefined;
}

/** Takes back the last arrow of the session (and reopens it if it was finished). */
export async function undoPracticeArrow(sessionId: string, db = localDb()): Promise<void> {
  const sender = await practiceSender(db, phoneOwner());
  return db.transaction('rw', practiceTables(db), async () => {
    const [session, ends] = await Promise.all([
      db.practiceSessions.get(sessionId),
      practiceEnds(sessionId, db),
    ]);
    const last = ends[ends.length - 1];
    if (!session || !last) return;
    const shorter = { ...last, arrows: last.arrows.slice(0, -1) };
    if (shorter.arrows.length === 0) await db.practiceEnds.delete(last.key);
    else await db.practiceEnds.put(shorter);
    await db.practiceSessions.update(sessionId, {
      finishedAt: undefined,
      progress: progressParts([...ends.slice(0, -1), shorter]),
    });
    // An end with no arrows left tells the server to drop it.
    await sendPractice(db, sender, session.ownerId, [
      { kind: 'practice.end', args: practiceEndDto(shorter) },
      ...(session.finishedAt
        ? [
            {
              kind: 'practice.session' as const,
              args: practiceSessionDto({ ...session, finishedAt: undefined }),
            },
          ]
        : []),
    ]);
  });
}

export async function finishPracticeSession(sessionId: string, db = localDb()): Promise<void> {
  const sender = await practiceSender(db, phoneOwner());
  await db.transaction('rw', practiceTables(db), async () => {
    const session = await db.practiceSessions.get(sessionId);
    if (!session) return;
    const finished = { ...session, finishedAt: new Date().toISOString() };
    await db.practiceSessions.put(finished);
    await sendPractice(db, sender, session.ownerId, [
      { kind: 'practice.session', args: practiceSessionDto(finished) },
    ]);
  });
}

/** What a deletion removed, to put back on Undo. */
export type DeletedPractice = { session: PracticeSessionRow; ends: PracticeEndRow[] };

export async function deletePracticeSession(
  sessionId: string,
  db = localDb(),
): Promise<DeletedPractice | undefined> {
  const sender = await practiceSender(db, phoneOwner());
  return db.transaction('rw', practiceTables(db), async () => {
    const session = await db.practiceSessions.get(sessionId);
    if (!session) return undefined;
    const ends = await practiceEnds(sessionId, db);
    await db.practiceEnds.bulkDelete(ends.map((e) => e.key));
    await db.practiceSessions.delete(sessionId);
    await sendPractice(db, sender, session.ownerId, [{ kind: 'practice.delete', args: { sessionId } }]);
    return { session, ends };
  });
}

/** Undo of a deletion: the same rows back, and sent whole again (the server has let them go). */
export async function restorePracticeSession(
  { session, ends }: DeletedPractice,
  db = localDb(),
): Promise<void> {
  const sender = await practiceSender(db, phoneOwner());
  return db.transaction('rw', practiceTables(db), async () => {
    await db.practiceSessions.put(session);
    await db.practiceEnds.bulkPut(ends);
    await sendPractice(db, sender, session.ownerId, wholeSession(session, ends));
  });
}
