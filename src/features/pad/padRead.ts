import { localDb, targetKeyOf, type JoinedTarget, type OutboxRow } from '../../local/db';
import type { LocalEnd } from '../../local/endFacts';
import { loadSessionEnds, type EndCache } from '../../local/sessionEnds';

export type PadData = {
  target: JoinedTarget;
  /** By session:entry:end. */
  ends: Map<string, LocalEnd>;
  rejected: OutboxRow[];
  /** Changes the server holds for a judge (they arrived after the session closed). */
  held: OutboxRow[];
  /** This person's changes on the target not sent yet. */
  unsent: number;
};

/** Which pad: the signed-in person's (or the phone owner's) target in a session. */
export type PadKey = { sessionId: number; targetNumber: number; userId: number | undefined };

/**
 * What one pad's reads remember between them, so what reads the same comes back as the same
 * object and the parts of the pad that show only it are not drawn again after a tap (they are
 * memoized on their props).
 */
export type PadMemory = {
  /** Each tap reads every end again; the ends it did not change come back as the same objects. */
  ends: EndCache;
  same: Map<string, { json: string; value: unknown }>;
};

export const newPadMemory = (): PadMemory => ({ ends: new Map(), same: new Map() });

/** Everything the pad shows for one joined target, from IndexedDB (works offline). */
export function readPad({ sessionId, targetNumber, userId }: PadKey, memory: PadMemory) {
  const steady = <T>(name: string, value: T): T => {
    const json = JSON.stringify(value);
    const last = memory.same.get(name);
    if (last?.json === json) return last.value as T;
    memory.same.set(name, { json, value });
    return value;
  };
  const db = localDb();
  // One read transaction per refresh: the next tap's write waits for every open one.
  return db.transaction(
    'r',
    [db.targets, db.cardRecords, db.settlements, db.outbox, db.rulings, db.endSignatures],
    async (): Promise<PadData | null> => {
      // Only the signed-in person's own target: a shared phone never shows another's pad.
      const target =
        userId === undefined ? undefined : await db.targets.get(targetKeyOf(userId, sessionId, targetNumber));
      if (!target) return null;
      const { ends, rejected, held, unsent } = await loadSessionEnds(
        db,
        sessionId,
        target.userId,
        [target],
        memory.ends,
      );
      const entryIds = new Set(target.archers.map((a) => a.entryId));
      const onTarget = (rows: OutboxRow[]) =>
        rows.filter((r) => 'entryId' in r.args && entryIds.has(r.args.entryId));
      return {
        target: steady('target', target),
        ends,
        rejected: steady('rejected', onTarget(rejected)),
        held: steady('held', onTarget(held)),
        unsent,
      };
    },
  );
}
