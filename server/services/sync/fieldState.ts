import type { FieldMutation as Mutation } from '../../../src/contract/sync';
import { cardKeyOf, endKeyOf, recordKeyOf } from '../../../src/contract/recordKeys';
import type { Db } from '../../db';
import {
  END_ENTRY_COLUMNS,
  SETTLEMENT_COLUMNS,
  toCardSignature,
  type CardSignatureRow,
  type EndEntryRow,
  type SettlementRow,
} from './fieldRows';
import { loadPlacements, type FieldSession, type Placement } from './fieldPlacements';
import { loadRulingsAndSignatures } from './judgingRows';
import type { CardSignatureHeld, EndSignatureHeld, RulingHeld } from './fieldWrites';

/** What the mutations of one commit are checked against, keyed by src/contract/recordKeys. */
export type FieldState = {
  sessions: Map<number, FieldSession>;
  /** By `sessionId:entryId`. */
  placements: Map<string, Placement>;
  records: Map<string, EndEntryRow>;
  settlements: Map<string, SettlementRow>;
  /** The latest ruling of each end the batch may touch. */
  rulings: Map<string, RulingHeld>;
  /** The current (not superseded) judge signature of each end. */
  endSignatures: Map<string, EndSignatureHeld>;
  /** The current card signatures of each card, by role. */
  cardSignatures: Map<string, Partial<Record<'archer' | 'scorer', CardSignatureHeld>>>;
  /** In a writers' batch, only whether each named end is ruled on or signed. */
  judgedEnds: Map<string, 'ruled' | 'signed'>;
  /** `userId:eventId` of each pushing person's judge roles. */
  judgeOf: Set<string>;
  /** The pushing people's names, as signatures show them (read when the commit has judging mutations). */
  names: Map<number, string>;
  photos: Map<number, { eventId: number; sha256: string }>;
};

const emptyState = (sessions: Map<number, FieldSession>, placements: Map<string, Placement>): FieldState => ({
  sessions,
  placements,
  records: new Map(),
  settlements: new Map(),
  rulings: new Map(),
  endSignatures: new Map(),
  cardSignatures: new Map(),
  judgedEnds: new Map(),
  judgeOf: new Set(),
  names: new Map(),
  photos: new Map(),
});

const hasEnd = (m: Mutation): m is Extract<Mutation, { args: { endIndex: number } }> =>
  m.kind !== 'card.sign' && m.kind !== 'shootoff.record';

type Ids = { sessionIds: number[]; entryIds: number[]; endIndexes: number[] };

/**
 * Reads what `mutations`, pushed by the people `userIds`, are checked against: a few queries
 * whatever the number of pushes and mutations. Runs inside the commit's transaction, so what it
 * read stays true until the batch is written.
 */
export async function loadFieldState(
  trx: Db,
  mutations: readonly Mutation[],
  userIds: readonly number[],
): Promise<FieldState> {
  if (mutations.length === 0) return emptyState(new Map(), new Map());
  const ids: Ids = {
    sessionIds: [...new Set(mutations.map((m) => m.args.sessionId))],
    entryIds: [...new Set(mutations.map((m) => m.args.entryId))],
    endIndexes: [...new Set(mutations.filter(hasEnd).map((m) => m.args.endIndex))],
  };
  const judging = mutations.some((m) => m.kind !== 'end.write' && m.kind !== 'end.settle');

  const { sessions, placements } = await loadPlacements(trx, ids.sessionIds, ids.entryIds, userIds);
  const state = emptyState(sessions, placements);

  // The writers' records of every end the batch names (a superset; filtered by key).
  const near = (table: string) =>
    trx(table)
      .whereIn('session_id', ids.sessionIds)
      .whereIn('entry_id', ids.entryIds)
      .whereIn('end_index', ids.endIndexes);
  if (ids.endIndexes.length > 0) {
    for (const r of (await near('end_entries').select(END_ENTRY_COLUMNS)) as EndEntryRow[])
      state.records.set(recordKeyOf(r.session_id, r.entry_id, r.end_index, r.slot), r);
  }
  if (!judging) {
    // Writers and callers only need to know which of their ends a judge has ruled on or signed:
    // one query, so the busiest path of the day stays lean.
    const judged = (await near('end_rulings')
      .select('session_id', 'entry_id', 'end_index', trx.raw("'ruled' as how"))
      .unionAll(
        near('end_signatures')
          .whereNull('superseded_at')
          .select('session_id', 'entry_id', 'end_index', trx.raw("'signed' as how")),
      )) as { session_id: number; entry_id: number; end_index: number; how: 'ruled' | 'signed' }[];
    for (const r of judged) {
      const key = endKeyOf(r.session_id, r.entry_id, r.end_index);
      if (state.judgedEnds.get(key) !== 'signed') state.judgedEnds.set(key, r.how);
    }
    return state;
  }
  await loadJudging(trx, state, mutations, userIds, ids);
  return state;
}

/**
 * What judging mutations are checked against: the settlements of the named ends, the latest
 * ruling of each, the current signatures of every end of these archers (a card needs all of
 * them) and of their cards, the people's judge roles and names, and the photos named.
 */
async function loadJudging(
  trx: Db,
  state: FieldState,
  mutations: readonly Mutation[],
  userIds: readonly number[],
  ids: Ids,
): Promise<void> {
  const settlements = (await trx('end_settlements')
    .whereIn('session_id', ids.sessionIds)
    .whereIn('entry_id', ids.entryIds)
    .whereIn('end_index', ids.endIndexes)
    .select(SETTLEMENT_COLUMNS)) as SettlementRow[];
  for (const r of settlements) state.settlements.set(endKeyOf(r.session_id, r.entry_id, r.end_index), r);
  const { rulings, signatures } = await loadRulingsAndSignatures(trx, { ...ids, rulingEnds: ids.endIndexes });
  // Oldest first: the latest ruling of each end is the one kept.
  for (const held of rulings)
    state.rulings.set(endKeyOf(held.row.session_id, held.row.entry_id, held.row.end_index), held);
  for (const held of signatures)
    state.endSignatures.set(endKeyOf(held.row.session_id, held.row.entry_id, held.row.end_index), held);
  const cardSignatures = (await trx('card_signatures as t')
    .join('users as u', 'u.id', 't.user_id')
    .join('entries as e', 'e.id', 't.entry_id')
    .whereIn('t.session_id', ids.sessionIds)
    .whereIn('t.entry_id', ids.entryIds)
    .whereNull('t.superseded_at')
    .select('t.*', 'u.display_name', 'e.name as archer_name')) as (CardSignatureRow & {
    id: number;
    display_name: string;
    archer_name: string;
  })[];
  for (const { id, display_name, archer_name, ...row } of cardSignatures) {
    const key = cardKeyOf(row.session_id, row.entry_id);
    const held = state.cardSignatures.get(key) ?? {};
    held[row.role] = { id, row, dto: toCardSignature(id, row, display_name, archer_name) };
    state.cardSignatures.set(key, held);
  }

  const eventIds = [...new Set([...state.sessions.values()].map((s) => s.eventId))];
  const roles = (await trx('event_roles')
    .where({ role: 'judge' })
    .whereIn('user_id', [...userIds])
    .whereIn('event_id', eventIds)
    .select('user_id', 'event_id')) as { user_id: number; event_id: number }[];
  for (const r of roles) state.judgeOf.add(`${r.user_id}:${r.event_id}`);
  const photoIds = mutations.flatMap((m) =>
    m.kind === 'end.rule' && m.args.photoId !== undefined
      ? [m.args.photoId]
      : m.kind === 'card.sign' && m.args.paper
        ? [m.args.paper.photoId]
        : [],
  );
  if (photoIds.length > 0) {
    for (const p of await trx('photos').whereIn('id', photoIds).select('id', 'event_id', 'sha256'))
      state.photos.set(p.id, { eventId: p.event_id, sha256: p.sha256 });
  }
  const people = (await trx('users')
    .whereIn('id', [...userIds])
    .select('id', 'display_name')) as {
    id: number;
    display_name: string;
  }[];
  for (const p of people) state.names.set(p.id, p.display_name);
}
