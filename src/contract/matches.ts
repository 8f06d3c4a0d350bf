import { z } from 'zod';
import type {
  AlternateFrom,
  ArrowValue,
  MatchFormat,
  MatchNext,
  Pair,
  ShootOffOutcome,
  Side,
  SideOutlook,
} from '../core';
import {
  ALTERNATE_FROM,
  MATCH_ARROWS_PER_END,
  MATCH_MAX_ENDS,
  MAX_BRACKET_ENTRANTS,
  MIN_BRACKET_ENTRANTS,
} from '../core/matches';
import { arrowValueSchema } from './arrowValueSchema';
import { emailSchema } from './auth';
import { joinCodeSchema } from './joinCode';
import { oneMeasure, shootOffArrowFields } from './shootOffArrowSchema';

/*
 * Eliminations: the organizer's bracket per division, match targets and walkovers; the judge's
 * match ends, shoot-off arrows and signature; the bracket as everyone sees it.
 */

const id = z.number().int().positive();
const sideSchema = z.enum(['a', 'b'], { error: 'Side must be "a" (upper line) or "b" (lower line).' });

export const createBracketSchema = z.object({
  /** The qualification session whose standings seed the bracket. */
  sessionId: id,
  divisionId: id,
  /** How many archers go through, or everyone who qualified (the division's cut, or all its archers). */
  size: z.union([
    z
      .number()
      .int()
      .min(MIN_BRACKET_ENTRANTS, `A bracket needs at least ${MIN_BRACKET_ENTRANTS} archers.`)
      .max(MAX_BRACKET_ENTRANTS, `A bracket takes at most ${MAX_BRACKET_ENTRANTS} archers.`),
    z.literal('everyone'),
  ]),
  /** Set system or cumulative; by default from the division's bow style (compound: cumulative). */
  format: z.enum(['sets', 'cumulative']).optional(),
});
export type CreateBracket = z.infer<typeof createBracketSchema>;

const threeValues = z
  .array(arrowValueSchema)
  .length(MATCH_ARROWS_PER_END, `A match end has ${MATCH_ARROWS_PER_END} arrows a side.`);

export const matchEndSchema = z.object({ a: threeValues, b: threeValues });
export type MatchEndBody = z.infer<typeof matchEndSchema>;
export const MATCH_END_INDEX_MAX = MATCH_MAX_ENDS - 1;

const shootOffArrowSchema = z.object(shootOffArrowFields).refine(...oneMeasure);

export const matchShootOffSchema = z.object({ a: shootOffArrowSchema, b: shootOffArrowSchema });
export type MatchShootOffBody = z.infer<typeof matchShootOffSchema>;

/** Which matches of a bracket are shot alternately (core `alternates`). */
export const bracketSettingsSchema = z.object({
  alternate: z.enum(ALTERNATE_FROM, {
    error:
      'Alternate must be "never", "medal-matches" (bronze and gold) or "semi-finals" (the semi-finals and both medal matches).',
  }),
});
export type BracketSettings = z.infer<typeof bracketSettingsSchema>;

export const matchTargetSchema = z.object({
  targetNumber: z.number().int().min(1, 'Target numbers start at 1.').max(999).nullable(),
});

export const matchWalkoverSchema = z.object({
  /** The side that does not shoot: its opponent goes through. */
  side: sideSchema,
  reason: z.enum(['withdrawal', 'no-show'], { error: 'Reason must be "withdrawal" or "no-show".' }),
});
export type MatchWalkover = z.infer<typeof matchWalkoverSchema>;

export type DecidedBy = 'score' | 'shoot-off' | 'bye' | 'withdrawal' | 'no-show';

export type MatchSideDto = { seed: number; archers: { entryId: number; name: string; club: string }[] };

/**
 * A match card's end that counts: `writers` when the two writers agreed on it, `judge` when a judge
 * entered or settled it; `signed` once a judge signed it (closed to the writers).
 */
export type MatchEndDto = { a: ArrowValue[]; b: ArrowValue[]; by?: 'writers' | 'judge'; signed?: true };

/** One writer's own record of one end of a match (both sides' arrows), kept apart from the other's. */
export type MatchWriteDto = { slot: 1 | 2; endIndex: number; a: ArrowValue[]; b: ArrowValue[] };

export type MatchDto = {
  id: number;
  round: number;
  slot: number;
  bronze: boolean;
  targetNumber: number | null;
  sides: Partial<Record<Side, MatchSideDto>>;
  ends: MatchEndDto[];
  /** Each writer's own records when two writers score the match at the target. */
  writes: MatchWriteDto[];
  shootOff: Partial<Record<Side, { value: ArrowValue; distanceMm?: number; closer?: boolean }>>;
  /** The core's reading of the ends so far (null until both sides are known). */
  state: {
    score: Pair;
    totals: Pair;
    setPoints: (Pair | null)[];
    next: MatchNext;
    winner: Side | null;
    endsLeft: number;
    shootOff: ShootOffOutcome | null;
    outlook: Record<Side, SideOutlook>;
  } | null;
  /** Shot alternately (the bracket's setting): one arrow each in turn, the side behind first. */
  alternate: boolean;
  /** The side chosen to shoot first in the first end of an alternating match, once recorded. */
  firstShooter: Side | null;
  /** Set once the judge signs, or by a bye, withdrawal or no-show: the bracket moves on. */
  winner: Side | null;
  decidedBy: DecidedBy | null;
  signedAt: string | null;
  /** The archers (entry ids) who countersigned the card after the judge's signature. */
  countersignedBy: number[];
};

export type BracketDto = {
  id: number;
  divisionId: number;
  divisionName: string;
  sessionId: number;
  format: MatchFormat;
  /** Which of its matches are shot alternately. */
  alternate: AlternateFrom;
  entrants: number;
  size: number;
  rounds: number;
  matches: MatchDto[];
  /** Final places as far as they are known, best first. */
  places: { place: number; entryId: number; name: string; club: string; seed: number }[];
};

/*
 * The judge's match changes as they travel through the phone's outbox (sync kinds `match.end`,
 * `match.shootoff`, `match.endSign`, `match.sign`): the same bodies as the routes, with the event and match named.
 */
const matchRef = { eventId: id, matchId: id };

export const matchEndArgsSchema = z.object({
  ...matchRef,
  endIndex: z.number().int().min(0).max(MATCH_END_INDEX_MAX, `A match has ends 1 to ${MATCH_MAX_ENDS}.`),
  a: threeValues,
  b: threeValues,
});
export type MatchEndArgs = z.infer<typeof matchEndArgsSchema>;

export const matchShootOffArgsSchema = z.object({
  ...matchRef,
  a: shootOffArrowSchema,
  b: shootOffArrowSchema,
});
export type MatchShootOffArgs = z.infer<typeof matchShootOffArgsSchema>;

export const matchSignArgsSchema = z.object(matchRef);
export type MatchSignArgs = z.infer<typeof matchSignArgsSchema>;

/** A judge signs one counted set (set system) or end (cumulative) of a match (sync kind `match.endSign`). */
export const matchEndSignArgsSchema = z.object({
  ...matchRef,
  endIndex: z.number().int().min(0).max(MATCH_END_INDEX_MAX, `A match has ends 1 to ${MATCH_MAX_ENDS}.`),
});
export type MatchEndSignArgs = z.infer<typeof matchEndSignArgsSchema>;

/**
 * Two writers at the match's target (sync kinds `match.write`, `match.countersign`): a writer's
 * record of one end, both sides' arrows, partial while being tapped; an archer's countersignature.
 */
const upToThree = z
  .array(arrowValueSchema)
  .max(MATCH_ARROWS_PER_END, `A match end has ${MATCH_ARROWS_PER_END} arrows a side.`);

export const matchWriteArgsSchema = z.object({
  ...matchRef,
  endIndex: z.number().int().min(0).max(MATCH_END_INDEX_MAX, `A match has ends 1 to ${MATCH_MAX_ENDS}.`),
  a: upToThree,
  b: upToThree,
});
export type MatchWriteArgs = z.infer<typeof matchWriteArgsSchema>;

export const matchCountersignArgsSchema = z.object(matchRef);
export type MatchCountersignArgs = z.infer<typeof matchCountersignArgsSchema>;

/** Who shoots first in the first end of an alternating match (sync kind `match.firstShooter`): a writer or a judge. */
export const matchFirstShooterArgsSchema = z.object({ ...matchRef, side: sideSchema });
export type MatchFirstShooterArgs = z.infer<typeof matchFirstShooterArgsSchema>;

/** Joining a match's target with the match's join code. */
export const matchJoinSchema = z.object({
  code: joinCodeSchema,
});
export type MatchJoin = z.infer<typeof matchJoinSchema>;

/** The organizer names a scorer (an account's email) to write for one line in place of its archer; null takes it back. */
export const matchScorerSchema = z.object({
  slot: z.union([z.literal(1), z.literal(2)], { error: 'Slot must be 1 (upper line) or 2 (lower line).' }),
  email: emailSchema.nullable(),
});
export type MatchScorerBody = z.infer<typeof matchScorerSchema>;

/** What a writer's phone needs to score one match, offline too. */
export type MatchPadDto = {
  eventId: number;
  eventName: string;
  divisionName: string;
  roundName: string;
  format: MatchFormat;
  /** This person's writer slot: 1 for the upper line's archer or scorer, 2 for the lower's. */
  slot: 1 | 2;
  /** The entry this person may countersign for (an archer of the match), if any. */
  ownEntryId: number | null;
  match: MatchDto;
};

export type MatchJoinCodeDto = { matchId: number; code: string };
