import type { EndSettleArgs, EndWriteArgs } from '../../../src/contract/sync';
import type { EndRuleArgs } from '../../../src/contract/judging';
import type { Db } from '../../db';
import { nextEndEntry, rulingRow, settlementRow } from './effects';
import {
  END_ENTRY_COLUMNS,
  RULING_COLUMNS,
  SETTLEMENT_COLUMNS,
  type EndEntryRow,
  type RulingRow,
  type SettlementRow,
} from './fieldRows';

/**
 * The field tables the log rebuilds. Signatures (end_signatures, card_signatures) are not among
 * them: an ES256 signature is randomized, so a replay could never make the same one again, and
 * a signature is itself an append-only record of its own — kept, never recomputed.
 */
export type FieldState = { endEntries: EndEntryRow[]; settlements: SettlementRow[]; rulings: RulingRow[] };

type LogRow = { mutation_uuid: string; user_id: number; kind: string; args_json: string; at: string };

const endEntryKey = (r: { session_id: number; entry_id: number; end_index: number; slot: number }) =>
  `${r.session_id}:${r.entry_id}:${r.end_index}:${r.slot}`;
const settlementKey = (r: { session_id: number; entry_id: number; end_index: number }) =>
  `${r.session_id}:${r.entry_id}:${r.end_index}`;
const rulingKey = (r: RulingRow) => `${settlementKey(r)}:${r.judged_at}:${r.mutation_id}`;

/**
 * Recomputes the current writer records, settlements and rulings purely from the applied
 * mutations in the log, in the order they were applied, with the same effect functions the live
 * push uses; a late change held for a judge counts where the judge accepted it. Signing
 * mutations have no effect here (see FieldState).
 */
export async function replayLog(db: Db): Promise<FieldState> {
  const log = (await db('mutations')
    .whereIn('status', ['applied', 'held'])
    .orderBy('id')
    .select('mutation_uuid', 'user_id', 'kind', 'args_json', 'at', 'status')) as (LogRow & {
    status: string;
  })[];
  // A held change (late for a closed session) takes effect where a judge accepted it.
  const held = new Map(log.filter((m) => m.status === 'held').map((m) => [m.mutation_uuid, m]));
  const endEntries = new Map<string, EndEntryRow>();
  const settlements = new Map<string, SettlementRow>();
  const rulings: RulingRow[] = [];
  for (const entry of log) {
    if (entry.status === 'held' || entry.kind === 'late.reject') continue;
    const m =
      entry.kind === 'late.accept'
        ? held.get((JSON.parse(entry.args_json) as { mutationId: string }).mutationId)!
        : entry;
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
    } else if (m.kind === 'end.rule') {
      rulings.push(rulingRow(JSON.parse(m.args_json) as EndRuleArgs, by));
    } else if (
      // Signatures, shoot-off arrows, match cards and practice are records of their own, not replayed.
      !['end.sign', 'card.sign', 'shootoff.record'].includes(m.kind) &&
      !m.kind.startsWith('match.') &&
      !m.kind.startsWith('practice.')
    ) {
      throw new Error(`The mutation log holds an applied change of unknown kind "${m.kind}".`);
    }
  }
  return { endEntries: [...endEntries.values()], settlements: [...settlements.values()], rulings };
}

/**
 * Replaces end_entries and end_settlements with the replay of the log, and brings end_rulings in
 * line with it, in one transaction. Rulings are matched by the mutation that made them (their
 * ids stay, since superseded signatures point at them): a damaged row is rewritten, a missing
 * one inserted, one the log does not hold removed.
 */
export async function rebuildFromLog(db: Db): Promise<FieldState> {
  return db.transaction(async (trx) => {
    const state = await replayLog(trx);
    await trx('end_settlements').delete();
    await trx('end_entries').delete();
    for (let i = 0; i < state.endEntries.length; i += 50)
      await trx('end_entries').insert(state.endEntries.slice(i, i + 50));
    for (let i = 0; i < state.settlements.length; i += 50)
      await trx('end_settlements').insert(state.settlements.slice(i, i + 50));

    const stored = new Set<string>(await trx('end_rulings').pluck('mutation_id'));
    const replayed = new Set(state.rulings.map((r) => r.mutation_id));
    const strays = [...stored].filter((id) => !replayed.has(id));
    if (strays.length > 0) await trx('end_rulings').whereIn('mutation_id', strays).delete();
    for (const row of state.rulings) {
      if (stored.has(row.mutation_id))
        await trx('end_rulings').where({ mutation_id: row.mutation_id }).update(row);
      else await trx('end_rulings').insert(row);
    }
    return state;
  });
}

/** The current tables in the same shape as a replay, sorted by key, for comparing the two. */
export async function readFieldState(db: Db): Promise<FieldState> {
  const endEntries = (await db('end_entries').select(END_ENTRY_COLUMNS)) as EndEntryRow[];
  const settlements = (await db('end_settlements').select(SETTLEMENT_COLUMNS)) as SettlementRow[];
  const rulings = (await db('end_rulings').orderBy('id').select(RULING_COLUMNS)) as RulingRow[];
  return sortFieldState({ endEntries, settlements, rulings });
}

export function sortFieldState(state: FieldState): FieldState {
  const byKey =
    <T>(key: (r: T) => string) =>
    (a: T, b: T) =>
      key(a).localeCompare(key(b));
  return {
    endEntries: [...state.endEntries].sort(byKey(endEntryKey)),
    settlements: [...state.settlements].sort(byKey(settlementKey)),
    rulings: [...state.rulings].sort(byKey(rulingKey)),
  };
}
