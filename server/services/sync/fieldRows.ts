import type { ArrowValue } from '../../../src/core';
import type { ArrowFlag, EndRecordDto, SettlementDto, WriterSlot } from '../../../src/contract/sync';
import type { CardSignatureDto, EndSignatureDto, RulingDto } from '../../../src/contract/judging';
import { paperWords } from '../signing/cardContent';

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

/*
 * One decoder per table for its `*_json` columns: every reader of a row goes through these.
 */

/** A writer's record's arrows (highest first) and flags (by arrow). */
export const decodeEndEntry = (row: Pick<EndEntryRow, 'arrows_json' | 'flags_json'>) => ({
  arrows: JSON.parse(row.arrows_json) as ArrowValue[],
  flags: JSON.parse(row.flags_json) as { index: number; flag: ArrowFlag }[],
});

/** A settlement's agreed arrows, the positions sent to a judge, and the writers' revisions it was made on. */
export const decodeSettlement = (
  row: Pick<SettlementRow, 'arrows_json' | 'disputed_json' | 'basis_json'>,
) => ({
  arrows: JSON.parse(row.arrows_json) as ArrowValue[],
  disputed: JSON.parse(row.disputed_json) as number[],
  basis: JSON.parse(row.basis_json) as { first: number; second: number },
});

/** The arrows of a ruling or an end signature (both keep the end's values highest first). */
export const decodeJudgedArrows = (row: { arrows_json: string }): ArrowValue[] =>
  JSON.parse(row.arrows_json) as ArrowValue[];

export const toEndRecord = (row: EndEntryRow): EndRecordDto => ({
  sessionId: row.session_id,
  entryId: row.entry_id,
  endIndex: row.end_index,
  slot: row.slot,
  ...decodeEndEntry(row),
  revision: row.revision,
  writtenBy: row.written_by,
  writtenAt: row.written_at,
});

export const toSettlement = (row: SettlementRow): SettlementDto => ({
  sessionId: row.session_id,
  entryId: row.entry_id,
  endIndex: row.end_index,
  ...decodeSettlement(row),
  settledBy: row.settled_by,
  settledAt: row.settled_at,
});

/** A judge's ruling on an end (table end_rulings, append-only; the id is the database's). */
export type RulingRow = {
  session_id: number;
  entry_id: number;
  end_index: number;
  arrows_json: string;
  reason: string;
  photo_id: number | null;
  judged_by: number;
  judged_at: string;
  mutation_id: string;
};

export const RULING_COLUMNS = [
  'session_id',
  'entry_id',
  'end_index',
  'arrows_json',
  'reason',
  'photo_id',
  'judged_by',
  'judged_at',
  'mutation_id',
] as const satisfies readonly (keyof RulingRow)[];

/** A judge's signature on an end (table end_signatures). */
export type EndSignatureRow = {
  session_id: number;
  entry_id: number;
  end_index: number;
  arrows_json: string;
  content_hash: string;
  jws: string;
  signed_by: number;
  signed_at: string;
  mutation_id: string;
  superseded_at: string | null;
  superseded_by_ruling: number | null;
};

/** The archer's or the scorer's signature on a card (table card_signatures). */
export type CardSignatureRow = {
  session_id: number;
  entry_id: number;
  role: 'archer' | 'scorer';
  user_id: number;
  content_hash: string;
  jws: string;
  /** The server's time of signing; `phone_at` is the signing phone's own clock. */
  signed_at: string;
  phone_at: string | null;
  /** The content as signed (canonical JSON): verification compares it with the card as it is now. */
  content_json: string | null;
  /** A countersignature made on paper, recorded by the judge `user_id`, with the photo of the paper card. */
  on_paper: boolean | number;
  photo_id: number | null;
  mutation_id: string;
  superseded_at: string | null;
  superseded_by_ruling: number | null;
};

export const toRuling = (id: number, row: RulingRow, judgedByName: string): RulingDto => ({
  id,
  sessionId: row.session_id,
  entryId: row.entry_id,
  endIndex: row.end_index,
  arrows: decodeJudgedArrows(row),
  reason: row.reason,
  photoId: row.photo_id,
  judgedBy: row.judged_by,
  judgedByName,
  judgedAt: row.judged_at,
});

export const toEndSignature = (id: number, row: EndSignatureRow, signedByName: string): EndSignatureDto => ({
  id,
  sessionId: row.session_id,
  entryId: row.entry_id,
  endIndex: row.end_index,
  arrows: decodeJudgedArrows(row),
  contentHash: row.content_hash,
  signedBy: row.signed_by,
  signedByName,
  signedAt: row.signed_at,
  supersededAt: row.superseded_at,
  supersededByRuling: row.superseded_by_ruling,
  jws: row.jws,
});

/**
 * A card signature as phones see it. `signer` is the account's name; a countersignature made on
 * paper shows the archer's name, labelled with the judge who recorded it.
 */
export const toCardSignature = (
  id: number,
  row: CardSignatureRow,
  signer: string,
  archer: string,
): CardSignatureDto => ({
  id,
  sessionId: row.session_id,
  entryId: row.entry_id,
  role: row.role,
  userId: row.user_id,
  name: row.on_paper ? archer : signer,
  signedAt: row.signed_at,
  phoneAt: row.phone_at,
  ...(row.on_paper ? { onPaper: paperWords(signer) } : {}),
  supersededAt: row.superseded_at,
  jws: row.jws,
});
