import { z } from 'zod';
import type { ArrowValue, Venue } from '../core';
import { shootOffArrowFields, oneMeasure } from './shootOffArrowSchema';

/*
 * Results: the standings the server computes from the cards, the organizer's results settings,
 * and the judge's shoot-off arrows (a mutation through /api/sync/push, recorded on the field).
 */

const id = z.number().int().positive();

/** One shoot-off arrow of one archer. Re-recording the same arrow replaces it. */
export const shootOffRecordArgsSchema = z
  .object({
    sessionId: id,
    entryId: id,
    /** Which shoot-off arrow, from 0 (archers still level shoot again). */
    arrowIndex: z.number().int().min(0).max(19),
    ...shootOffArrowFields,
  })
  .refine(...oneMeasure);
export type ShootOffRecordArgs = z.infer<typeof shootOffRecordArgsSchema>;

/** How far a row can be trusted: ends still unsigned, every end signed by a judge, or countersigned. */
export type Trust = 'provisional' | 'signed' | 'final';

export type ShootOffArrowDto = { value: ArrowValue; distanceMm?: number; closer?: boolean };

export type StandingRow = {
  entryId: number;
  name: string;
  club: string;
  targetNumber: number;
  total: number;
  tens: number;
  /** Xs outdoors, 9s indoors: the second count of the tie-break (see `secondCount`). */
  second: number;
  hits: number;
  endsShot: number;
  totalEnds: number;
  place: number;
  tied: boolean;
  /** Equal totals decide the cut or a medal and wait for a shoot-off. */
  shootOff: boolean;
  decidedByShootOff: boolean;
  shootOffArrows: ShootOffArrowDto[];
  trust: Trust;
  /** The archer's class inside the division (an age class); empty when none. */
  className: string;
};

/** One class of a division ranked on its own: places within the class, by the same tie rules. */
export type ClassStandings = { name: string; rows: StandingRow[] };

export type TeamRow = {
  club: string;
  members: { entryId: number; name: string; total: number }[];
  total: number;
  tens: number;
  second: number;
  place: number;
  tied: boolean;
  shootOff: boolean;
};

export type DivisionStandings = {
  divisionId: number;
  name: string;
  roundName: string;
  venue: Venue;
  secondCount: 'Xs' | '9s';
  /** Archers who go through to the eliminations; null when there are none. */
  cut: number | null;
  rows: StandingRow[];
  teams: TeamRow[];
  /** Each class of the division, by name; empty when no archer of it has a class. */
  classes: ClassStandings[];
};

export type SessionStandings = { sessionId: number; name: string; divisions: DivisionStandings[] };

/** `GET /api/results/:eventId` (public once published) and the organizer's view of the same. */
export type EventResults = {
  event: { id: number; name: string; venue: string; published: boolean; teamSize: number };
  computedAt: string;
  finalCards: number;
  totalCards: number;
  sessions: SessionStandings[];
};

/** The organizer's results settings; each field is optional and only what is given changes. */
export const resultsSettingsSchema = z
  .object({
    published: z.boolean().optional(),
    teamSize: z.number().int().min(1, 'A team has at least 1 archer.').max(12).optional(),
    cuts: z
      .array(
        z.object({
          divisionId: id,
          cut: z.number().int().min(1, 'A cut lets at least 1 archer through.').max(1024).nullable(),
        }),
      )
      .max(100)
      .optional(),
    /** Entries taken out of (false) or put back into (true) the team competition. */
    teams: z
      .array(z.object({ entryId: id, inTeam: z.boolean() }))
      .max(2000)
      .optional(),
  })
  .strict();
export type ResultsSettings = z.infer<typeof resultsSettingsSchema>;

/** `POST /api/events/:eventId/results/send`: nothing to choose, the body is an empty object. */
export const resultsSendSchema = z.object({}).strict();

/** What "send results" did: mails handed to the mail server, entrants without an address, refusals. */
export type ResultsSendReport = { sent: number; withoutAddress: number; failed: number };
