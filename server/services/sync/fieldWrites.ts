import type { CardSignatureDto, EndSignatureDto, RulingDto } from '../../../src/contract/judging';
import type { EndRecordDto, SettlementDto } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { insertRows } from '../../rowInserts';
import type { CardSignatureRow, EndEntryRow, EndSignatureRow, RulingRow, SettlementRow } from './fieldRows';
import type { Placement } from './fieldPlacements';

export type ChangeRecord =
  | { type: 'end'; record: EndRecordDto }
  | { type: 'settlement'; record: SettlementDto }
  | { type: 'ruling'; record: RulingDto }
  | { type: 'signature'; record: EndSignatureDto }
  | { type: 'card-signature'; record: CardSignatureDto };

/**
 * The id of a judging row not written yet. Its record (`dto.id`) carries this until the batch is
 * written: `writeFieldBatch` then sets the database's id in the row and in every record that
 * names it (a superseded signature points at the ruling's id), before any change row is made.
 */
export const NOT_YET_WRITTEN = 0;

/** A stored or new row of an append-only judging table; `id` is NOT_YET_WRITTEN until it is written. */
export type Held<Row, Dto> = { id: number; row: Row; dto: Dto };
export type RulingHeld = Held<RulingRow, RulingDto>;
export type EndSignatureHeld = Held<EndSignatureRow, EndSignatureDto>;
export type CardSignatureHeld = Held<CardSignatureRow, CardSignatureDto>;

/** Judging writes in the order they were applied: ids of earlier ones are needed by later ones. */
export type JudgeOp =
  | {
      op: 'insert';
      table: 'end_rulings' | 'end_signatures' | 'card_signatures' | 'shootoff_arrows';
      held: Held<object, { id: number }>;
    }
  | {
      op: 'supersede';
      table: 'end_signatures' | 'card_signatures';
      held: Held<object, { id: number }>;
      by: RulingHeld;
      at: string;
      /** The record as phones see it after this ruling (a copy: an earlier change keeps the signed one). */
      snapshot: { id: number; supersededAt: string | null; supersededByRuling?: number | null };
    };

/** What a commit's FieldBatch writes: each touched record and settlement once, judging in order, change rows. */
export type FieldWrites = {
  records: EndEntryRow[];
  settlements: SettlementRow[];
  ops: JudgeOp[];
  /** One per record per commit, in the order of the last write to each. */
  changes: { placement: Placement; change: () => ChangeRecord }[];
};

/**
 * Writes a batch's effects with multi-row statements: the final state of each end record and
 * settlement it touched, the judging rows in the order applied (a ruling's id is what a
 * superseded signature points at), and its change rows. Change versions follow commit order
 * because SQLite has a single writer; a PostgreSQL deployment would need pushes to lock the log
 * (or hand out versions at commit) to keep that true.
 */
export async function writeFieldBatch(trx: Db, writes: FieldWrites): Promise<void> {
  await insertRows(trx, 'end_entries', writes.records, {
    conflict: ['session_id', 'entry_id', 'end_index', 'slot'],
  });
  await insertRows(trx, 'end_settlements', writes.settlements, {
    conflict: ['session_id', 'entry_id', 'end_index'],
  });
  for (const op of writes.ops) {
    if (op.op === 'insert') {
      const [inserted] = (await trx(op.table).insert(op.held.row).returning('id')) as { id: number }[];
      op.held.id = inserted!.id;
      op.held.dto.id = inserted!.id;
    } else {
      await trx(op.table)
        .where({ id: op.held.id })
        .update({ superseded_at: op.at, superseded_by_ruling: op.by.id });
      op.snapshot.id = op.held.id;
      if ('supersededByRuling' in op.snapshot) op.snapshot.supersededByRuling = op.by.id;
    }
  }
  // Made only now: every id above is known, and each record is read once, in its final state.
  const changeRows = writes.changes.map(({ placement, change }) => {
    const { type, record } = change();
    return {
      event_id: placement.session.eventId,
      session_id: placement.session.id,
      target_number: placement.targetNumber,
      type,
      record_json: JSON.stringify(record),
    };
  });
  await insertRows(trx, 'changes', changeRows);
}
