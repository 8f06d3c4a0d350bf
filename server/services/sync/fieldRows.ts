import type { ArrowValue } from '../../../src/core';
import type { ArrowFlag, EndRecordDto, SettlementDto, WriterSlot } from '../../../src/contract/sync';

/** One writer's current record of one end (table end_entries). */
export type EndEntryRow = {
  session_id: number;
  entry_id: number;
  end_index: number;
  slot: WriterSlot;
  arrows_json: string;
  flags_json: string;
  revision: number;
  written_by: number;
  written_at: string;
  /** The uuid of the mutation that made this revision. */
  mutation_id: string;
};

/** The caller's current settlement of one end (table end_settlements). */
export type SettlementRow = {
  session_id: number;
  entry_id: number;
  end_index: number;
  arrows_json: string;
  disputed_json: string;
  basis_json: string;
  settled_by: number;
  settled_at: string;
  mutation_id: string;
};

export const END_ENTRY_COLUMNS = [
  'session_id',
  'entry_id',
  'end_index',
  'slot',
  'arrows_json',
  'flags_json',
  'revision',
  'written_by',
  'written_at',
  'mutation_id',
] as const satisfies readonly (keyof EndEntryRow)[];

export const SETTLEMENT_COLUMNS = [
  'session_id',
  'entry_id',
  'end_index',
  'arrows_json',
  'disputed_json',
  'basis_json',
  'settled_by',
  'settled_at',
  'mutation_id',
] as const satisfies readonly (keyof SettlementRow)[];

export const toEndRecord = (row: EndEntryRow): EndRecordDto => ({
  sessionId: row.session_id,
  entryId: row.entry_id,
  endIndex: row.end_index,
  slot: row.slot,
  arrows: JSON.parse(row.arrows_json) as ArrowValue[],
  flags: JSON.parse(row.flags_json) as { index: number; flag: ArrowFlag }[],
  revision: row.revision,
  writtenBy: row.written_by,
  writtenAt: row.written_at,
});

export const toSettlement = (row: SettlementRow): SettlementDto => ({
  sessionId: row.session_id,
  entryId: row.entry_id,
  endIndex: row.end_index,
  arrows: JSON.parse(row.arrows_json) as ArrowValue[],
  disputed: JSON.parse(row.disputed_json) as number[],
  basis: JSON.parse(row.basis_json) as { first: number; second: number },
  settledBy: row.settled_by,
  settledAt: row.settled_at,
});
