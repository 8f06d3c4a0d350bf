import type {
  MatchCountersignArgs,
  MatchEndArgs,
  MatchFirstShooterArgs,
  MatchPadDto,
  MatchShootOffArgs,
  MatchSignArgs,
  MatchWriteArgs,
} from '../contract/matches';
import type { PracticeDeleteArgs, PracticeEndDto, PracticeSessionDto } from '../contract/practice';
import { Dexie, type EntityTable } from 'dexie';
import { storeRecords } from './cardRecords';
import { practiceWriteCounter } from './practiceWriteCount';
import type { BowStyle, FaceId, Venue } from '../core';
import type { PracticeArrow } from '../core/practice';
import type { ProgressPart } from '../core/practice/progressParts';
import type {
  CardSignatureDto,
  EndRuleArgs,
  EndSignArgs,
  CardSignArgs,
  EndSignatureDto,
  RulingDto,
} from '../contract/judging';
import type { ShootOffRecordArgs } from '../contract/results';
import type {
  EndRecordDto,
  EndSettleArgs,
  EndWriteArgs,
  MutationKind,
  SettlementDto,
  TargetPackage,
} from '../contract/sync';

/** A target group this phone joined, with everything needed to score it offline. */
export type JoinedTarget = TargetPackage & { key: string; userId: number; joinedAt: string };

/**
 * The server's copies of one archer's writer records in a session (every end, both writers), as
 * last pulled: one row per card (session:entry), so a session's few thousand records are stored
 * and read as a few hundred rows.
 */
export type CardRecordsRow = { cardKey: string; sessionId: number; records: EndRecordDto[] };

/** The server's copy of a caller's settlement, as last pulled. */
export type SettlementRow = SettlementDto & { endKey: string };

/** Judges' rulings and signatures, and card signatures, as last pulled (kept whole: they are history). */
export type RulingRow = RulingDto & { endKey: string };
export type EndSignatureRow = EndSignatureDto & { endKey: string };
export type CardSignatureRow = CardSignatureDto & { cardKey: string };

/** `held`: it reached the server after its session closed and waits for a judge's decision. */
export type OutboxStatus = 'pending' | 'applied' | 'rejected' | 'held';

/** A change made on this phone. Pending rows are the phone's own view on top of the server's. */
export type OutboxRow = {
  clientId: string;
  seq: number;
  id: string;
  userId: number;
  kind: MutationKind;
  args:
    | EndWriteArgs
    | EndSettleArgs
    | EndRuleArgs
    | EndSignArgs
    | CardSignArgs
    | ShootOffRecordArgs
    | MatchEndArgs
    | MatchShootOffArgs
    | MatchSignArgs
    | PracticeSessionDto
    | PracticeEndDto
    | PracticeDeleteArgs
    | MatchWriteArgs
    | MatchCountersignArgs
    | MatchFirstShooterArgs;
  at: string;
  /** The end this change is about (session:entry:end), for the pad's overlay; a card, a shoot-off arrow or a match has its own key. */
  endKey: string;
  status: OutboxStatus;
  reason?: string;
  /** Set when the person has read a rejection. */
  seenAt?: string;
};

export type MetaRow = { key: string; value: unknown };

/** A match this person joined as a writer, as last read from the server, so its pad opens offline. */
export type JoinedMatch = MatchPadDto & { key: string; userId: number; matchId: number };
export const matchPadKeyOf = (userId: number, matchId: number) => `${userId}:${matchId}`;

/** The owner of practice recorded while no one is signed in on this phone. */
export const NO_ACCOUNT = 0;

/**
 * A practice session, kept on this phone (see docs/practice.md). A catalog round gives its ends;
 * free practice gives one distance and face, and a number of ends or none (open).
 */
export type PracticeSessionRow = {
  id: string;
  /** Who recorded it: a person's id, or NO_ACCOUNT (adopted by the next person who signs in). */
  ownerId: number;
  startedAt: string;
  /** A round from the catalog; absent for free practice. */
  roundId?: string;
  bowStyle: BowStyle;
  venue: Venue;
  /** Free practice's setup (a round's come from the catalog). */
  distanceM: number;
  faceId: FaceId;
  arrowsPerEnd: number;
  /** Ends planned; null is open-ended. */
  plannedEnds: number | null;
  /** Used by the plotting rule: a line touch is judged at the shaft's edge. */
  shaftDiameterMm: number;
  note?: string;
  finishedAt?: string;
  /**
   * Arrows and points per distance and face, kept with each arrow stored, so progress reads
   * these rather than every arrow. Absent on sessions stored before it was kept.
   */
  progress?: ProgressPart[];
  /** Set by the server when the session was deleted on one phone and another's later change brought it back. */
  revivedAt?: string;
};

/** One end of a practice session, arrows in the order they were entered or plotted. */
export type PracticeEndRow = {
  /** sessionId:index */
  key: string;
  sessionId: string;
  index: number;
  distanceM: number;
  faceId: FaceId;
  arrows: PracticeArrow[];
  at: string;
};

export class LocalDb extends Dexie {
  meta!: EntityTable<MetaRow, 'key'>;
  targets!: EntityTable<JoinedTarget, 'key'>;
  cardRecords!: EntityTable<CardRecordsRow, 'cardKey'>;
  settlements!: EntityTable<SettlementRow, 'endKey'>;
  outbox!: Dexie.Table<OutboxRow, [string, number]>;
  rulings!: EntityTable<RulingRow, 'id'>;
  endSignatures!: EntityTable<EndSignatureRow, 'id'>;
  cardSignatures!: EntityTable<CardSignatureRow, 'id'>;
  practiceSessions!: EntityTable<PracticeSessionRow, 'id'>;
  practiceEnds!: EntityTable<PracticeEndRow, 'key'>;
  matchPads!: EntityTable<JoinedMatch, 'key'>;
  /** Read-write transactions over practice opened by this page so far (practiceWriteCount.ts). */
  practiceWrites = 0;

  constructor(name = 'ringcall') {
    // No live-query cache: a tap's write bypasses Dexie (see writeAtOnce), and a cached answer
    // would not see it. Every live query reads IndexedDB again when a change is announced.
    super(name, { cache: 'disabled' });
    this.use(
      practiceWriteCounter(() => {
        this.practiceWrites += 1;
      }),
    );
    this.version(1).stores({
      meta: 'key',
      targets: 'key, userId',
      endRecords: 'key, endKey, sessionId',
      settlements: 'endKey, sessionId',
      outbox: '[clientId+seq], id, status, endKey, userId, [clientId+status]',
    });
    // Version 2 adds the judges' records; earlier data is kept as it is.
    this.version(2).stores({
      rulings: 'id, endKey, sessionId',
      endSignatures: 'id, endKey, sessionId',
      cardSignatures: 'id, cardKey, sessionId',
    });
    // Version 3 adds the practice log; earlier data is kept as it is.
    this.version(3).stores({
      practiceSessions: 'id, startedAt, ownerId',
      practiceEnds: 'key, sessionId',
    });
    // Matches joined as a writer (docs/matches.md).
    this.version(5).stores({ matchPads: 'key, userId' });
    // Version 7 keeps a card's writer records in one row: storing and reading a session's
    // records one row each was most of the judge desk's first load. The rows stored before move
    // over, so a phone opening this version offline keeps what it pulled.
    this.version(7)
      .stores({ cardRecords: 'cardKey, sessionId', endRecords: null })
      .upgrade(async (tx) =>
        storeRecords(
          tx.table('cardRecords'),
          (await tx.table<EndRecordDto & { key: string; endKey: string }>('endRecords').toArray()).map(
            ({ key: _key, endKey: _endKey, ...record }) => record,
          ),
        ),
      );
  }
}

// The record keys are shared with the server (src/contract/recordKeys.ts).
import { cardKeyOf } from '../contract/recordKeys';
export { cardKeyOf, endKeyOf } from '../contract/recordKeys';
export const shootOffKeyOf = (sessionId: number, entryId: number, arrowIndex: number) =>
  `${cardKeyOf(sessionId, entryId)}:shootoff:${arrowIndex}`;
export const targetKeyOf = (userId: number, sessionId: number, targetNumber: number) =>
  `${userId}:${sessionId}:${targetNumber}`;

let shared: LocalDb | undefined;
/** The phone's one database (tests open their own with another name). */
export function localDb(): LocalDb {
  shared ??= new LocalDb();
  return shared;
}
