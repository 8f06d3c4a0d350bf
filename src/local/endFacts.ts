import type { ArrowFlag, EndSettleArgs, EndWriteArgs, WriterSlot } from '../contract/sync';
import type { EndFacts } from '../core';
import type { EndRecordRow, OutboxRow, SettlementRow } from './db';

export type SlotView = {
  arrows: EndRecordRow['arrows'];
  flags: { index: number; flag: ArrowFlag }[];
  revision: number;
  /** True while this phone's change has not reached the server. */
  pending: boolean;
};

export type LocalEnd = {
  facts: EndFacts;
  slots: Partial<Record<WriterSlot, SlotView>>;
  settlementPending: boolean;
};

/**
 * What the phone shows for one end: the server's records, with this person's changes that are
 * still waiting laid over them (latest first wins). Rejected changes are not laid over.
 */
export function localEnd(
  records: EndRecordRow[],
  settlement: SettlementRow | undefined,
  waiting: OutboxRow[],
): LocalEnd {
  const slots: Partial<Record<WriterSlot, SlotView>> = {};
  for (const r of records)
    slots[r.slot] = { arrows: r.arrows, flags: r.flags, revision: r.revision, pending: false };
  let settled: EndFacts['settlement'] = settlement
    ? { arrows: settlement.arrows, disputed: settlement.disputed, basis: settlement.basis }
    : undefined;
  let settlementPending = false;
  for (const row of [...waiting].sort((a, b) => a.seq - b.seq)) {
    if (row.status !== 'pending') continue;
    if (row.kind === 'end.write') {
      const args = row.args as EndWriteArgs;
      const server = records.find((r) => r.slot === args.slot);
      slots[args.slot] = {
        arrows: args.arrows,
        flags: args.flags,
        revision: (server?.revision ?? 0) + 1,
        pending: true,
      };
    } else {
      const args = row.args as EndSettleArgs;
      settled = { arrows: args.arrows, disputed: args.disputed, basis: args.basis };
      settlementPending = true;
    }
  }
  const asRecord = (s: SlotView | undefined) => (s ? { arrows: s.arrows, revision: s.revision } : undefined);
  return {
    facts: { first: asRecord(slots[1]), second: asRecord(slots[2]), settlement: settled },
    slots,
    settlementPending,
  };
}
