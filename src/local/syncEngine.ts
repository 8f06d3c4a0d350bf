import type { ChangeDto, MutationResult, PullResponse, PushRequest, PushResponse } from '../contract/sync';
import { cardKeyOf, endKeyOf, recordKeyOf, type LocalDb, type OutboxRow } from './db';
import { clientIdFor, toMutation } from './outbox';

/** How the engine reaches the server; the app uses HTTP, tests can wire the app directly. */
export type SyncTransport = {
  push: (body: PushRequest) => Promise<PushResponse>;
  pull: (cursor: number) => Promise<PullResponse>;
};

export type SyncReport = { pushed: number; applied: number; rejected: number; pulled: number };

const PUSH_BATCH = 200;

const cursorKey = (userId: number) => `pullCursor:${userId}`;

/**
 * One round of sync for the signed-in person: push waiting changes in order, then pull what
 * changed on the server. Outbox outcomes and pulled records are stored in one transaction, so a
 * crash between push and pull only means the next round asks again (the server answers
 * duplicates without applying them twice).
 */
export async function syncOnce(db: LocalDb, userId: number, transport: SyncTransport): Promise<SyncReport> {
  const clientId = await clientIdFor(db, userId);
  const outcomes = new Map<number, MutationResult>();
  let pushed = 0;

  for (;;) {
    const waiting = await db.outbox.where('[clientId+status]').equals([clientId, 'pending']).sortBy('seq');
    const batch = waiting.filter((r) => !outcomes.has(r.seq)).slice(0, PUSH_BATCH);
    if (batch.length === 0) break;
    const response = await transport.push({ clientId, mutations: batch.map(toMutation) });
    pushed += batch.length;
    response.results.forEach((r) => outcomes.set(r.seq, r));
    if (response.expectedSeq !== undefined) {
      // The server misses earlier changes (restored from a backup, say): send them again.
      await resendFrom(db, clientId, response.expectedSeq, transport, outcomes);
    }
    if (response.results.length < batch.length && response.expectedSeq === undefined) break;
  }

  const changes: ChangeDto[] = [];
  let cursor = ((await db.meta.get(cursorKey(userId)))?.value as number | undefined) ?? 0;
  for (;;) {
    const page = await transport.pull(cursor);
    changes.push(...page.changes);
    cursor = page.cursor;
    if (!page.hasMore) break;
  }

  let applied = 0;
  let rejected = 0;
  await db.transaction(
    'rw',
    [db.outbox, db.endRecords, db.settlements, db.rulings, db.endSignatures, db.cardSignatures, db.meta],
    async () => {
      for (const [seq, result] of outcomes) {
        const row = await db.outbox.get([clientId, seq]);
        if (!row || row.status !== 'pending') continue;
        if (result.status === 'rejected') {
          rejected += 1;
          await db.outbox.update([clientId, seq], { status: 'rejected', reason: result.reason });
        } else {
          applied += 1;
          await db.outbox.update([clientId, seq], { status: 'applied' });
        }
      }
      for (const change of changes) await applyChange(db, change);
      await db.meta.put({ key: cursorKey(userId), value: cursor });
    },
  );
  return { pushed, applied, rejected, pulled: changes.length };
}

async function resendFrom(
  db: LocalDb,
  clientId: string,
  expectedSeq: number,
  transport: SyncTransport,
  outcomes: Map<number, MutationResult>,
): Promise<void> {
  const rows: OutboxRow[] = await db.outbox
    .where('[clientId+seq]')
    .between([clientId, expectedSeq], [clientId, Infinity])
    .toArray();
  for (let i = 0; i < rows.length; i += PUSH_BATCH) {
    const response = await transport.push({
      clientId,
      mutations: rows.slice(i, i + PUSH_BATCH).map(toMutation),
    });
    response.results.forEach((r) => outcomes.set(r.seq, r));
    if (response.expectedSeq !== undefined)
      throw new Error('The server and this phone disagree on which changes it holds.');
  }
}

async function applyChange(db: LocalDb, change: ChangeDto): Promise<void> {
  if (change.type === 'card-signature') {
    await db.cardSignatures.put({
      ...change.record,
      cardKey: cardKeyOf(change.record.sessionId, change.record.entryId),
    });
    return;
  }
  const r = change.record;
  const endKey = endKeyOf(r.sessionId, r.entryId, r.endIndex);
  if (change.type === 'ruling') {
    await db.rulings.put({ ...change.record, endKey });
  } else if (change.type === 'signature') {
    await db.endSignatures.put({ ...change.record, endKey });
  } else if (change.type === 'end') {
    const existing = await db.endRecords.get(
      recordKeyOf(r.sessionId, r.entryId, r.endIndex, change.record.slot),
    );
    // Changes arrive in order, but never let an older revision replace a newer one.
    if (existing && existing.revision > change.record.revision) return;
    await db.endRecords.put({
      ...change.record,
      key: recordKeyOf(r.sessionId, r.entryId, r.endIndex, change.record.slot),
      endKey,
    });
  } else {
    await db.settlements.put({ ...change.record, endKey });
  }
}
