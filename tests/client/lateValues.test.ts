import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { LocalDb, type OutboxRow } from '../../src/local/db';
import { localEnd } from '../../src/local/endFacts';
import { recordChange, waitingCount } from '../../src/local/outbox';
import { syncOnce, type SyncTransport } from '../../src/local/syncEngine';
import { LATE_HELD_REASON, type LateDecisionDto } from '../../src/contract/lateValues';
import type { ChangeDto, EndWriteArgs } from '../../src/contract/sync';

/* A phone whose values reached the server after the session closed: held, then decided by a judge. */

const dbs: LocalDb[] = [];
afterEach(async () => {
  for (const db of dbs.splice(0)) await db.delete();
});

const write = (endIndex: number, arrows: EndWriteArgs['arrows']) => ({
  kind: 'end.write' as const,
  args: { sessionId: 1, entryId: 7, endIndex, slot: 1 as const, arrows, flags: [] },
});

const decision = (row: OutboxRow, status: 'accepted' | 'rejected', reason: string | null): ChangeDto => ({
  version: 10,
  type: 'late-value',
  record: {
    mutationId: row.id,
    sessionId: 1,
    entryId: 7,
    endIndex: (row.args as EndWriteArgs).endIndex,
    status,
    reason,
    decidedByName: 'Tobias Wren',
    decidedAt: '2026-12-12T17:00:00.000Z',
  } satisfies LateDecisionDto,
});

describe('values held for a judge on the phone', () => {
  it('keeps held values shown (not waiting to send), then applies the judge’s decision', async () => {
    const db = new LocalDb('late-values-test');
    dbs.push(db);
    const first = await recordChange(db, 5, write(0, ['9', '8', '7']));
    const second = await recordChange(db, 5, write(1, ['6', '5', '4']));
    let changes: ChangeDto[] = [];
    const transport: SyncTransport = {
      push: async (body) => ({
        results: body.mutations.map((m) => ({
          seq: m.seq,
          id: m.id,
          status: 'held',
          reason: LATE_HELD_REASON,
        })),
        lastSeq: 2,
      }),
      pull: async () => ({ changes, cursor: 10, hasMore: false }),
    };
    await syncOnce(db, 5, transport);
    const held = await db.outbox.orderBy('[clientId+seq]').toArray();
    expect(held.map((r) => r.status)).toEqual(['held', 'held']);
    // Not counted as waiting to send, but still what the pad shows for the end.
    expect(await waitingCount(db, 5)).toBe(0);
    expect(localEnd([], undefined, [held[0]!]).slots[1]).toMatchObject({
      arrows: ['9', '8', '7'],
      pending: true,
    });

    changes = [decision(first, 'accepted', null), decision(second, 'rejected', 'The paper card counts.')];
    await syncOnce(db, 5, transport);
    const decided = await db.outbox.orderBy('[clientId+seq]').toArray();
    expect(decided.map((r) => [r.status, r.reason])).toEqual([
      ['applied', LATE_HELD_REASON],
      ['rejected', 'Tobias Wren (judge) rejected this value: The paper card counts.'],
    ]);
  });
});
