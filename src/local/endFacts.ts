import type { ArrowFlag, EndRecordDto, EndSettleArgs, EndWriteArgs, WriterSlot } from '../contract/sync';
import type { EndRuleArgs, EndSignArgs } from '../contract/judging';
import { rulingSteps, type EndFacts, type ValuesBefore } from '../core';
import type { EndSignatureRow, OutboxRow, RulingRow, SettlementRow } from './db';

export type SlotView = {
  arrows: EndRecordDto['arrows'];
  flags: { index: number; flag: ArrowFlag }[];
  revision: number;
  /** True while this phone's change has not taken effect on the server (not sent, or held for a judge). */
  pending: boolean;
};

/** A judge's ruling as the phones show it ("you" and this phone's time while it waits to sync). */
export type LocalRuling = {
  arrows: RulingRow['arrows'];
  reason: string;
  judgedByName: string;
  judgedAt: string;
  photoId: number | null;
  pending: boolean;
};

export type LocalEnd = {
  facts: EndFacts;
  slots: Partial<Record<WriterSlot, SlotView>>;
  settlementPending: boolean;
  /** The judge's latest ruling and the end's current signature, as this phone knows them. */
  ruling?: LocalRuling | undefined;
  /** Every ruling, oldest first, with the values it replaced. */
  rulings: { ruling: LocalRuling; before: ValuesBefore }[];
  signature?: { signedByName: string; signedAt: string; pending: boolean } | undefined;
};

export type JudgeRecords = { rulings?: RulingRow[]; signatures?: EndSignatureRow[] };

/**
 * What the phone shows for one end: the server's records, with this person's changes that are
 * still waiting laid over them (latest first wins), including those held for a judge after the
 * session closed. Rejected changes are not laid over.
 */
export function localEnd(
  records: EndRecordDto[],
  settlement: SettlementRow | undefined,
  waiting: OutboxRow[],
  judged: JudgeRecords = {},
): LocalEnd {
  const slots: Partial<Record<WriterSlot, SlotView>> = {};
  for (const r of records)
    slots[r.slot] = { arrows: r.arrows, flags: r.flags, revision: r.revision, pending: false };
  let settled: EndFacts['settlement'] = settlement
    ? { arrows: settlement.arrows, disputed: settlement.disputed, basis: settlement.basis }
    : undefined;
  let settlementPending = false;
  const rulings: LocalRuling[] = [...(judged.rulings ?? [])]
    .sort((a, b) => a.id - b.id)
    .map((r) => ({
      arrows: r.arrows,
      reason: r.reason,
      judgedByName: r.judgedByName,
      judgedAt: r.judgedAt,
      photoId: r.photoId,
      pending: false,
    }));
  const current = (judged.signatures ?? []).find((s) => !s.supersededAt);
  let signature: LocalEnd['signature'] = current && {
    signedByName: current.signedByName,
    signedAt: current.signedAt,
    pending: false,
  };
  let signedArrows = current?.arrows;

  for (const row of [...waiting].sort((a, b) => a.seq - b.seq)) {
    if (row.status !== 'pending' && row.status !== 'held') continue;
    if (row.kind === 'end.write') {
      const args = row.args as EndWriteArgs;
      const server = records.find((r) => r.slot === args.slot);
      slots[args.slot] = {
        arrows: args.arrows,
        flags: args.flags,
        revision: (server?.revision ?? 0) + 1,
        pending: true,
      };
    } else if (row.kind === 'end.settle') {
      const args = row.args as EndSettleArgs;
      settled = { arrows: args.arrows, disputed: args.disputed, basis: args.basis };
      settlementPending = true;
    } else if (row.kind === 'end.rule') {
      const args = row.args as EndRuleArgs;
      rulings.push({
        arrows: args.arrows,
        reason: args.reason,
        judgedByName: 'you',
        judgedAt: row.at,
        photoId: args.photoId ?? null,
        pending: true,
      });
      // A ruling is the correction of a signed end: the old signature no longer speaks for it.
      signature = undefined;
      signedArrows = undefined;
    } else if (row.kind === 'end.sign') {
      const args = row.args as EndSignArgs;
      signature = { signedByName: 'you', signedAt: row.at, pending: true };
      signedArrows = args.arrows;
    }
  }
  const asRecord = (s: SlotView | undefined) =>
    s ? { arrows: s.arrows, revision: s.revision, flags: s.flags } : undefined;
  const ruling = rulings[rulings.length - 1];
  const facts: EndFacts = {
    first: asRecord(slots[1]),
    second: asRecord(slots[2]),
    settlement: settled,
    ruling: ruling && { arrows: ruling.arrows },
    signedArrows,
  };
  return { facts, slots, settlementPending, ruling, rulings: rulingSteps(facts, rulings), signature };
}
