import { z } from 'zod';
import type { ArrowValue } from '../core';
import type { ArrowFlag, WriterSlot } from './fieldTerms';

/**
 * Values that reach the server after their session was closed (an offline phone reconnecting).
 * They are never dropped: the server holds them, the phone shows them as waiting, and a judge
 * accepts them (they then take effect as if pushed in time) or rejects them with a reason.
 */

/** What the phone is told about a change the server holds for a judge. */
export const LATE_HELD_REASON =
  'The session was closed before this reached the event server. It is kept for a judge, who will accept or reject it.';

/** `replaced`: a later value of the same end from the same phone took its place (each tap sends the whole end). */
export type LateValueStatus = 'waiting' | 'accepted' | 'rejected' | 'replaced';

/** `GET /api/events/:eventId/sessions/:sessionId/late-values`: one held change, as the judge desk shows it. */
export type LateValueDto = {
  id: number;
  mutationId: string;
  sessionId: number;
  targetNumber: number;
  entryId: number;
  archerName: string;
  endIndex: number;
  kind: 'end.write' | 'end.settle';
  /** Writer 1 or 2 for a writer's record; absent for a caller's settlement. */
  slot?: WriterSlot;
  arrows: ArrowValue[];
  flags: { index: number; flag: ArrowFlag }[];
  byName: string;
  /** The phone's clock when the person entered it, and when the server received it. */
  at: string;
  receivedAt: string;
  status: LateValueStatus;
  reason: string | null;
  decidedByName: string | null;
  decidedAt: string | null;
};

/** Pulled by the phone that sent it (change type `late-value`): what the judge decided. */
export type LateDecisionDto = {
  mutationId: string;
  sessionId: number;
  entryId: number;
  endIndex: number;
  status: 'accepted' | 'rejected' | 'replaced';
  reason: string | null;
  /** The judge who decided; null when a later value from the same phone replaced this one. */
  decidedByName: string | null;
  decidedAt: string;
};

export const rejectLateValueSchema = z.object({
  reason: z
    .string({ error: 'Say why the value is rejected: the person who entered it reads this.' })
    .trim()
    .min(3, 'Say why the value is rejected: the person who entered it reads this.')
    .max(500, 'Keep the reason under 500 characters.'),
});
export type RejectLateValueInput = z.infer<typeof rejectLateValueSchema>;

/**
 * `GET /api/events/:eventId/sessions/:sessionId/close-check`: what the server does not yet hold,
 * per target, before the organizer closes the session. Ends counted once each, by the first
 * thing they lack.
 */
export type CloseCheckTarget = {
  targetNumber: number;
  /** Ends not yet entered whole by both writers (still on phones, or never shot). */
  notEntered: number;
  /** Ends entered but not agreed: a mismatch, a dispute or a mark waiting for a judge. */
  notAgreed: number;
  /** Decided ends no judge has signed yet. */
  notSigned: number;
  /** Late values held for a judge on this target. */
  lateValues: number;
};
export type CloseCheck = { sessionId: number; totalEnds: number; targets: CloseCheckTarget[] };
