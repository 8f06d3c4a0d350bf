import type { EndFacts } from '../../../src/core';
import type { CardSignatureDto, EndSignatureDto, RulingDto } from '../../../src/contract/judging';
import type { EndRecordDto, Mutation, SettlementDto } from '../../../src/contract/sync';
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
import type { ShootOffArrowRow } from '../results/shootOffRows';
import { loadPlacements, type FieldSession, type Placement } from './fieldPlacements';

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

const endKey = (sessionId: number, entryId: number, endIndex: number) =>
  `${sessionId}:${entryId}:${endIndex}`;
const cardKey = (sessionId: number, entryId: number) => `${sessionId}:${entryId}`;

const hasEnd = (m: Mutation): m is Extract<Mutation, { args: { endIndex: number } }> =>
  m.kind !== 'card.sign' && m.kind !== 'shootoff.record';

/**
 * The pushes of one commit as a unit of work: everything their mutations are checked against is
 * read up front (a few queries whatever the number of pushes and mutations), the mutations are
 * applied in order to this in-memory state by the rules, and `flush` writes the outcome back
 * with multi-row statements. It lives inside the commit's transaction, so what it read stays
 * true until it writes. Several people's pushes share it: what depends on the person (task on
 * a target, judge roles, name) is kept by user id.
 */
export class FieldBatch {
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
  /** `userId:eventId` of each pushing person's judge roles. */
  private readonly judgeOf = new Set<string>();
  /** The pushing people's names, as signatures show them (read when the commit has judging mutations). */
  private readonly names = new Map<number, string>();
  private readonly photos = new Map<number, { eventId: number; sha256: string }>();
  private readonly ops: JudgeOp[] = [];
  /** Applied effects in order, for the change log. */
  readonly changes: { placement: Placement; change: ChangeRecord }[] = [];
  /** Set while a judge's acceptance of a late value is applied: the closed session then takes it. */
  acceptingLate = false;
  /** Cards that became final (both signatures) in this batch, to mail once it is committed. */
  readonly finalCards: { sessionId: number; entryId: number }[] = [];

  private constructor(
    private readonly sessions: Map<number, FieldSession>,
    private readonly placements: Map<string, Placement>,
  ) {}

  /** Reads what `mutations`, pushed by the people `userIds`, are checked against. */
  static async load(
    trx: Db,
    mutations: readonly Mutation[],
    userIds: readonly number[],
  ): Promise<FieldBatch> {
    if (mutations.length === 0) return new FieldBatch(new Map(), new Map());
    const sessionIds = [...new Set(mutations.map((m) => m.args.sessionId))];
    const entryIds = [...new Set(mutations.map((m) => m.args.entryId))];
    const endIndexes = [...new Set(mutations.filter(hasEnd).map((m) => m.args.endIndex))];
    const judging = mutations.some((m) => m.kind !== 'end.write' && m.kind !== 'end.settle');

    const { sessions, placements } = await loadPlacements(trx, sessionIds, entryIds, userIds);
    const batch = new FieldBatch(sessions, placements);

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
    await batch.loadJudging(trx, mutations, userIds, { sessionIds, entryIds, endIndexes });
    return batch;
  }

  /**
   * What judging mutations are checked against: the settlements of the named ends, the latest
   * ruling of each, the current signatures of every end of these archers (a card needs all of
   * them) and of their cards, the people's judge roles and names, and the photos named.
   */
  private async loadJudging(
    trx: Db,
    mutations: readonly Mutation[],
    userIds: readonly number[],
    ids: { sessionIds: number[]; entryIds: number[]; endIndexes: number[] },
  ): Promise<void> {
    const ofCards = (table: string) =>
      trx(`${table} as t`).whereIn('t.session_id', ids.sessionIds).whereIn('t.entry_id', ids.entryIds);
    const settlements = (await ofCards('end_settlements')
      .whereIn('t.end_index', ids.endIndexes)
      .select(SETTLEMENT_COLUMNS.map((c) => `t.${c}`))) as SettlementRow[];
    for (const r of settlements) this.settlements.set(endKey(r.session_id, r.entry_id, r.end_index), r);
    const rulings = (await ofCards('end_rulings')
      .join('users as u', 'u.id', 't.judged_by')
      .whereIn('t.end_index', ids.endIndexes)
      .orderBy('t.id')
      .select('t.*', 'u.display_name')) as (RulingRow & { id: number; display_name: string })[];
    for (const { id, display_name, ...row } of rulings)
      this.rulings.set(endKey(row.session_id, row.entry_id, row.end_index), {
        id,
        row,
        dto: toRuling(id, row, display_name),
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
      .join('entries as e', 'e.id', 't.entry_id')
      .whereNull('t.superseded_at')
      .select('t.*', 'u.display_name', 'e.name as archer_name')) as (CardSignatureRow & {
      id: number;
      display_name: string;
      archer_name: string;
    })[];
    for (const { id, display_name, archer_name, ...row } of cardSignatures) {
      const key = cardKey(row.session_id, row.entry_id);
      const held = this.cardSignatures.get(key) ?? {};
      held[row.role] = { id, row, dto: toCardSignature(id, row, display_name, archer_name) };
      this.cardSignatures.set(key, held);
    }

    const eventIds = [...new Set([...this.sessions.values()].map((s) => s.eventId))];
    const roles = (await trx('event_roles')
      .where({ role: 'judge' })
      .whereIn('user_id', [...userIds])
      .whereIn('event_id', eventIds)
      .select('user_id', 'event_id')) as { user_id: number; event_id: number }[];
    for (const r of roles) this.judgeOf.add(`${r.user_id}:${r.event_id}`);
    const photoIds = mutations.flatMap((m) =>
      m.kind === 'end.rule' && m.args.photoId !== undefined
        ? [m.args.photoId]
        : m.kind === 'card.sign' && m.args.paper
          ? [m.args.paper.photoId]
          : [],
    );
    if (photoIds.length > 0) {
      for (const p of await trx('photos').whereIn('id', photoIds).select('id', 'event_id', 'sha256'))
        this.photos.set(p.id, { eventId: p.event_id, sha256: p.sha256 });
    }
    const people = (await trx('users')
      .whereIn('id', [...userIds])
      .select('id', 'display_name')) as {
      id: number;
      display_name: string;
    }[];
    for (const p of people) this.names.set(p.id, p.display_name);
  }

  session(sessionId: number): FieldSession | undefined {
    return this.sessions.get(sessionId);
  }

  placement(session: FieldSession, entryId: number): Placement | undefined {
    return this.placements.get(`${session.id}:${entryId}`);
  }

  isJudge(userId: number, eventId: number): boolean {
    return this.judgeOf.has(`${userId}:${eventId}`);
  }

  /** A pushing person's name, as signatures show it (known when the push has judging mutations). */
  nameOf(userId: number): string {
    return this.names.get(userId) ?? '';
  }

  /** The event a photo belongs to, if the photo exists. */
  photoEvent(photoId: number): number | undefined {
    return this.photos.get(photoId)?.eventId;
  }

  /** The SHA-256 of a photo's bytes, if the photo exists. */
  photoSha256(photoId: number): string | undefined {
    return this.photos.get(photoId)?.sha256;
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
    const held: RulingHeld = { id: undefined, row, dto: toRuling(0, row, this.nameOf(row.judged_by)) };
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
    const held: CardSignatureHeld = {
      id: undefined,
      row,
      dto: toCardSignature(0, row, name, placement.archerName),
    };
    const key = cardKey(row.session_id, row.entry_id);
    const card = this.cardSignatures.get(key) ?? {};
    card[row.role] = held;
    this.cardSignatures.set(key, card);
    this.ops.push({ op: 'insert', table: 'card_signatures', held });
    this.changes.push({ placement, change: { type: 'card-signature', record: held.dto } });
    if (card.archer && card.scorer)
      this.finalCards.push({ sessionId: row.session_id, entryId: row.entry_id });
  }

  /** A judge's shoot-off arrow; phones do not pull it (the standings read it), so no change row. */
  putShootOffArrow(row: ShootOffArrowRow): void {
    this.ops.push({ op: 'insert', table: 'shootoff_arrows', held: { id: undefined, row, dto: { id: 0 } } });
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
