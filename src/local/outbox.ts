import type { EndSettleArgs, EndWriteArgs, Mutation } from '../contract/sync';
import type { CardSignArgs, EndRuleArgs, EndSignArgs } from '../contract/judging';
import { cardKeyOf, endKeyOf, type LocalDb, type OutboxRow } from './db';

/** This phone's identity towards the server: one sequence per install and person. */
const knownClientIds = new Map<string, Promise<string>>();

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
    known.catch(() => knownClientIds.delete(memoKey));
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

/**
 * Records a change in the outbox. The outbox row is the phone's own state change (the pad shows
 * pending rows over the server's copy), so the change and its outbox entry are one write.
 */
export async function recordChange(db: LocalDb, userId: number, change: NewChange): Promise<OutboxRow> {
  const clientId = await clientIdFor(db, userId);
  return db.transaction('rw', db.outbox, db.meta, async () => {
    const seqKey = `nextSeq:${clientId}`;
    const seq = ((await db.meta.get(seqKey))?.value as number | undefined) ?? 1;
    const row: OutboxRow = {
      clientId,
      seq,
      id: crypto.randomUUID(),
      userId,
      kind: change.kind,
      args: change.args,
      at: new Date().toISOString(),
      endKey: subjectKey(change),
      status: 'pending',
    };
    await db.outbox.add(row);
    await db.meta.put({ key: seqKey, value: seq + 1 });
    return row;
  });
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
