import { z } from 'zod';
import { PULL_LIMIT_DEFAULT, PULL_LIMIT_MAX } from './pullLimits';
import { ARROW_FLAGS, TASKS, type ArrowFlag, type Task, type WriterSlot } from './fieldTerms';
import type { ArrowValue, EndView, RoundDefinition } from '../core';
import { arrowValueSchema } from './arrowValueSchema';
import { joinCodeSchema } from './joinCode';
import { clientIdSchema } from './clientId';
import type { LateDecisionDto } from './lateValues';
import {
  cardSignArgsSchema,
  endRuleArgsSchema,
  endSignArgsSchema,
  type CardSignatureDto,
  type EndSignatureDto,
  type RulingDto,
} from './judging';
import { shootOffRecordArgsSchema } from './results';
import {
  matchCountersignArgsSchema,
  matchEndArgsSchema,
  matchEndSignArgsSchema,
  matchFirstShooterArgsSchema,
  matchShootOffArgsSchema,
  matchSignArgsSchema,
  matchWriteArgsSchema,
} from './matches';
import {
  practiceDeleteSchema,
  practiceEndSchema,
  practiceSessionSchema,
  type PracticeDeleteArgs,
  type PracticeEndDto,
  type PulledPracticeSession,
} from './practice';

/**
 * The field path between phone and server. Every change a phone makes is a mutation with a
 * per-client sequence number; the server applies each exactly once (see DEVELOPERS.md, "Sync").
 */

export { arrowValueSchema } from './arrowValueSchema';

export { ARROW_FLAGS, TASKS } from './fieldTerms';
export type { ArrowFlag, Task, WriterSlot } from './fieldTerms';
export const arrowFlagSchema = z.enum(ARROW_FLAGS);

export const writerSlotSchema = z.union([z.literal(1), z.literal(2)]);

const id = z.number().int().positive();
const endIndex = z.number().int().min(0).max(499);

/** A writer's record of one archer's end (replaces that writer's previous record of it). */
export const endWriteArgsSchema = z.object({
  sessionId: id,
  entryId: id,
  endIndex,
  slot: writerSlotSchema,
  arrows: z.array(arrowValueSchema).max(24, 'An end cannot hold more than 24 arrows.'),
  flags: z
    .array(z.object({ index: z.number().int().min(0).max(23), flag: arrowFlagSchema }))
    .max(48)
    .default([]),
});
export type EndWriteArgs = z.infer<typeof endWriteArgsSchema>;

/** The caller's decision on a mismatch: the agreed end, and the arrows sent to a judge. */
export const endSettleArgsSchema = z.object({
  sessionId: id,
  entryId: id,
  endIndex,
  arrows: z.array(arrowValueSchema).max(24),
  disputed: z.array(z.number().int().min(0).max(23)).max(24).default([]),
  /** The writers' record revisions the caller looked at; a newer record makes this stale. */
  basis: z.object({ first: z.number().int().min(0), second: z.number().int().min(0) }),
});
export type EndSettleArgs = z.infer<typeof endSettleArgsSchema>;

const base = { id: z.uuid(), seq: z.number().int().positive(), at: z.iso.datetime() };

export const mutationSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ ...base, kind: z.literal('end.write'), args: endWriteArgsSchema }),
    z.object({ ...base, kind: z.literal('end.settle'), args: endSettleArgsSchema }),
    // A judge's ruling and signature on an end, and the archer's or scorer's signature on the card.
    z.object({ ...base, kind: z.literal('end.rule'), args: endRuleArgsSchema }),
    z.object({ ...base, kind: z.literal('end.sign'), args: endSignArgsSchema }),
    z.object({ ...base, kind: z.literal('card.sign'), args: cardSignArgsSchema }),
    // A judge's shoot-off arrow (results).
    z.object({ ...base, kind: z.literal('shootoff.record'), args: shootOffRecordArgsSchema }),
    // A judge's match ends, shoot-off arrows and signatures, of an end or the match (eliminations, docs/matches.md).
    z.object({ ...base, kind: z.literal('match.end'), args: matchEndArgsSchema }),
    z.object({ ...base, kind: z.literal('match.shootoff'), args: matchShootOffArgsSchema }),
    z.object({ ...base, kind: z.literal('match.sign'), args: matchSignArgsSchema }),
    z.object({ ...base, kind: z.literal('match.endSign'), args: matchEndSignArgsSchema }),
    // The person's own practice log (docs/practice.md): a session's setup, one end, a deletion.
    z.object({ ...base, kind: z.literal('practice.session'), args: practiceSessionSchema }),
    z.object({ ...base, kind: z.literal('practice.end'), args: practiceEndSchema }),
    z.object({ ...base, kind: z.literal('practice.delete'), args: practiceDeleteSchema }),
    // A match writer's end at the target and an archer's countersignature on the match card.
    z.object({ ...base, kind: z.literal('match.write'), args: matchWriteArgsSchema }),
    z.object({ ...base, kind: z.literal('match.countersign'), args: matchCountersignArgsSchema }),
    // Who shoots first in an alternating match (a writer of the match or a judge).
    z.object({ ...base, kind: z.literal('match.firstShooter'), args: matchFirstShooterArgsSchema }),
  ],
  { error: 'Unknown kind of change. This phone may need the newest version of Ringcall.' },
);
export type Mutation = z.infer<typeof mutationSchema>;
export type MutationKind = Mutation['kind'];
/** A change to an elimination match: applied through the match services, not the field batch. */
export type MatchMutation = Extract<
  Mutation,
  {
    kind:
      | 'match.end'
      | 'match.shootoff'
      | 'match.sign'
      | 'match.endSign'
      | 'match.write'
      | 'match.countersign'
      | 'match.firstShooter';
  }
>;
/** A change to the person's own practice log: applied by the practice services, for that person only. */
export type PracticeMutation = Extract<
  Mutation,
  { kind: 'practice.session' | 'practice.end' | 'practice.delete' }
>;
/** A change about a qualification end, card or shoot-off: what the field batch applies. */
export type FieldMutation = Exclude<Mutation, MatchMutation | PracticeMutation>;
export const isMatchMutation = (m: Mutation): m is MatchMutation => m.kind.startsWith('match.');
export const isPracticeMutation = (m: Mutation): m is PracticeMutation => m.kind.startsWith('practice.');

/** A change's JSON longer than this is refused on its own (the largest real change is ~1,500). */
export const MUTATION_MAX_CHARS = 8_000;
export const PUSH_MAX_CHANGES = 500;

/**
 * A change the server could place in the phone's sequence but not read: a kind this server does
 * not know yet (a newer app), an `at` with an offset, a value out of range. It is refused on its
 * own, with its reason, so it never blocks the changes behind it.
 */
export type UnreadableChange = {
  id: string;
  seq: number;
  unreadable: { reason: string; kind: string; at: string; argsJson: string };
};
/** A change as the server received it: understood, or unreadable (refused on its own). */
export type ReceivedChange = Mutation | UnreadableChange;

export const isUnreadable = (change: ReceivedChange): change is UnreadableChange => 'unreadable' in change;

/** The changes of a push or a file that the server understood. */
export const understood = (changes: readonly ReceivedChange[]): Mutation[] =>
  changes.filter((c): c is Mutation => !isUnreadable(c));

const clip = (value: unknown, max: number): string => (typeof value === 'string' ? value.slice(0, max) : '');

function readChange(raw: { id: string; seq: number; [key: string]: unknown }): ReceivedChange {
  const refused = (reason: string): UnreadableChange => ({
    id: raw.id,
    seq: raw.seq,
    unreadable: {
      reason,
      kind: clip(raw.kind, 40) || '(none)',
      at: clip(raw.at, 30),
      argsJson: JSON.stringify(raw.args ?? null).slice(0, MUTATION_MAX_CHARS),
    },
  });
  const size = JSON.stringify(raw).length;
  if (size > MUTATION_MAX_CHARS)
    return refused(
      `This change is too large to be one change (${size} characters; at most ${MUTATION_MAX_CHARS}).`,
    );
  const parsed = mutationSchema.safeParse(raw);
  if (parsed.success) return parsed.data;
  const problems = parsed.error.issues
    .map((issue) => (issue.path.length ? `${issue.path.join('.')}: ${issue.message}` : issue.message))
    .join('; ');
  return refused(`This change could not be read: ${problems}`);
}

/**
 * Each change of a push needs only an id and a number to take its place in the phone's sequence;
 * the rest is read change by change (readChange). Only a push without these is refused as a whole.
 */
export const receivedChangeSchema = z
  .looseObject({ id: z.uuid(), seq: z.number().int().positive() })
  .transform(readChange);

const cursorMessage = 'cursor must be a whole number: the version of the last change this phone holds, or 0.';

export const pushRequestSchema = z.object({
  clientId: clientIdSchema,
  mutations: z
    .array(receivedChangeSchema)
    .min(1)
    .max(PUSH_MAX_CHANGES, `Send at most ${PUSH_MAX_CHANGES} changes at once.`),
  /**
   * The phone's pull cursor: the answer then carries the pull too (`pull`), so one round trip
   * both sends and fetches. Phones of older versions leave it out and pull on their own.
   */
  cursor: z
    .number({ error: cursorMessage })
    .int(cursorMessage)
    .min(0, cursorMessage)
    .max(1e15, cursorMessage)
    .optional(),
});
/** What a phone sends. */
export type PushRequest = { clientId: string; mutations: Mutation[]; cursor?: number };
/** A push as the server reads it: each change understood or refused on its own. */
export type ReceivedPush = z.output<typeof pushRequestSchema>;

/**
 * `held`: the session was closed when it arrived; the server keeps it for a judge to accept or
 * reject (see lateValues.ts), and the decision comes back as a `late-value` change.
 */
export type MutationResult =
  | { seq: number; id: string; status: 'applied' | 'duplicate' }
  | { seq: number; id: string; status: 'rejected' | 'held'; reason: string };

export type PushResponse = {
  results: MutationResult[];
  /** Highest seq the server holds for this client, applied or rejected. */
  lastSeq: number;
  /** Present when the batch stopped at a gap: the next seq the server expects. */
  expectedSeq?: number;
  /** What the phone has not seen yet, read after the push was committed (when it sent its cursor). */
  pull?: PullResponse;
};

/** Server records as the phone sees them (pull and push effects). */
export type EndRecordDto = {
  sessionId: number;
  entryId: number;
  endIndex: number;
  slot: WriterSlot;
  arrows: ArrowValue[];
  flags: { index: number; flag: ArrowFlag }[];
  revision: number;
  writtenBy: number;
  writtenAt: string;
  /** The judge who transcribed this record from a file no phone signed ("transcribed by … from a file"). */
  transcribedBy?: string;
};

export type SettlementDto = {
  sessionId: number;
  entryId: number;
  endIndex: number;
  arrows: ArrowValue[];
  disputed: number[];
  basis: { first: number; second: number };
  settledBy: number;
  settledAt: string;
  /** As for EndRecordDto. */
  transcribedBy?: string;
};

/**
 * Rulings and signatures are history: each change carries the whole record, keyed by its `id`; a
 * signature that a later ruling superseded comes again with `supersededAt` set.
 */
export type ChangeDto =
  | { version: number; type: 'end'; record: EndRecordDto }
  | { version: number; type: 'settlement'; record: SettlementDto }
  | { version: number; type: 'ruling'; record: RulingDto }
  | { version: number; type: 'signature'; record: EndSignatureDto }
  | { version: number; type: 'card-signature'; record: CardSignatureDto }
  | { version: number; type: 'late-value'; record: LateDecisionDto }
  // The person's own practice (only ever pulled by that person): a session's setup, one end
  // (no arrows: taken back), a deleted session.
  | { version: number; type: 'practice'; record: PulledPracticeSession }
  | { version: number; type: 'practice-end'; record: PracticeEndDto }
  | { version: number; type: 'practice-del'; record: PracticeDeleteArgs };

/** A change of the person's own practice log (see docs/practice.md). */
export type PracticeChangeDto = Extract<ChangeDto, { type: 'practice' | 'practice-end' | 'practice-del' }>;

export type PullResponse = { changes: ChangeDto[]; cursor: number; hasMore: boolean };

export { PULL_LIMIT_DEFAULT, PULL_LIMIT_MAX };

const limitMessage = `limit must be a whole number from 1 to ${PULL_LIMIT_MAX}.`;

/** `GET /api/sync/pull?cursor=N&limit=M`: changes after version N, at most M of them. */
export const pullQuerySchema = z.object({
  cursor: z
    .string({ error: cursorMessage })
    .regex(/^\d{1,15}$/, cursorMessage)
    .transform(Number)
    .default(0),
  limit: z
    .string({ error: limitMessage })
    .regex(/^\d{1,6}$/, limitMessage)
    .transform(Number)
    .pipe(z.number().min(1, limitMessage).max(PULL_LIMIT_MAX, limitMessage))
    .default(PULL_LIMIT_DEFAULT),
});
export type PullQuery = z.infer<typeof pullQuerySchema>;

/** Joining a target group with its code. */
export const joinRequestSchema = z.object({
  code: joinCodeSchema,
  task: z.enum(TASKS, { error: 'Choose writer 1, writer 2, caller or following.' }),
});
export type JoinRequest = z.infer<typeof joinRequestSchema>;

/** Everything a phone needs to score a target offline. */
export type TargetPackage = {
  event: { id: number; name: string; venue: string };
  session: { id: number; name: string; startsAt: string; closed: boolean };
  targetNumber: number;
  task: Task;
  members: { userId: number; name: string; task: Task }[];
  archers: {
    entryId: number;
    position: 'A' | 'B' | 'C' | 'D';
    name: string;
    club: string;
    division: string;
    bowStyle: 'recurve' | 'compound' | 'barebow';
    /** The round this archer shoots in the session (snapshot). */
    round: RoundDefinition;
  }[];
};

/** `GET /api/targets/:sessionId`: every target of a session with archers (judges and organizers). */
export type SessionPackages = { targets: TargetPackage[] };

/**
 * `GET /api/targets/:sessionId/:targetNumber/ends`: the server's own cross-check of a target,
 * derived with the same core `endView` the phones use.
 */
export type TargetEndsView = {
  sessionId: number;
  targetNumber: number;
  archers: {
    entryId: number;
    position: 'A' | 'B' | 'C' | 'D';
    name: string;
    ends: {
      endIndex: number;
      view: EndView;
      /** Incidents marked by the writers (bounce-out…), once each, by position in the sorted end. */
      incidents: { index: number; flag: ArrowFlag }[];
      /** The judge's latest ruling and the end's current signature, when there are. */
      ruling: RulingDto | null;
      signature: EndSignatureDto | null;
    }[];
  }[];
};
