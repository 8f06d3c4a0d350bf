import type { ArrowValue, EndFacts } from '../../../src/core';
import type { EndSignatureDto, RulingDto } from '../../../src/contract/judging';
import type { Db } from '../../db';
import {
  END_ENTRY_COLUMNS,
  SETTLEMENT_COLUMNS,
  toEndSignature,
  toRuling,
  type EndEntryRow,
  type EndSignatureRow,
  type RulingRow,
  type SettlementRow,
} from '../sync/fieldRows';

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

const writer = (r: EndEntryRow | undefined) =>
  r && {
    arrows: JSON.parse(r.arrows_json) as ArrowValue[],
    revision: r.revision,
    flags: JSON.parse(r.flags_json) as { index: number; flag: string }[],
  };

/**
 * A stored end as core `endView` reads it. With `signed: false` the signature is left out: what
 * the records alone decide (verification compares the two).
 */
export function endFactsOf(end: StoredEnd, options: { signed?: boolean } = {}): EndFacts {
  const s = end.settlement;
  return {
    first: writer(end.first),
    second: writer(end.second),
    settlement: s && {
      arrows: JSON.parse(s.arrows_json) as ArrowValue[],
      disputed: JSON.parse(s.disputed_json) as number[],
      basis: JSON.parse(s.basis_json) as { first: number; second: number },
    },
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
    const key = `${entryId}:${endIndex}`;
    let end = ends.get(key);
    if (!end) ends.set(key, (end = {}));
    return end;
  };
  const of = (table: string) => db(table).where({ session_id: sessionId }).whereIn('entry_id', entryIds);

  for (const r of (await of('end_entries').select(END_ENTRY_COLUMNS)) as EndEntryRow[])
    at(r.entry_id, r.end_index)[r.slot === 1 ? 'first' : 'second'] = r;
  for (const s of (await of('end_settlements').select(SETTLEMENT_COLUMNS)) as SettlementRow[])
    at(s.entry_id, s.end_index).settlement = s;
  const rulings = (await db('end_rulings as t')
    .join('users as u', 'u.id', 't.judged_by')
    .where('t.session_id', sessionId)
    .whereIn('t.entry_id', entryIds)
    .orderBy('t.id')
    .select('t.*', 'u.display_name')) as (RulingRow & { id: number; display_name: string })[];
  for (const { id, display_name, ...row } of rulings) {
    const end = at(row.entry_id, row.end_index);
    end.ruling = toRuling(id, row, display_name);
    end.rulings = [...(end.rulings ?? []), end.ruling];
  }
  const signatures = (await db('end_signatures as t')
    .join('users as u', 'u.id', 't.signed_by')
    .where('t.session_id', sessionId)
    .whereIn('t.entry_id', entryIds)
    .whereNull('t.superseded_at')
    .select('t.*', 'u.display_name')) as (EndSignatureRow & { id: number; display_name: string })[];
  for (const { id, display_name, ...row } of signatures)
    at(row.entry_id, row.end_index).signature = toEndSignature(id, row, display_name);

  await labelTranscriptions(db, ends.values());

  return {
    end: (entryId, endIndex) => ends.get(`${entryId}:${endIndex}`) ?? {},
    facts: (entryId, endIndex, options) => endFactsOf(ends.get(`${entryId}:${endIndex}`) ?? {}, options),
  };
}
