import { z } from 'zod';
import type { ArrowValue, EndState, ValuesBefore } from '../core';
import { arrowValueSchema } from './arrowValueSchema';

/**
 * What judges and archers do after the writers: rulings, signatures on ends, and the card's
 * countersignatures. These travel through the same outbox and push as the writers' changes.
 */

const id = z.number().int().positive();
const endIndex = z.number().int().min(0).max(499);

/** A judge sets an end's values (any value valid on the face) with a short reason. */
export const endRuleArgsSchema = z.object({
  sessionId: id,
  entryId: id,
  endIndex,
  arrows: z.array(arrowValueSchema).min(1).max(24),
  reason: z.string().trim().min(3, 'Give a short reason for the ruling.').max(500),
  photoId: id.optional(),
});
export type EndRuleArgs = z.infer<typeof endRuleArgsSchema>;

/** A judge signs an end; `arrows` is what the judge saw, so a change in between is caught. */
export const endSignArgsSchema = z.object({
  sessionId: id,
  entryId: id,
  endIndex,
  arrows: z.array(arrowValueSchema).max(24),
});
export type EndSignArgs = z.infer<typeof endSignArgsSchema>;

/**
 * The archer (or the writer who kept the card, as scorer) signs the whole card as they saw it.
 * With `paper`, a judge records the archer's countersignature made on the paper card (an archer
 * without an account cannot sign on a phone), naming the photo of that paper card.
 */
export const cardSignArgsSchema = z.object({
  sessionId: id,
  entryId: id,
  role: z.enum(['archer', 'scorer']),
  total: z.number().int().min(0).max(10_000),
  paper: z.object({ photoId: id }).optional(),
});
export type CardSignArgs = z.infer<typeof cardSignArgsSchema>;

export type RulingDto = {
  id: number;
  sessionId: number;
  entryId: number;
  endIndex: number;
  arrows: ArrowValue[];
  reason: string;
  photoId: number | null;
  judgedBy: number;
  /** The judge's name, as the pads, the desk and the card show the ruling. */
  judgedByName: string;
  judgedAt: string;
};

export type EndSignatureDto = {
  id: number;
  sessionId: number;
  entryId: number;
  endIndex: number;
  arrows: ArrowValue[];
  contentHash: string;
  signedBy: number;
  signedByName: string;
  signedAt: string;
  /** Set when a later ruling replaced this signature; the signature stays in the history. */
  supersededAt: string | null;
  /** The ruling that replaced it, when one did. */
  supersededByRuling: number | null;
  /** The compact JWS of the server over the end's content hash, signer and time. */
  jws: string;
};

export type CardSignatureDto = {
  id: number;
  sessionId: number;
  entryId: number;
  role: 'archer' | 'scorer';
  /** The account that signed (for a countersignature on paper: the judge who recorded it). */
  userId: number;
  name: string;
  /** The server's time of signing; `phoneAt` is the signing phone's own clock. */
  signedAt: string;
  phoneAt: string | null;
  /** "countersigned on paper, recorded by judge …", when it was. */
  onPaper?: string;
  supersededAt: string | null;
  /** The compact JWS, for the verification QR code. */
  jws: string;
};

/** One line of the judge desk: what needs a judge, oldest first. */
export type JudgeDeskItem = {
  kind: 'dispute' | 'incident' | 'mismatch' | 'to-sign';
  sessionId: number;
  targetNumber: number;
  entryId: number;
  position: 'A' | 'B' | 'C' | 'D';
  archerName: string;
  endIndex: number;
  since: string;
  /** Words for the judge: which arrows, which incident. */
  detail: string;
  /** The arrows concerned, as positions in the end sorted highest first (empty for to-sign). */
  positions: number[];
  /** The values that count, for an end waiting for a signature (what `end.sign` must name). */
  arrows?: ArrowValue[];
};

/** One ruling on an end as people read it afterwards: who, when, why, the values before and after. */
export type RulingStepView = {
  judgedByName: string;
  judgedAt: string;
  reason: string;
  /** A photo of the target, shown to the target's group, the archer and the event's staff. */
  photoId: number | null;
  arrows: ArrowValue[];
  before: ValuesBefore;
};

/** `GET /api/cards/:sessionId/:entryId`: an archer's whole card as it stands. */
export type CardState = 'running' | 'countersigned' | 'final';

export type CardView = {
  event: { id: number; name: string };
  session: { id: number; name: string; closed: boolean };
  archer: {
    entryId: number;
    name: string;
    club: string;
    division: string;
    targetNumber: number;
    position: 'A' | 'B' | 'C' | 'D';
  };
  round: { id: string; name: string; maxScore: number };
  ends: {
    endIndex: number;
    distanceIndex: number;
    state: EndState;
    /** The values that count, highest first; null while the end has none decided. */
    arrows: ArrowValue[] | null;
    total: number | null;
    runningTotal: number | null;
    signedBy?: string;
    signedAt?: string;
    /** A judge transcribed a record of this end from a file no phone signed (shown "transcribed by … from a file"). */
    transcribedBy?: string;
    /** Every ruling on the end, oldest first. */
    rulings: RulingStepView[];
  }[];
  /** Over the ends with decided values (all of them once every end is signed). */
  totals: { total: number; tens: number; xs: number; hits: number };
  signedEnds: number;
  totalEnds: number;
  /** Current (not superseded) card signatures. */
  signatures: {
    role: 'archer' | 'scorer';
    name: string;
    /** The server's time of signing, and the signing phone's own clock ("phone time"). */
    at: string;
    phoneAt: string | null;
    /** "countersigned on paper, recorded by judge …", when it was. */
    onPaper?: string;
    jws: string;
  }[];
  state: CardState;
  final: boolean;
  /** The role the requester may sign the card in now, if any (the total to send is totals.total). */
  canCountersign: 'archer' | 'scorer' | null;
  /** Why the requester cannot sign yet, in words, when they could once the card is ready. */
  countersignNote?: string;
  /**
   * For a judge: the archer has no account, so cannot countersign on a phone; the judge may record
   * the countersignature made on the paper card (with a photo of it) once every end is signed.
   */
  canRecordPaperCountersign: boolean;
};

/** `GET /api/events/:eventId/sessions/:sessionId/cards`: where every card of a session stands. */
export type SessionCardItem = {
  entryId: number;
  name: string;
  division: string;
  targetNumber: number;
  position: 'A' | 'B' | 'C' | 'D';
  signedEnds: number;
  /** Ends whose values are decided (agreed, settled, ruled or signed). */
  endsWithValues: number;
  totalEnds: number;
  /** Over the ends with decided values, as the card view counts it. */
  total: number;
  archerSigned: boolean;
  scorerSigned: boolean;
  final: boolean;
  /** When the final card was last mailed to the archer, if it was. */
  mailedAt: string | null;
  /** Every end is signed but the archer, who has no account, can only countersign on paper: a judge records it. */
  needsPaperCountersign: boolean;
};
export type SessionCards = { sessionId: number; cards: SessionCardItem[] };

/** `POST /api/cards/:sessionId/:entryId/send`: the final card went to this address. */
export type CardSendResult = { sentTo: string };

/** `POST /api/events/:eventId/photos`: the stored photo, to name in a ruling. */
export type PhotoUploadResult = { photoId: number; sha256: string };
export const PHOTO_MAX_BYTES = 5 * 1024 * 1024;

/** `GET /api/verify?sig=…`: what a printed or mailed card's QR code leads to. */
export type VerifyResult =
  | { signatureValid: false; message: string }
  | {
      signatureValid: true;
      kind: 'card' | 'end';
      /** True when the stored content still hashes to what was signed. */
      unchanged: boolean;
      /** True when a judge's later ruling replaced this signature (the content may still match). */
      superseded: boolean;
      /** What the check found, in words. */
      message: string;
      event: string;
      archer: string;
      division: string;
      signedAt: string;
      signers: { name: string; role: string }[];
      /** The totals that were signed (cards only). */
      totals?: { total: number; tens: number; xs: number; hits: number };
      /** `signedAt` is the server's time (cards); this is the signing phone's own clock. */
      phoneAt?: string;
      /** "countersigned on paper, recorded by judge …", for a countersignature a judge recorded. */
      countersigned?: string;
      /** What differs between the card as signed and as it is now (cards). */
      changes?: { what: string; signed: string; now: string }[];
    };
