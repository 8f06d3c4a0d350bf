import type { EndSettleArgs, EndWriteArgs } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { nextEndEntry, settlementRow } from './effects';
import { END_ENTRY_COLUMNS, SETTLEMENT_COLUMNS, type EndEntryRow, type SettlementRow } from './fieldRows';

export type FieldState = { endEntries: EndEntryRow[]; settlements: SettlementRow[] };

type LogRow = { mutation_uuid: string; user_id: number; kind: string; args_json: string; at: string };

const endEntryKey = (r: { session_id: number; entry_id: number; end_index: number; slot: number }) =>
  `${r.session_id}:${r.entry_id}:${r.end_index}:${r.slot}`;
const settlementKey = (r: { session_id: number; entry_id: number; end_index: number }) =>
  `${r.session_id}:${r.entry_id}:${r.end_index}`;

/**
 * Recomputes the current writer records and settlements purely from the applied mutations in the
 * log, in the order they were applied, with the same effect functions the live push uses.
 */
export async function replayLog(db: Db): Promise<FieldState> {
  const log = (await db('mutations')
    .where({ status: 'applied' })
    .orderBy('id')
    .select('mutation_uuid', 'user_id', 'kind', 'args_json', 'at')) as LogRow[];
  const endEntries = new Map<string, EndEntryRow>();
  const settlements = new Map<string, SettlementRow>();
  for (const m of log) {
    const by = { userId: m.user_id, at: m.at, mutationId: m.mutation_uuid };
    if (m.kind === 'end.write') {
      const args = JSON.parse(m.args_json) as EndWriteArgs;
      const key = endEntryKey({
        session_id: args.sessionId,
        entry_id: args.entryId,
        end_index: args.endIndex,
        slot: args.slot,
      });
      endEntries.set(key, nextEndEntry(endEntries.get(key), args, by));
    } else if (m.kind === 'end.settle') {
      const row = settlementRow(JSON.parse(m.args_json) as EndSettleArgs, by);
      settlements.set(settlementKey(row), row);
    } else {
      throw new Error(`The mutation log holds an applied change of unknown kind "${m.kind}".`);
    }
  }
  return { endEntries: [...endEntries.values()], settlements: [...settlements.values()] };
}

/** Replaces end_entries and end_settlements with the replay of the log, in one transaction. */
export async function rebuildFromLog(db: Db): Promise<FieldState> {
  return db.transaction(async (trx) => {
    const state = await replayLog(trx);
    await trx('end_settlements').delete();
    await trx('end_entries').delete();
    for (let i = 0; i < state.endEntries.length; i += 50)
      await trx('end_entries').insert(state.endEntries.slice(i, i + 50));
    for (let i = 0; i < state.settlements.length; i += 50)
      await trx('end_settlements').insert(state.settlements.slice(i, i + 50));
    return state;
  });
}

/** The current tables in the same shape as a replay, sorted by key, for comparing the two. */
export async function readFieldState(db: Db): Promise<FieldState> {
  const endEntries = (await db('end_entries').select(END_ENTRY_COLUMNS)) as EndEntryRow[];
  const settlements = (await db('end_settlements').select(SETTLEMENT_COLUMNS)) as SettlementRow[];
  return sortFieldState({ endEntries, settlements });
}

export function sortFieldState(state: FieldState): FieldState {
  const byKey =
    <T>(key: (r: T) => string) =>
    (a: T, b: T) =>
      key(a).localeCompare(key(b));
  return {
    endEntries: [...state.endEntries].sort(byKey(endEntryKey)),
    settlements: [...state.settlements].sort(byKey(settlementKey)),
  };
}
