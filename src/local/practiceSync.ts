import { Dexie } from 'dexie';
import type { PracticeEndDto, PracticeSessionDto, PulledPracticeSession } from '../contract/practice';
import type { ChangeDto } from '../contract/sync';
import { isPracticeChange } from '../contract/practiceChange';
import { progressParts } from '../core/practice/progressParts';
import { NO_ACCOUNT, type LocalDb, type PracticeEndRow, type PracticeSessionRow } from './db';
import { clientIdFor, recordChangesInTransaction, type NewChange } from './outbox';

/*
 * The practice log synced to the person's account (docs/practice.md): each write on the phone
 * records its outbox rows in the same transaction, the setup and each end replacing the one
 * before, so sending one again changes nothing; pulled practice lands in the same tables.
 */

/** The session as the server keeps it: everything but the phone's owner, progress parts and the server's note. */
export function practiceSessionDto(session: PracticeSessionRow): PracticeSessionDto {
  const { ownerId: _owner, progress: _progress, revivedAt: _revived, ...dto } = session;
  return dto;
}

export const practiceEndDto = ({
  sessionId,
  index,
  distanceM,
  faceId,
  arrows,
  at,
}: PracticeEndRow): PracticeEndDto => ({
  sessionId,
  index,
  distanceM,
  faceId,
  arrows,
  at,
});

/** Everything of a session, to send it whole (adopted on sign-in, or put back on Undo). */
export const wholeSession = (session: PracticeSessionRow, ends: readonly PracticeEndRow[]): NewChange[] => [
  { kind: 'practice.session', args: practiceSessionDto(session) },
  ...ends.map((e): NewChange => ({ kind: 'practice.end', args: practiceEndDto(e) })),
];

/** Everything of several sessions, read from the phone (inside the caller's transaction), ends in order. */
export async function wholeSessions(
  db: LocalDb,
  sessions: readonly PracticeSessionRow[],
): Promise<NewChange[]> {
  const ends = await db.practiceEnds
    .where('sessionId')
    .anyOf(sessions.map((s) => s.id))
    .toArray();
  ends.sort((a, b) => a.index - b.index);
  return sessions.flatMap((s) =>
    wholeSession(
      s,
      ends.filter((e) => e.sessionId === s.id),
    ),
  );
}

/**
 * Who a practice write on this phone is sent for, found before its transaction opens (finding a
 * client id may write): the person using the phone, or no one (practice with no account waits
 * on the phone until someone signs in and adopts it).
 */
export async function practiceSender(
  db: LocalDb,
  owner: number | undefined,
): Promise<{ userId: number; clientId: string } | undefined> {
  if (owner === undefined || owner === NO_ACCOUNT) return undefined;
  return { userId: owner, clientId: await clientIdFor(db, owner) };
}

/**
 * Records the outbox rows of a practice write in its transaction, when the session is the
 * sender's; once that transaction commits, the sync loop sends them after a pause (as after a
 * tap on the pad).
 */
export async function sendPractice(
  db: LocalDb,
  sender: { userId: number; clientId: string } | undefined,
  ownerId: number,
  changes: readonly NewChange[],
): Promise<void> {
  if (!sender || sender.userId !== ownerId) return;
  await recordChangesInTransaction(db, sender.clientId, ownerId, changes);
  // Imported when needed: the sync loop imports this module through the sync engine.
  Dexie.currentTransaction?.on('complete', () => {
    import('./syncLoop').then((m) => m.syncLoop().afterChange()).catch(() => undefined);
  });
}

/** The session a practice outbox row is about (its key is practice:<session>[:<end>]). */
const sessionOfKey = (endKey: string) => endKey.split(':')[1] ?? '';

/** People whose older practice this page has seen to (see sendOlderPractice). */
const olderPracticeSent = new Set<string>();

/**
 * Practice a person kept on this phone before practice synced (an older version of the app
 * recorded no outbox rows for it) is sent whole, once per phone and person (`meta` remembers it):
 * every session of theirs that no outbox row is about.
 */
export async function sendOlderPractice(db: LocalDb, userId: number, clientId: string): Promise<void> {
  const key = `practiceSent:${userId}`;
  if (olderPracticeSent.has(`${db.name}:${key}`)) return;
  await db.transaction('rw', [db.meta, db.practiceSessions, db.practiceEnds, db.outbox], async () => {
    if (await db.meta.get(key)) return;
    const [sessions, rows] = await Promise.all([
      db.practiceSessions.where('ownerId').equals(userId).toArray(),
      db.outbox.where('endKey').startsWith('practice:').toArray(),
    ]);
    const sent = new Set(rows.map((r) => sessionOfKey(r.endKey)));
    const older = sessions.filter((s) => !sent.has(s.id));
    await recordChangesInTransaction(db, clientId, userId, await wholeSessions(db, older));
    await db.meta.put({ key, value: new Date().toISOString() });
  });
  olderPracticeSent.add(`${db.name}:${key}`);
}

/**
 * Stores the practice of a pull (inside the sync's transaction, over practiceSessions,
 * practiceEnds and outbox): setups and ends replace the phone's copies, an end with no arrows and
 * a deleted session go, and each touched session's progress parts are worked out again. A
 * session with changes of this phone still waiting keeps the phone's own state: the next round
 * sends them, and its pull brings the server's state back after them.
 */
export async function applyPulledPractice(
  db: LocalDb,
  userId: number,
  changes: readonly ChangeDto[],
): Promise<void> {
  const practice = changes.filter(isPracticeChange);
  if (practice.length === 0) return;
  const waiting = new Set(
    (
      await db.outbox
        .where('endKey')
        .startsWith('practice:')
        .filter((r) => r.status === 'pending' && r.userId === userId)
        .toArray()
    ).map((r) => sessionOfKey(r.endKey)),
  );
  const sessions = new Map<string, PulledPracticeSession>();
  const ends = new Map<string, PracticeEndDto>();
  /** Sessions deleted on the server: whatever this phone holds of them goes first. */
  const wiped = new Set<string>();
  for (const change of practice) {
    const id = change.type === 'practice' ? change.record.id : change.record.sessionId;
    if (waiting.has(id)) continue;
    if (change.type === 'practice') sessions.set(id, change.record);
    else if (change.type === 'practice-end') ends.set(`${id}:${change.record.index}`, change.record);
    else {
      wiped.add(id);
      sessions.delete(id);
      for (const [key, end] of ends) if (end.sessionId === id) ends.delete(key);
    }
  }
  if (wiped.size > 0) {
    await db.practiceEnds
      .where('sessionId')
      .anyOf([...wiped])
      .delete();
    await db.practiceSessions.bulkDelete([...wiped]);
  }
  const [kept, taken] = [
    [...ends].filter(([, e]) => e.arrows.length > 0),
    [...ends].filter(([, e]) => e.arrows.length === 0),
  ];
  await db.practiceEnds.bulkDelete(taken.map(([key]) => key));
  await db.practiceEnds.bulkPut(kept.map(([key, e]): PracticeEndRow => ({ key, ...e })));

  const touched = [...new Set([...sessions.keys(), ...[...ends.values()].map((e) => e.sessionId)])];
  const [stored, allEnds] = await Promise.all([
    db.practiceSessions.bulkGet(touched),
    db.practiceEnds.where('sessionId').anyOf(touched).toArray(),
  ]);
  const rows = touched.flatMap((id, i): PracticeSessionRow[] => {
    const setup = sessions.get(id) ?? stored[i];
    if (!setup) return []; // an end whose setup comes in a later pull
    const own = allEnds.filter((e) => e.sessionId === id).sort((a, b) => a.index - b.index);
    const { revivedAt } = setup;
    return [
      {
        ...practiceSessionDto({ ownerId: userId, ...setup }),
        ownerId: userId,
        progress: progressParts(own),
        // Brought back after a deletion (a change from a phone that had not heard of it): the log says so.
        ...(revivedAt ? { revivedAt } : {}),
      },
    ];
  });
  await db.practiceSessions.bulkPut(rows);
}

/** Why the account refused practice changes of this person (each reason once), for the practice log. */
export async function refusedPractice(db: LocalDb, owner: number | undefined): Promise<string[]> {
  if (owner === undefined || owner === NO_ACCOUNT) return [];
  const rows = await db.outbox
    .where('endKey')
    .startsWith('practice:')
    .filter((r) => r.userId === owner && r.status === 'rejected')
    .toArray();
  return [...new Set(rows.map((r) => r.reason ?? 'Your account did not take this change.'))];
}
