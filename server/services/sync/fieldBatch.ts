import type { EndFacts } from '../../../src/core';
import type { CardSignatureDto, EndSignatureDto } from '../../../src/contract/judging';
import type { FieldMutation as Mutation } from '../../../src/contract/sync';
import { cardKeyOf, endKeyOf, recordKeyOf } from '../../../src/contract/recordKeys';
import type { Db } from '../../db';
import { endFactsOf } from '../judging/endRecords';
import {
  toCardSignature,
  toEndRecord,
  toEndSignature,
  toRuling,
  toSettlement,
  type CardSignatureRow,
  type EndEntryRow,
  type EndSignatureRow,
  type RulingRow,
  type SettlementRow,
} from './fieldRows';
import type { ShootOffArrowRow } from '../results/shootOffRows';
import type { FieldSession, Placement } from './fieldPlacements';
import { loadFieldState, type FieldState } from './fieldState';
import {
  NOT_YET_WRITTEN,
  writeFieldBatch,
  type CardSignatureHeld,
  type ChangeRecord,
  type EndSignatureHeld,
  type FieldWrites,
  type JudgeOp,
  type RulingHeld,
} from './fieldWrites';

export type { CardSignatureHeld, EndSignatureHeld, RulingHeld } from './fieldWrites';

/** What a record shows of a transcription (see effects.transcriptionLabel). */
type Label = { transcribedBy?: string };

/**
 * The pushes of one commit as a unit of work: what their mutations are checked against is read
 * up front (fieldState.ts), the mutations are applied in order to this in-memory state by the
 * rules, and `flush` writes the outcome (fieldWrites.ts). Several people's pushes share it: what
 * depends on the person (task on a target, judge roles, name) is kept by user id.
 *
 * A record written several times in one commit (a writer's taps) is written once, in its final
 * state, with one change row: what the phones pull never holds a revision no one could see.
 */
export class FieldBatch {
  private readonly touchedRecords = new Set<string>();
  private readonly touchedSettlements = new Set<string>();
  private readonly ops: JudgeOp[] = [];
  /** Applied effects in order, for the change log; an entry a later write of its record replaced is undefined. */
  private readonly changes: (FieldWrites['changes'][number] | undefined)[] = [];
  /** Where each record's and settlement's change is in `changes`, by key. */
  private readonly changeAt = new Map<string, number>();
  /** Set while a judge's acceptance of a late value is applied: the closed session then takes it. */
  acceptingLate = false;
  /** Cards that became final (both signatures) in this batch, to mail once it is committed. */
  readonly finalCards: { sessionId: number; entryId: number }[] = [];

  private constructor(private readonly state: FieldState) {}

  /** Reads what `mutations`, pushed by the people `userIds`, are checked against. */
  static async load(
    trx: Db,
    mutations: readonly Mutation[],
    userIds: readonly number[],
  ): Promise<FieldBatch> {
    return new FieldBatch(await loadFieldState(trx, mutations, userIds));
  }

  session(sessionId: number): FieldSession | undefined {
    return this.state.sessions.get(sessionId);
  }

  placement(session: FieldSession, entryId: number): Placement | undefined {
    return this.state.placements.get(`${session.id}:${entryId}`);
  }

  isJudge(userId: number, eventId: number): boolean {
    return this.state.judgeOf.has(`${userId}:${eventId}`);
  }

  /** A pushing person's name, as signatures show it (known when the push has judging mutations). */
  nameOf(userId: number): string {
    return this.state.names.get(userId) ?? '';
  }

  /** The event a photo belongs to, if the photo exists. */
  photoEvent(photoId: number): number | undefined {
    return this.state.photos.get(photoId)?.eventId;
  }

  /** The SHA-256 of a photo's bytes, if the photo exists. */
  photoSha256(photoId: number): string | undefined {
    return this.state.photos.get(photoId)?.sha256;
  }

  record(sessionId: number, entryId: number, endIndex: number, slot: 1 | 2): EndEntryRow | undefined {
    return this.state.records.get(recordKeyOf(sessionId, entryId, endIndex, slot));
  }

  /** Whether a judge has signed or ruled on an end (a signature wins: it is the stronger refusal). */
  judged(sessionId: number, entryId: number, endIndex: number): 'signed' | 'ruled' | undefined {
    const key = endKeyOf(sessionId, entryId, endIndex);
    if (this.state.endSignatures.has(key)) return 'signed';
    if (this.state.rulings.has(key)) return 'ruled';
    return this.state.judgedEnds.get(key);
  }

  ruling(sessionId: number, entryId: number, endIndex: number): RulingHeld | undefined {
    return this.state.rulings.get(endKeyOf(sessionId, entryId, endIndex));
  }

  endSignature(sessionId: number, entryId: number, endIndex: number): EndSignatureHeld | undefined {
    return this.state.endSignatures.get(endKeyOf(sessionId, entryId, endIndex));
  }

  cardSignature(
    sessionId: number,
    entryId: number,
    role: 'archer' | 'scorer',
  ): CardSignatureHeld | undefined {
    return this.state.cardSignatures.get(cardKeyOf(sessionId, entryId))?.[role];
  }

  /** An end's records as core `endView` reads them: writers (with flags), settlement, ruling, signature. */
  endFacts(sessionId: number, entryId: number, endIndex: number): EndFacts {
    return endFactsOf({
      first: this.record(sessionId, entryId, endIndex, 1),
      second: this.record(sessionId, entryId, endIndex, 2),
      settlement: this.state.settlements.get(endKeyOf(sessionId, entryId, endIndex)),
      ruling: this.ruling(sessionId, entryId, endIndex)?.dto,
      signature: this.endSignature(sessionId, entryId, endIndex)?.dto,
    });
  }

  private logChange(placement: Placement, change: () => ChangeRecord): void {
    this.changes.push({ placement, change });
  }

  /** The change of a record or settlement `key`, replacing the one an earlier write of it in this commit made. */
  private logLatest(key: string, placement: Placement, change: () => ChangeRecord): void {
    const earlier = this.changeAt.get(key);
    if (earlier !== undefined) this.changes[earlier] = undefined;
    this.changeAt.set(key, this.changes.length);
    this.logChange(placement, change);
  }

  putRecord(placement: Placement, row: EndEntryRow, label: Label): void {
    const key = recordKeyOf(row.session_id, row.entry_id, row.end_index, row.slot);
    this.state.records.set(key, row);
    this.touchedRecords.add(key);
    this.logLatest(key, placement, () => ({ type: 'end', record: { ...toEndRecord(row), ...label } }));
  }

  putSettlement(placement: Placement, row: SettlementRow, label: Label): void {
    const key = endKeyOf(row.session_id, row.entry_id, row.end_index);
    this.state.settlements.set(key, row);
    this.touchedSettlements.add(key);
    this.logLatest(`settlement:${key}`, placement, () => ({
      type: 'settlement',
      record: { ...toSettlement(row), ...label },
    }));
  }

  /**
   * A new ruling on an end. It is the only correction of a signed end: the end's signature and
   * the card's signatures are marked superseded by it (their rows stay, as history).
   */
  putRuling(placement: Placement, row: RulingRow): void {
    const held: RulingHeld = {
      id: NOT_YET_WRITTEN,
      row,
      dto: toRuling(NOT_YET_WRITTEN, row, this.nameOf(row.judged_by)),
    };
    const key = endKeyOf(row.session_id, row.entry_id, row.end_index);
    this.state.rulings.set(key, held);
    this.ops.push({ op: 'insert', table: 'end_rulings', held });
    this.logChange(placement, () => ({ type: 'ruling', record: held.dto }));

    const signature = this.state.endSignatures.get(key);
    if (signature) {
      this.state.endSignatures.delete(key);
      const snapshot: EndSignatureDto = { ...signature.dto, supersededAt: row.judged_at };
      this.ops.push({
        op: 'supersede',
        table: 'end_signatures',
        held: signature,
        by: held,
        at: row.judged_at,
        snapshot,
      });
      this.logChange(placement, () => ({ type: 'signature', record: snapshot }));
    }
    const card = this.state.cardSignatures.get(cardKeyOf(row.session_id, row.entry_id));
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
      this.logChange(placement, () => ({ type: 'card-signature', record: snapshot }));
    }
  }

  putEndSignature(placement: Placement, row: EndSignatureRow, signedByName: string): void {
    const held: EndSignatureHeld = {
      id: NOT_YET_WRITTEN,
      row,
      dto: toEndSignature(NOT_YET_WRITTEN, row, signedByName),
    };
    this.state.endSignatures.set(endKeyOf(row.session_id, row.entry_id, row.end_index), held);
    this.ops.push({ op: 'insert', table: 'end_signatures', held });
    this.logChange(placement, () => ({ type: 'signature', record: held.dto }));
  }

  putCardSignature(placement: Placement, row: CardSignatureRow, name: string): void {
    const held: CardSignatureHeld = {
      id: NOT_YET_WRITTEN,
      row,
      dto: toCardSignature(NOT_YET_WRITTEN, row, name, placement.archerName),
    };
    const key = cardKeyOf(row.session_id, row.entry_id);
    const card = this.state.cardSignatures.get(key) ?? {};
    card[row.role] = held;
    this.state.cardSignatures.set(key, card);
    this.ops.push({ op: 'insert', table: 'card_signatures', held });
    this.logChange(placement, () => ({ type: 'card-signature', record: held.dto }));
    if (card.archer && card.scorer)
      this.finalCards.push({ sessionId: row.session_id, entryId: row.entry_id });
  }

  /** A judge's shoot-off arrow; phones do not pull it (the standings read it), so no change row. */
  putShootOffArrow(row: ShootOffArrowRow): void {
    this.ops.push({
      op: 'insert',
      table: 'shootoff_arrows',
      held: { id: NOT_YET_WRITTEN, row, dto: { id: NOT_YET_WRITTEN } },
    });
  }

  /** Writes the batch's effects (fieldWrites.ts), inside the commit's transaction. */
  async flush(trx: Db): Promise<void> {
    await writeFieldBatch(trx, {
      records: [...this.touchedRecords].map((k) => this.state.records.get(k)!),
      settlements: [...this.touchedSettlements].map((k) => this.state.settlements.get(k)!),
      ops: this.ops,
      changes: this.changes.filter((c) => c !== undefined),
    });
  }
}
