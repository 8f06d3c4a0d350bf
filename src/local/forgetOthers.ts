import { NO_ACCOUNT, type LocalDb, type OutboxRow } from './db';
import { clientIdFor } from './outbox';
import { sendPractice, wholeSessions } from './practiceSync';
import { PERSON_META_PREFIXES } from './personMeta';

/** A change the server has not accepted yet: it belongs to its person until it reaches the server. */
const isWaiting = (row: OutboxRow) => row.status !== 'applied';

/**
 * Removes from this phone every stored row that is not `keep`'s (everyone's when `keep` is
 * undefined, at sign-out). The pulled copies of the server are one person's view, so they go
 * whole, with every pull cursor, and the next person pulls their own from the start.
 *
 * Another person's changes that have not reached the server stay, and so does each target they
 * are about: they go to the server when that person signs in again. Every screen reads them
 * by person, so no one else sees them. Practice stays the same way (hidden, and sent to its
 * person's account when they sign in); practice recorded with no one signed in becomes the
 * practice of the person signing in, and is sent to their account.
 */
export async function forgetOthers(db: LocalDb, keep: number | undefined): Promise<void> {
  // Found before the transaction: finding a client id may write one.
  const clientId = keep === undefined ? undefined : await clientIdFor(db, keep);
  await db.transaction(
    'rw',
    [
      db.targets,
      db.outbox,
      db.meta,
      db.cardRecords,
      db.settlements,
      db.rulings,
      db.endSignatures,
      db.cardSignatures,
      db.practiceSessions,
      db.practiceEnds,
      db.matchPads,
    ],
    async () => {
      if (keep !== undefined && clientId) await adoptPractice(db, keep, clientId);
      const others = (await db.outbox.toArray()).filter((r) => r.userId !== keep);
      const waiting = others.filter(isWaiting);
      const targets = (await db.targets.toArray()).filter((t) => t.userId !== keep);
      const stale = targets.filter(
        (t) =>
          !waiting.some(
            (r) =>
              r.userId === t.userId &&
              'sessionId' in r.args &&
              r.args.sessionId === t.session.id &&
              t.archers.some((a) => 'entryId' in r.args && a.entryId === r.args.entryId),
          ),
      );
      await db.targets.bulkDelete(stale.map((t) => t.key));
      // Matches joined by others go too, unless their waiting changes are about them (as targets).
      const matches = (await db.matchPads.toArray()).filter((m) => m.userId !== keep);
      await db.matchPads.bulkDelete(
        matches
          .filter(
            (m) =>
              !waiting.some(
                (r) => r.userId === m.userId && 'matchId' in r.args && r.args.matchId === m.matchId,
              ),
          )
          .map((m) => m.key),
      );
      await db.outbox.bulkDelete(
        others.filter((r) => !isWaiting(r)).map((r): [string, number] => [r.clientId, r.seq]),
      );
      await Promise.all([
        db.cardRecords.clear(),
        db.settlements.clear(),
        db.rulings.clear(),
        db.endSignatures.clear(),
        db.cardSignatures.clear(),
        db.meta.where('key').startsWithAnyOf([...PERSON_META_PREFIXES]).delete(),
      ]);
    },
  );
}

/** Practice recorded with no one signed in becomes `userId`'s, and goes to their account whole. */
async function adoptPractice(db: LocalDb, userId: number, clientId: string): Promise<void> {
  const sessions = await db.practiceSessions.where('ownerId').equals(NO_ACCOUNT).toArray();
  if (sessions.length === 0) return;
  const adopted = sessions.map((s) => ({ ...s, ownerId: userId }));
  await db.practiceSessions.bulkPut(adopted);
  await sendPractice(db, { userId, clientId }, userId, await wholeSessions(db, adopted));
}
