import type { EndSettleArgs, EndWriteArgs, Mutation } from '../contract/sync';
import type { CardSignArgs, EndRuleArgs, EndSignArgs } from '../contract/judging';
import { cardKeyOf, endKeyOf, type LocalDb, type OutboxRow } from './db';

/** This phone's identity towards the server: one sequence per install and person. */
const knownClientIds = new Map<string, Promise<string>>();
/** The same ids once known, so a tap can open its transaction without waiting a microtask. */
const settledClientIds = new Map<string, string>();

/** The promise is remembered, so two taps at once never create two install ids. */
export function clientIdFor(db: LocalDb, userId: number): Promise<string> {
  const memoKey = `${db.name}:${userId}`;
  let known = knownClientIds.get(memoKey);
  if (!known) {
    known = db.transaction('rw', db.meta, async () => {
      let install = (await db.meta.get('installId'))?.value as string | undefined;
      if (!install) {
        install = crypto.randomUUID();
        await db.meta.put({ key: 'installId', value: install });
      }
      return `${install}.${userId}`;
    });
    knownClientIds.set(memoKey, known);
    known.then(
      (id) => settledClientIds.set(memoKey, id),
      () => knownClientIds.delete(memoKey),
    );
  }
  return known;
}

type NewChange =
  | { kind: 'end.write'; args: EndWriteArgs }
  | { kind: 'end.settle'; args: EndSettleArgs }
  | { kind: 'end.rule'; args: EndRuleArgs }
  | { kind: 'end.sign'; args: EndSignArgs }
  | { kind: 'card.sign'; args: CardSignArgs };

/** The end a change is about, or the card for a card signature. */
const subjectKey = (change: NewChange) =>
  change.kind === 'card.sign'
    ? `${cardKeyOf(change.args.sessionId, change.args.entryId)}:card`
    : endKeyOf(change.args.sessionId, change.args.entryId, change.args.endIndex);

/** The next sequence number per client, as last committed from this page (see recordChange). */
const knownNextSeq = new Map<string, number>();

/** The stored counter moved on (another tab of the app wrote a change): try again from it. */
class SeqMoved extends Error {
  constructor(readonly stored: number) {
    super('The change counter moved on in another tab.');
  }
}

/**
 * Records a change in the outbox. The outbox row is the phone's own state change (the pad shows
 * pending rows over the server's copy), so the change and its outbox entry are one write.
 *
 * The row and the new counter are written together with the read of the stored counter, using
 * the number this page saw last, so a tap costs one round trip to the database. If another tab
 * moved the counter, the read tells (or `add` hits the existing row), the transaction is undone
 * and written again with the stored number: numbers never repeat and never skip.
 */
export async function recordChange(db: LocalDb, userId: number, change: NewChange): Promise<OutboxRow> {
  const clientId = settledClientIds.get(`${db.name}:${userId}`) ?? (await clientIdFor(db, userId));
  const seqKey = `nextSeq:${clientId}`;
  const memoKey = `${db.name}:${seqKey}`;
  const rowWith = (seq: number): OutboxRow => ({
    clientId,
    seq,
    id: crypto.randomUUID(),
    userId,
    kind: change.kind,
    args: change.args,
    at: new Date().toISOString(),
    endKey: subjectKey(change),
    status: 'pending',
  });
  for (let attempt = 0; ; attempt += 1) {
    const guess = knownNextSeq.get(memoKey);
    try {
      const row = await db.transaction('rw', db.outbox, db.meta, async () => {
        if (guess === undefined) {
          const seq = ((await db.meta.get(seqKey))?.value as number | undefined) ?? 1;
          const row = rowWith(seq);
          await db.outbox.add(row);
          await db.meta.put({ key: seqKey, value: seq + 1 });
          return row;
        }
        const row = rowWith(guess);
        const [stored] = await Promise.all([
          db.meta.get(seqKey),
          db.outbox.add(row),
          db.meta.put({ key: seqKey, value: guess + 1 }),
        ]);
        const storedSeq = (stored?.value as number | undefined) ?? 1;
        if (storedSeq !== guess) throw new SeqMoved(storedSeq);
        return row;
      });
      knownNextSeq.set(memoKey, row.seq + 1);
      return row;
    } catch (error) {
      knownNextSeq.delete(memoKey);
      const moved = error instanceof SeqMoved || (error instanceof Error && error.name === 'ConstraintError');
      if (!moved || guess === undefined || attempt > 0) throw error;
    }
  }
}

export const toMutation = (row: OutboxRow): Mutation =>
  ({ id: row.id, seq: row.seq, kind: row.kind, args: row.args, at: row.at }) as Mutation;

export async function waitingCount(db: LocalDb, userId?: number): Promise<number> {
  const pending = db.outbox.where('status').equals('pending');
  return userId === undefined ? pending.count() : pending.filter((r) => r.userId === userId).count();
}

/** Unsynced and refused changes as a file a judge can import when a phone cannot sync. */
export async function exportWaiting(db: LocalDb): Promise<{ fileName: string; json: string }> {
  const rows = await db.outbox.where('status').anyOf('pending', 'rejected').toArray();
  const byClient = new Map<string, OutboxRow[]>();
  for (const row of rows) byClient.set(row.clientId, [...(byClient.get(row.clientId) ?? []), row]);
  const body = {
    format: 'ringcall-waiting-changes',
    version: 1,
    exportedAt: new Date().toISOString(),
    clients: [...byClient].map(([clientId, list]) => ({
      clientId,
      userId: list[0]!.userId,
      mutations: list
        .sort((a, b) => a.seq - b.seq)
        .map((r) => ({ ...toMutation(r), status: r.status, reason: r.reason })),
    })),
  };
  const stamp = body.exportedAt.replace(/[:.]/g, '-');
  return { fileName: `ringcall-waiting-${stamp}.json`, json: JSON.stringify(body, null, 2) };
}
