import type { EndFacts } from '../../../src/core';
import type { EndSignatureDto, RulingDto } from '../../../src/contract/judging';
import { endKeyOf } from '../../../src/contract/recordKeys';
import type { Db } from '../../db';
import {
  END_ENTRY_COLUMNS,
  SETTLEMENT_COLUMNS,
  decodeEndEntry,
  decodeSettlement,
  type EndEntryRow,
  type SettlementRow,
} from '../sync/fieldRows';
import { loadRulingsAndSignatures } from '../sync/judgingRows';

/**
 * Everything stored about one end: the writers' records, the settlement, the latest ruling (and
 * every ruling, oldest first, for the card's history), the current signature.
 */
export type StoredEnd = {
  first?: EndEntryRow | undefined;
  second?: EndEntryRow | undefined;
  settlement?: SettlementRow | undefined;
  ruling?: RulingDto | undefined;
  rulings?: RulingDto[] | undefined;
  signature?: EndSignatureDto | undefined;
  /** The judge who transcribed a writer's or the caller's record of it from a file no phone signed. */
  transcribedBy?: string;
};

export type EndRecords = {
  end(entryId: number, endIndex: number): StoredEnd;
  /** The end as core `endView` reads it (see endFactsOf). */
  facts(entryId: number, endIndex: number, options?: { signed?: boolean }): EndFacts;
};

const writer = (r: EndEntryRow | undefined) => r && { ...decodeEndEntry(r), revision: r.revision };

/**
 * A stored end as core `endView` reads it. With `signed: false` the signature is left out: what
 * the records alone decide (verification compares the two).
 */
export function endFactsOf(end: StoredEnd, options: { signed?: boolean } = {}): EndFacts {
  const s = end.settlement;
  return {
    first: writer(end.first),
    second: writer(end.second),
    settlement: s && decodeSettlement(s),
    ruling: end.ruling && { arrows: end.ruling.arrows },
    signedArrows: options.signed === false ? undefined : end.signature?.arrows,
  };
}

/** Names the judge on each end whose current records include a transcription (a few queries in all). */
async function labelTranscriptions(db: Db, ends: Iterable<StoredEnd>): Promise<void> {
  const byMutation = new Map<string, StoredEnd>();
  for (const end of ends)
    for (const r of [end.first, end.second, end.settlement]) if (r) byMutation.set(r.mutation_id, end);
  const ids = [...byMutation.keys()];
  for (let i = 0; i < ids.length; i += 500) {
    const rows = (await db('mutations as m')
      .join('users as u', 'u.id', 'm.transcribed_by')
      .whereIn('m.mutation_uuid', ids.slice(i, i + 500))
      .select('m.mutation_uuid', 'u.display_name')) as { mutation_uuid: string; display_name: string }[];
    for (const row of rows) byMutation.get(row.mutation_uuid)!.transcribedBy = row.display_name;
  }
}

/** Reads every stored end of some archers in a session, in four queries (and one per 500 records for transcriptions). */
export async function loadEndRecords(
  db: Db,
  sessionId: number,
  entryIds: readonly number[],
): Promise<EndRecords> {
  const ends = new Map<string, StoredEnd>();
  const at = (entryId: number, endIndex: number): StoredEnd => {
    const key = endKeyOf(sessionId, entryId, endIndex);
    let end = ends.get(key);
    if (!end) ends.set(key, (end = {}));
    return end;
  };
  const of = (table: string) => db(table).where({ session_id: sessionId }).whereIn('entry_id', entryIds);

  for (const r of (await of('end_entries').select(END_ENTRY_COLUMNS)) as EndEntryRow[])
    at(r.entry_id, r.end_index)[r.slot === 1 ? 'first' : 'second'] = r;
  for (const s of (await of('end_settlements').select(SETTLEMENT_COLUMNS)) as SettlementRow[])
    at(s.entry_id, s.end_index).settlement = s;
  const { rulings, signatures } = await loadRulingsAndSignatures(db, { sessionIds: [sessionId], entryIds });
  for (const { row, dto } of rulings) {
    const end = at(row.entry_id, row.end_index);
    end.ruling = dto;
    end.rulings = [...(end.rulings ?? []), dto];
  }
  for (const { row, dto } of signatures) at(row.entry_id, row.end_index).signature = dto;

  await labelTranscriptions(db, ends.values());

  return {
    end: (entryId, endIndex) => ends.get(endKeyOf(sessionId, entryId, endIndex)) ?? {},
    facts: (entryId, endIndex, options) =>
      endFactsOf(ends.get(endKeyOf(sessionId, entryId, endIndex)) ?? {}, options),
  };
}
