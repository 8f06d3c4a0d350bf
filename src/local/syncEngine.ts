import type { ChangeDto, MutationResult, PullResponse, PushRequest, PushResponse } from '../contract/sync';
import type { LocalDb, OutboxRow } from './db';
import { clientIdFor, toMutation } from './outbox';
import type { DeviceKeyRequest } from '../contract/deviceKeys';
import { ensureDeviceKeyRegistered, type KeyRegistration } from './deviceKey';
import { pullCursorKey } from './personMeta';

/** How the engine reaches the server; the app uses HTTP, tests can wire the app directly. */
export type SyncTransport = {
  push: (body: PushRequest) => Promise<PushResponse>;
  pull: (cursor: number) => Promise<PullResponse>;
  /** Registers this phone's public key for its client id (see deviceKey.ts); optional for tests. */
  registerKey?: (body: DeviceKeyRequest) => Promise<KeyRegistration>;
};

export type SyncReport = { pushed: number; applied: number; rejected: number; pulled: number };

const PUSH_BATCH = 200;

/**
 * One round of sync for the signed-in person: push waiting changes in order, then pull what
 * changed on the server. Each push carries the pull cursor, and the server answers it with what
 * this phone has not seen (one round trip); a separate pull is sent only when nothing was
 * pushed, more is waiting than one answer holds, or the server did not answer with a pull (an
 * older server, a batch split in halves). Outbox outcomes and pulled records are stored in one
 * transaction, so a crash between push and pull only means the next round asks again (the
 * server answers duplicates without applying them twice).
 */
export async function syncOnce(db: LocalDb, userId: number, transport: SyncTransport): Promise<SyncReport> {
  const clientId = await clientIdFor(db, userId);
  // Never blocks the changes: a registration that failed is tried again next round (a signed-out
  // phone hears of it from the push just after).
  if (transport.registerKey)
    await ensureDeviceKeyRegistered(db, clientId, transport.registerKey).catch(() => undefined);
  // Loaded with the first sync, not with the pad: a writer's first paint does not wait for them.
  const [{ applyPulledPractice, sendOlderPractice }, { storePulled }] = await Promise.all([
    import('./practiceSync'),
    import('./storePulled'),
  ]);
  await sendOlderPractice(db, userId, clientId);
  const outcomes = new Map<number, MutationResult>();
  let pushed = 0;
  const changes: ChangeDto[] = [];
  const storedCursor = async () =>
    ((await db.meta.get(pullCursorKey(userId)))?.value as number | undefined) ?? 0;
  const from = await storedCursor();
  let cursor = from;
  /** Whether the last answer's pull left nothing waiting (so no separate pull is needed). */
  let pulledAll = false;

  for (;;) {
    const waiting = await db.outbox.where('[clientId+status]').equals([clientId, 'pending']).sortBy('seq');
    const batch = waiting.filter((r) => !outcomes.has(r.seq)).slice(0, PUSH_BATCH);
    if (batch.length === 0) break;
    const response = await pushSplitting(transport, clientId, batch, cursor);
    pushed += batch.length;
    response.results.forEach((r) => outcomes.set(r.seq, r));
    pulledAll = false;
    if (response.pull) {
      changes.push(...response.pull.changes);
      cursor = response.pull.cursor;
      pulledAll = !response.pull.hasMore;
    }
    if (response.expectedSeq !== undefined) {
      // The server misses earlier changes (restored from a backup, say): send them again.
      await resendFrom(db, clientId, response.expectedSeq, transport, outcomes);
      pulledAll = false;
    }
    if (response.results.length < batch.length && response.expectedSeq === undefined) break;
  }

  while (!pulledAll) {
    const page = await transport.pull(cursor);
    changes.push(...page.changes);
    cursor = page.cursor;
    pulledAll = !page.hasMore;
  }

  let applied = 0;
  let rejected = 0;
  // Bulk reads and writes: the pad's next tap waits for this transaction, so it must be short.
  await db.transaction(
    'rw',
    [
      db.outbox,
      db.cardRecords,
      db.settlements,
      db.rulings,
      db.endSignatures,
      db.cardSignatures,
      db.meta,
      db.practiceSessions,
      db.practiceEnds,
    ],
    async () => {
      const seqs = [...outcomes.keys()];
      const rows = await db.outbox.bulkGet(seqs.map((seq): [string, number] => [clientId, seq]));
      const answered = rows.flatMap((row): OutboxRow[] => {
        const result = row?.status === 'pending' ? outcomes.get(row.seq) : undefined;
        if (!row || !result) return [];
        if (result.status === 'rejected') {
          rejected += 1;
          return [{ ...row, status: 'rejected' as const, reason: result.reason }];
        }
        if (result.status === 'held') return [{ ...row, status: 'held' as const, reason: result.reason }];
        applied += 1;
        return [{ ...row, status: 'applied' as const }];
      });
      await db.outbox.bulkPut(answered);
      await storePulled(db, changes);
      await applyPulledPractice(db, userId, changes);
      // A cursor set back during this round (the judge desk asks for every end again) stays for the next.
      if ((await storedCursor()) === from) await db.meta.put({ key: pullCursorKey(userId), value: cursor });
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
    const response = await pushSplitting(transport, clientId, rows.slice(i, i + PUSH_BATCH));
    response.results.forEach((r) => outcomes.set(r.seq, r));
    if (response.expectedSeq !== undefined)
      throw new Error('The server and this phone disagree on which changes it holds.');
  }
}

/** The server's answer to a push it found too large (413): it held nothing of it. */
const tooLarge = (error: unknown): boolean => (error as { status?: unknown } | null)?.status === 413;

/**
 * Pushes rows in order, asking for the pull from `cursor` when given; a batch the server finds
 * too large is sent again in halves without it (a batch of one that is still too large cannot be
 * helped by splitting, and its error is passed on).
 */
async function pushSplitting(
  transport: SyncTransport,
  clientId: string,
  rows: OutboxRow[],
  cursor?: number,
): Promise<PushResponse> {
  try {
    const mutations = rows.map(toMutation);
    return await transport.push(
      cursor === undefined ? { clientId, mutations } : { clientId, mutations, cursor },
    );
  } catch (error) {
    if (!tooLarge(error) || rows.length < 2) throw error;
  }
  const half = Math.ceil(rows.length / 2);
  const first = await pushSplitting(transport, clientId, rows.slice(0, half));
  if (first.expectedSeq !== undefined) return first;
  const second = await pushSplitting(transport, clientId, rows.slice(half));
  return { ...second, results: [...first.results, ...second.results] };
}
