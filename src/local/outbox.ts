import type { EndSettleArgs, EndWriteArgs, Mutation } from '../contract/sync';
import type { CardSignArgs, EndRuleArgs, EndSignArgs } from '../contract/judging';
import type { ShootOffRecordArgs } from '../contract/results';
import type {
  MatchCountersignArgs,
  MatchEndArgs,
  MatchEndSignArgs,
  MatchFirstShooterArgs,
  MatchShootOffArgs,
  MatchSignArgs,
  MatchWriteArgs,
} from '../contract/matches';
import type { PracticeDeleteArgs, PracticeEndDto, PracticeSessionDto } from '../contract/practice';
import { Dexie } from 'dexie';
import { cardKeyOf, endKeyOf, shootOffKeyOf, type LocalDb, type OutboxRow } from './db';
import { writeAtOnce } from './writeAtOnce';
import { signWaitingBlock } from './deviceKey';

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

export type NewChange =
  | { kind: 'end.write'; args: EndWriteArgs }
  | { kind: 'end.settle'; args: EndSettleArgs }
  | { kind: 'end.rule'; args: EndRuleArgs }
  | { kind: 'end.sign'; args: EndSignArgs }
  | { kind: 'card.sign'; args: CardSignArgs }
  | { kind: 'shootoff.record'; args: ShootOffRecordArgs }
  | { kind: 'match.end'; args: MatchEndArgs }
  | { kind: 'match.shootoff'; args: MatchShootOffArgs }
  | { kind: 'match.sign'; args: MatchSignArgs }
  | { kind: 'match.endSign'; args: MatchEndSignArgs }
  | { kind: 'practice.session'; args: PracticeSessionDto }
  | { kind: 'practice.end'; args: PracticeEndDto }
  | { kind: 'practice.delete'; args: PracticeDeleteArgs }
  | { kind: 'match.write'; args: MatchWriteArgs }
  | { kind: 'match.countersign'; args: MatchCountersignArgs }
  | { kind: 'match.firstShooter'; args: MatchFirstShooterArgs };

/** A match change's key: the match, then the end, the shoot-off or the signature. */
export const matchKeyOf = (matchId: number, what: string) => `match:${matchId}:${what}`;

/** A practice change's key: the session, then the end (so a session's changes share a prefix). */
export const practiceKeyOf = (sessionId: string, index?: number) =>
  index === undefined ? `practice:${sessionId}` : `practice:${sessionId}:${index}`;

/** The end a change is about, the card for a card signature, the arrow for a shoot-off, a match's part, a practice session or end. */
function subjectKey(change: NewChange): string {
  switch (change.kind) {
    case 'practice.session':
      return practiceKeyOf(change.args.id);
    case 'practice.end':
      return practiceKeyOf(change.args.sessionId, change.args.index);
    case 'practice.delete':
      return practiceKeyOf(change.args.sessionId);
    case 'match.write':
      return matchKeyOf(change.args.matchId, `write:${change.args.endIndex}`);
    case 'match.countersign':
      return matchKeyOf(change.args.matchId, 'countersign');
    case 'match.firstShooter':
      return matchKeyOf(change.args.matchId, 'first-shooter');
    case 'match.end':
      return matchKeyOf(change.args.matchId, `end:${change.args.endIndex}`);
    case 'match.shootoff':
      return matchKeyOf(change.args.matchId, 'shoot-off');
    case 'match.sign':
      return matchKeyOf(change.args.matchId, 'sign');
    case 'match.endSign':
      return matchKeyOf(change.args.matchId, `end-sign:${change.args.endIndex}`);
    case 'card.sign':
      return `${cardKeyOf(change.args.sessionId, change.args.entryId)}:card`;
    case 'shootoff.record':
      return shootOffKeyOf(change.args.sessionId, change.args.entryId, change.args.arrowIndex);
    default:
      return endKeyOf(change.args.sessionId, change.args.entryId, change.args.endIndex);
  }
}

/** The next sequence number per client, as last committed from this page (see recordChange). */
const knownNextSeq = new Map<string, number>();
/** Per person on this page, the change being stored now: the next one starts after it. */
const inFlight = new Map<string, Promise<unknown>>();

/**
 * The next number from what is stored: the higher of the last stored row's and the counter
 * written with every row. The counter is what keeps numbers from repeating once applied rows
 * have left the phone with their person's data (forgetOthers.ts).
 */
async function storedNextSeq(db: LocalDb, clientId: string): Promise<number> {
  const [last, counter] = await db.transaction('r', db.outbox, db.meta, () =>
    Promise.all([
      db.outbox.where('[clientId+seq]').between([clientId, Dexie.minKey], [clientId, Dexie.maxKey]).last(),
      db.meta.get(`nextSeq:${clientId}`),
    ]),
  );
  return Math.max((last?.seq ?? 0) + 1, (counter?.value as number | undefined) ?? 1);
}

/**
 * Records a change in the outbox. The outbox row is the phone's own state change (the pad shows
 * pending rows over the server's copy), so the change and its outbox entry are one write.
 *
 * A tap costs one write that commits at once (see writeAtOnce), using the number this page used
 * last plus one. If another tab of the app took that number, the row's key exists, nothing is
 * stored, and the change is written again with the number read from the database: numbers never
 * repeat and never skip. Changes from one page are stored one after another, in tap order.
 */
export function recordChange(db: LocalDb, userId: number, change: NewChange): Promise<OutboxRow> {
  const queueKey = `${db.name}:${userId}`;
  const before = inFlight.get(queueKey);
  const store = () => storeChange(db, userId, change);
  // Nothing in flight (the usual tap): the write starts within the tap's own task.
  const stored = before ? before.then(store, store) : store();
  const settled = stored.catch(() => undefined);
  inFlight.set(queueKey, settled);
  void settled.then(() => {
    if (inFlight.get(queueKey) === settled) inFlight.delete(queueKey);
  });
  return stored;
}

/**
 * Records changes inside a Dexie transaction the caller opened over `outbox` and `meta` (with
 * whatever else it writes), so the phone's own change and its outbox rows are one commit: the
 * practice log's writes. Numbers come from what is stored; a tap's cached number that this took
 * is refused by the row's key and read again (see storeChange).
 */
export async function recordChangesInTransaction(
  db: LocalDb,
  clientId: string,
  userId: number,
  changes: readonly NewChange[],
): Promise<void> {
  if (changes.length === 0) return;
  const seqKey = `nextSeq:${clientId}`;
  knownNextSeq.delete(`${db.name}:${seqKey}`);
  const first = await storedNextSeq(db, clientId);
  const at = new Date().toISOString();
  await db.outbox.bulkAdd(
    changes.map((change, i): OutboxRow => ({
      clientId,
      seq: first + i,
      id: crypto.randomUUID(),
      userId,
      kind: change.kind,
      args: change.args,
      at,
      endKey: subjectKey(change),
      status: 'pending',
    })),
  );
  await db.meta.put({ key: seqKey, value: first + changes.length });
}

async function storeChange(db: LocalDb, userId: number, change: NewChange): Promise<OutboxRow> {
  const clientId = settledClientIds.get(`${db.name}:${userId}`) ?? (await clientIdFor(db, userId));
  const seqKey = `nextSeq:${clientId}`;
  const memoKey = `${db.name}:${seqKey}`;
  for (let attempt = 0; ; attempt += 1) {
    const seq = knownNextSeq.get(memoKey) ?? (await storedNextSeq(db, clientId));
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
    try {
      await writeAtOnce(db, [
        { table: db.outbox, type: 'add', value: row },
        { table: db.meta, type: 'put', value: { key: seqKey, value: seq + 1 } },
      ]);
      knownNextSeq.set(memoKey, seq + 1);
      return row;
    } catch (error) {
      knownNextSeq.delete(memoKey);
      // Another tab keeps taking numbers: give up after a few rounds rather than loop.
      const taken = (error as { name?: unknown } | undefined)?.name === 'ConstraintError';
      if (!taken || attempt >= 4) throw error;
    }
  }
}

export const toMutation = (row: OutboxRow): Mutation =>
  ({ id: row.id, seq: row.seq, kind: row.kind, args: row.args, at: row.at }) as Mutation;

export async function waitingCount(db: LocalDb, userId: number): Promise<number> {
  return db.outbox
    .where('status')
    .equals('pending')
    .filter((r) => r.userId === userId)
    .count();
}

/**
 * A person's unsynced and refused changes as a file a judge can import when a phone cannot sync
 * (only theirs: another person's changes on a shared phone are never handed to someone else).
 */
export async function exportWaiting(
  db: LocalDb,
  userId: number,
): Promise<{ fileName: string; json: string }> {
  const rows = await db.outbox
    .where('status')
    .anyOf('pending', 'rejected')
    .filter((r) => r.userId === userId)
    .toArray();
  const byClient = new Map<string, OutboxRow[]>();
  for (const row of rows) byClient.set(row.clientId, [...(byClient.get(row.clientId) ?? []), row]);
  const clients = [];
  for (const [clientId, list] of byClient) {
    const block = {
      clientId,
      userId: list[0]!.userId,
      mutations: list
        .sort((a, b) => a.seq - b.seq)
        .map((r) => ({ ...toMutation(r), status: r.status, reason: r.reason })),
    };
    // Signed by this phone's key, so a judge's import counts the changes as their person's own.
    const signature = await signWaitingBlock(db, block);
    clients.push(signature ? { ...block, signature } : block);
  }
  const body = {
    format: 'ringcall-waiting-changes',
    version: 1,
    exportedAt: new Date().toISOString(),
    clients,
  };
  const stamp = body.exportedAt.replace(/[:.]/g, '-');
  return { fileName: `ringcall-waiting-${stamp}.json`, json: JSON.stringify(body, null, 2) };
}
