import { endsOfRound, type EndFacts, type RoundDefinition, type RoundEnd } from '../../../src/core';
import type { BowStyleName } from '../../../src/contract/events';
import type { CardSignatureDto, EndSignatureDto, RulingDto } from '../../../src/contract/judging';
import type { EndRecordDto, Mutation, SettlementDto, Task } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { endFactsOf } from '../judging/endRecords';
import {
  END_ENTRY_COLUMNS,
  SETTLEMENT_COLUMNS,
  toCardSignature,
  toEndSignature,
  toRuling,
  type CardSignatureRow,
  type EndEntryRow,
  type EndSignatureRow,
  type RulingRow,
  type SettlementRow,
} from './fieldRows';

export type FieldSession = { id: number; eventId: number; name: string; closed: boolean };

/** Where an archer shoots in a session, what, and the pushing person's task on that target. */
export type Placement = {
  session: FieldSession;
  entryId: number;
  archerName: string;
  /** The account linked to the entry (the archer who countersigns), if any. */
  archerUserId: number | null;
  divisionName: string;
  targetNumber: number;
  bowStyle: BowStyleName;
  /** Null when the archer's division has no round in the session. */
  round: RoundDefinition | null;
  ends: RoundEnd[];
  /** The pushing person's task on the archer's target, if they are in its group. */
  task: Task | undefined;
};

export type ChangeRecord =
  | { type: 'end'; record: EndRecordDto }
  | { type: 'settlement'; record: SettlementDto }
  | { type: 'ruling'; record: RulingDto }
  | { type: 'signature'; record: EndSignatureDto }
  | { type: 'card-signature'; record: CardSignatureDto };

/** A stored or new row of an append-only judging table; `id` is known once it is written. */
type Held<Row, Dto> = { id: number | undefined; row: Row; dto: Dto };
export type RulingHeld = Held<RulingRow, RulingDto>;
export type EndSignatureHeld = Held<EndSignatureRow, EndSignatureDto>;
export type CardSignatureHeld = Held<CardSignatureRow, CardSignatureDto>;

/** Judging writes in the order they were applied: ids of earlier ones are needed by later ones. */
type JudgeOp =
  | {
      op: 'insert';
      table: 'end_rulings' | 'end_signatures' | 'card_signatures';
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

const endKey = (sessionId: number, entryId: number, endIndex: number) =>
  `${sessionId}:${entryId}:${endIndex}`;
const cardKey = (sessionId: number, entryId: number) => `${sessionId}:${entryId}`;

// Rounds are stored as JSON snapshots; the same few strings come back on every push.
const rounds = new Map<string, { round: RoundDefinition; ends: RoundEnd[] }>();
function parseRound(json: string): { round: RoundDefinition; ends: RoundEnd[] } {
  let parsed = rounds.get(json);
  if (!parsed) {
    const round = JSON.parse(json) as RoundDefinition;
    parsed = { round, ends: endsOfRound(round) };
    if (rounds.size > 200) rounds.clear();
    rounds.set(json, parsed);
  }
  return parsed;
}

const hasEnd = (m: Mutation): m is Extract<Mutation, { args: { endIndex: number } }> =>
  m.kind !== 'card.sign';

/**
 * One push as a unit of work: everything its mutations are checked against is read up front
 * (a few queries whatever the batch size), the mutations are applied in order to this
 * in-memory state by the rules, and `flush` writes the outcome back with multi-row statements.
 * It lives inside the push's transaction, so what it read stays true until it writes.
 */
export class FieldBatch {
  private readonly sessions = new Map<number, FieldSession>();
  private readonly placements = new Map<string, Placement>();
  private readonly records = new Map<string, EndEntryRow>();
  private readonly touchedRecords = new Set<string>();
  private readonly settlements = new Map<string, SettlementRow>();
  private readonly touchedSettlements = new Set<string>();
  /** The latest ruling of each end the batch may touch. */
  private readonly rulings = new Map<string, RulingHeld>();
  /** The current (not superseded) judge signature of each end. */
  private readonly endSignatures = new Map<string, EndSignatureHeld>();
  /** The current card signatures of each card, by role. */
  private readonly cardSignatures = new Map<
    string,
    Partial<Record<'archer' | 'scorer', CardSignatureHeld>>
  >();
  /** In a writers' batch, only whether each named end is ruled on or signed. */
  private readonly judgedEnds = new Map<string, 'ruled' | 'signed'>();
  private readonly judgeOf = new Set<number>();
  private readonly photoEvents = new Map<number, number>();
  private readonly ops: JudgeOp[] = [];
  /** Applied effects in order, for the change log. */
  readonly changes: { placement: Placement; change: ChangeRecord }[] = [];
  /** Cards that became final (both signatures) in this batch, to mail once it is committed. */
  readonly finalCards: { sessionId: number; entryId: number }[] = [];
  /** The pushing person's name, as signatures show it. */
  personName = '';

  private constructor(readonly userId: number) {}

  static async load(trx: Db, userId: number, mutations: readonly Mutation[]): Promise<FieldBatch> {
    const batch = new FieldBatch(userId);
    if (mutations.length === 0) return batch;
    const sessionIds = [...new Set(mutations.map((m) => m.args.sessionId))];
    const entryIds = [...new Set(mutations.map((m) => m.args.entryId))];
    const endIndexes = [...new Set(mutations.filter(hasEnd).map((m) => m.args.endIndex))];
    const judging = mutations.some((m) => m.kind !== 'end.write' && m.kind !== 'end.settle');

    // Sessions, the archers' places and rounds, and this person's task on each archer's target: one query.
    const rows = (await trx('event_sessions as s')
      .leftJoin('target_assignments as ta', (j) =>
        j.on('ta.session_id', 's.id').andOnIn('ta.entry_id', entryIds),
      )
      .leftJoin('entries as e', 'e.id', 'ta.entry_id')
      .leftJoin('divisions as d', 'd.id', 'e.division_id')
      .leftJoin('session_divisions as sd', (j) =>
        j.on('sd.session_id', 's.id').andOn('sd.division_id', 'e.division_id'),
      )
      .leftJoin('target_members as tm', (j) =>
        j
          .on('tm.session_id', 's.id')
          .andOn('tm.target_number', 'ta.target_number')
          .andOnVal('tm.user_id', '=', userId),
      )
      .whereIn('s.id', sessionIds)
      .select(
        's.id as session_id',
        's.event_id',
        's.name as session_name',
        's.closed_at',
        'ta.entry_id',
        'ta.target_number',
        'e.name as archer_name',
        'e.user_id as archer_user_id',
        'd.name as division_name',
        'd.bow_style',
        'sd.round_json',
        'tm.task',
      )) as {
      session_id: number;
      event_id: number;
      session_name: string;
      closed_at: string | null;
      entry_id: number | null;
      target_number: number | null;
      archer_name: string | null;
      archer_user_id: number | null;
      division_name: string | null;
      bow_style: BowStyleName | null;
      round_json: string | null;
      task: Task | null;
    }[];
    for (const r of rows) {
      let session = batch.sessions.get(r.session_id);
      if (!session) {
        session = { id: r.session_id, eventId: r.event_id, name: r.session_name, closed: !!r.closed_at };
        batch.sessions.set(session.id, session);
      }
      if (r.entry_id === null) continue;
      const parsed = r.round_json ? parseRound(r.round_json) : null;
      batch.placements.set(`${r.session_id}:${r.entry_id}`, {
        session,
        entryId: r.entry_id,
        archerName: r.archer_name!,
        archerUserId: r.archer_user_id,
        divisionName: r.division_name!,
        targetNumber: Number(r.target_number),
        bowStyle: r.bow_style!,
        round: parsed?.round ?? null,
        ends: parsed?.ends ?? [],
        task: r.task ?? undefined,
      });
    }

    // The writers' records of every end the batch names (a superset; filtered by key).
    const near = (table: string) =>
      trx(table)
        .whereIn('session_id', sessionIds)
        .whereIn('entry_id', entryIds)
        .whereIn('end_index', endIndexes);
    if (endIndexes.length > 0) {
      for (const r of (await near('end_entries').select(END_ENTRY_COLUMNS)) as EndEntryRow[]) {
        batch.records.set(`${endKey(r.session_id, r.entry_id, r.end_index)}:${r.slot}`, r);
      }
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
        const key = endKey(r.session_id, r.entry_id, r.end_index);
        if (batch.judgedEnds.get(key) !== 'signed') batch.judgedEnds.set(key, r.how);
      }
      return batch;
    }
    await batch.loadJudging(trx, mutations, { sessionIds, entryIds, endIndexes });
    return batch;
  }

  /**
   * What judging mutations are checked against: the settlements of the named ends, the latest
   * ruling of each, the current signatures of every end of these archers (a card needs all of
   * them) and of their cards, the person's judge roles and name, and the photos named.
   */
  private async loadJudging(
    trx: Db,
    mutations: readonly Mutation[],
    ids: { sessionIds: number[]; entryIds: number[]; endIndexes: number[] },
  ): Promise<void> {
    const ofCards = (table: string) =>
      trx(`${table} as t`).whereIn('t.session_id', ids.sessionIds).whereIn('t.entry_id', ids.entryIds);
    const settlements = (await ofCards('end_settlements')
      .whereIn('t.end_index', ids.endIndexes)
      .select(SETTLEMENT_COLUMNS.map((c) => `t.${c}`))) as SettlementRow[];
    for (const r of settlements) this.settlements.set(endKey(r.session_id, r.entry_id, r.end_index), r);
    const rulings = (await ofCards('end_rulings')
      .whereIn('t.end_index', ids.endIndexes)
      .orderBy('t.id')
      .select('t.*')) as (RulingRow & { id: number })[];
    for (const { id, ...row } of rulings)
      this.rulings.set(endKey(row.session_id, row.entry_id, row.end_index), {
        id,
        row,
        dto: toRuling(id, row),
      });
    const signatures = (await ofCards('end_signatures')
      .join('users as u', 'u.id', 't.signed_by')
      .whereNull('t.superseded_at')
      .select('t.*', 'u.display_name')) as (EndSignatureRow & { id: number; display_name: string })[];
    for (const { id, display_name, ...row } of signatures) {
      this.endSignatures.set(endKey(row.session_id, row.entry_id, row.end_index), {
        id,
        row,
        dto: toEndSignature(id, row, display_name),
      });
    }
    const cardSignatures = (await ofCards('card_signatures')
      .join('users as u', 'u.id', 't.user_id')
      .whereNull('t.superseded_at')
      .select('t.*', 'u.display_name')) as (CardSignatureRow & { id: number; display_name: string })[];
    for (const { id, display_name, ...row } of cardSignatures) {
      const key = cardKey(row.session_id, row.entry_id);
      const held = this.cardSignatures.get(key) ?? {};
      held[row.role] = { id, row, dto: toCardSignature(id, row, display_name) };
      this.cardSignatures.set(key, held);
    }

    const eventIds = [...new Set([...this.sessions.values()].map((s) => s.eventId))];
    const roles = await trx('event_roles')
      .where({ user_id: this.userId, role: 'judge' })
      .whereIn('event_id', eventIds)
      .pluck('event_id');
    for (const eventId of roles) this.judgeOf.add(Number(eventId));
    const photoIds = mutations.flatMap((m) =>
      m.kind === 'end.rule' && m.args.photoId !== undefined ? [m.args.photoId] : [],
    );
    if (photoIds.length > 0) {
      for (const p of await trx('photos').whereIn('id', photoIds).select('id', 'event_id'))
        this.photoEvents.set(p.id, p.event_id);
    }
    const person = await trx('users').where({ id: this.userId }).first('display_name');
    this.personName = person?.display_name ?? '';
  }

  session(sessionId: number): FieldSession | undefined {
    return this.sessions.get(sessionId);
  }

  placement(session: FieldSession, entryId: number): Placement | undefined {
    return this.placements.get(`${session.id}:${entryId}`);
  }

  isJudge(eventId: number): boolean {
    return this.judgeOf.has(eventId);
  }

  /** The event a photo belongs to, if the photo exists. */
  photoEvent(photoId: number): number | undefined {
    return this.photoEvents.get(photoId);
  }

  record(sessionId: number, entryId: number, endIndex: number, slot: 1 | 2): EndEntryRow | undefined {
    return this.records.get(`${endKey(sessionId, entryId, endIndex)}:${slot}`);
  }

  /** Whether a judge has signed or ruled on an end (a signature wins: it is the stronger refusal). */
  judged(sessionId: number, entryId: number, endIndex: number): 'signed' | 'ruled' | undefined {
    const key = endKey(sessionId, entryId, endIndex);
    if (this.endSignatures.has(key)) return 'signed';
    if (this.rulings.has(key)) return 'ruled';
    return this.judgedEnds.get(key);
  }

  ruling(sessionId: number, entryId: number, endIndex: number): RulingHeld | undefined {
    return this.rulings.get(endKey(sessionId, entryId, endIndex));
  }

  endSignature(sessionId: number, entryId: number, endIndex: number): EndSignatureHeld | undefined {
    return this.endSignatures.get(endKey(sessionId, entryId, endIndex));
  }

  cardSignature(
    sessionId: number,
    entryId: number,
    role: 'archer' | 'scorer',
  ): CardSignatureHeld | undefined {
    return this.cardSignatures.get(cardKey(sessionId, entryId))?.[role];
  }

  /** An end's records as core `endView` reads them: writers (with flags), settlement, ruling, signature. */
  endFacts(sessionId: number, entryId: number, endIndex: number): EndFacts {
    return endFactsOf({
      first: this.record(sessionId, entryId, endIndex, 1),
      second: this.record(sessionId, entryId, endIndex, 2),
      settlement: this.settlements.get(endKey(sessionId, entryId, endIndex)),
      ruling: this.ruling(sessionId, entryId, endIndex)?.dto,
      signature: this.endSignature(sessionId, entryId, endIndex)?.dto,
    });
  }

  putRecord(placement: Placement, row: EndEntryRow, record: EndRecordDto): void {
    const key = `${endKey(row.session_id, row.entry_id, row.end_index)}:${row.slot}`;
    this.records.set(key, row);
    this.touchedRecords.add(key);
    this.changes.push({ placement, change: { type: 'end', record } });
  }

  putSettlement(placement: Placement, row: SettlementRow, record: SettlementDto): void {
    const key = endKey(row.session_id, row.entry_id, row.end_index);
    this.settlements.set(key, row);
    this.touchedSettlements.add(key);
    this.changes.push({ placement, change: { type: 'settlement', record } });
  }

  /**
   * A new ruling on an end. It is the only correction of a signed end: the end's signature and
   * the card's signatures are marked superseded by it (their rows stay, as history).
   */
  putRuling(placement: Placement, row: RulingRow): void {
    const held: RulingHeld = { id: undefined, row, dto: toRuling(0, row) };
    const key = endKey(row.session_id, row.entry_id, row.end_index);
    this.rulings.set(key, held);
    this.ops.push({ op: 'insert', table: 'end_rulings', held });
    this.changes.push({ placement, change: { type: 'ruling', record: held.dto } });

    const signature = this.endSignatures.get(key);
    if (signature) {
      this.endSignatures.delete(key);
      const snapshot: EndSignatureDto = { ...signature.dto, supersededAt: row.judged_at };
      this.ops.push({
        op: 'supersede',
        table: 'end_signatures',
        held: signature,
        by: held,
        at: row.judged_at,
        snapshot,
      });
      this.changes.push({ placement, change: { type: 'signature', record: snapshot } });
    }
    const card = this.cardSignatures.get(cardKey(row.session_id, row.entry_id));
    for (const role of ['archer', 'scorer'] as const) {
      const signed = card?.[role];
      if (!signed) continue;
      delete card[role];
      const snapshot: CardSignatureDto = { ...signed.dto, supersededAt: row.judged_at };
      this.ops.push({
        op: 'supersede',
        table: 'card_signatures',
        held: signed,
        by: held,
        at: row.judged_at,
        snapshot,
      });
      this.changes.push({ placement, change: { type: 'card-signature', record: snapshot } });
    }
  }

  putEndSignature(placement: Placement, row: EndSignatureRow, signedByName: string): void {
    const held: EndSignatureHeld = { id: undefined, row, dto: toEndSignature(0, row, signedByName) };
    this.endSignatures.set(endKey(row.session_id, row.entry_id, row.end_index), held);
    this.ops.push({ op: 'insert', table: 'end_signatures', held });
    this.changes.push({ placement, change: { type: 'signature', record: held.dto } });
  }

  putCardSignature(placement: Placement, row: CardSignatureRow, name: string): void {
    const held: CardSignatureHeld = { id: undefined, row, dto: toCardSignature(0, row, name) };
    const key = cardKey(row.session_id, row.entry_id);
    const card = this.cardSignatures.get(key) ?? {};
    card[row.role] = held;
    this.cardSignatures.set(key, card);
    this.ops.push({ op: 'insert', table: 'card_signatures', held });
    this.changes.push({ placement, change: { type: 'card-signature', record: held.dto } });
    if (card.archer && card.scorer)
      this.finalCards.push({ sessionId: row.session_id, entryId: row.entry_id });
  }

  /**
   * Writes the batch's effects: the final record of each end it touched, the settlements, the
   * judging rows in the order applied (a ruling's id is what a superseded signature points at),
   * and one change-log row per applied effect in the order applied. Change versions follow
   * commit order because SQLite has a single writer; a PostgreSQL deployment would need pushes
   * to lock the log (or hand out versions at commit) to keep that true.
   */
  async flush(trx: Db): Promise<void> {
    const chunks = <T>(rows: T[], size: number) =>
      Array.from({ length: Math.ceil(rows.length / size) }, (_, i) => rows.slice(i * size, (i + 1) * size));
    const records = [...this.touchedRecords].map((k) => this.records.get(k)!);
    for (const part of chunks(records, 200)) {
      await trx('end_entries')
        .insert(part)
        .onConflict(['session_id', 'entry_id', 'end_index', 'slot'])
        .merge();
    }
    const settlements = [...this.touchedSettlements].map((k) => this.settlements.get(k)!);
    for (const part of chunks(settlements, 200)) {
      await trx('end_settlements').insert(part).onConflict(['session_id', 'entry_id', 'end_index']).merge();
    }
    for (const op of this.ops) {
      if (op.op === 'insert') {
        const [inserted] = (await trx(op.table).insert(op.held.row).returning('id')) as { id: number }[];
        op.held.id = inserted!.id;
        op.held.dto.id = inserted!.id;
      } else {
        await trx(op.table)
          .where({ id: op.held.id })
          .update({ superseded_at: op.at, superseded_by_ruling: op.by.id });
        op.snapshot.id = op.held.id!;
        if ('supersededByRuling' in op.snapshot) op.snapshot.supersededByRuling = op.by.id!;
      }
    }
    const changeRows = this.changes.map(({ placement, change }) => ({
      event_id: placement.session.eventId,
      session_id: placement.session.id,
      target_number: placement.targetNumber,
      type: change.type,
      record_json: JSON.stringify(change.record),
    }));
    for (const part of chunks(changeRows, 200)) await trx('changes').insert(part);
  }
}
