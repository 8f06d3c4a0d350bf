import { z } from 'zod';
import { BOW_STYLES, FACE_IDS, VENUES, type BowStyle, type FaceId, type Venue } from '../core/faces';
import { ROUND_CATALOG } from '../core/rounds';
import { SHAFT_DIAMETER_MM } from '../core/shaft';
import { PRACTICE_MAX_ARROWS_PER_END, PRACTICE_MAX_ENDS, PRACTICE_NOTE_MAX } from '../core/practice/limits';
import { arrowValueSchema } from './arrowValueSchema';

/**
 * The practice log synced to the person's account (docs/practice.md): a session's setup and each
 * end are changes of their own, each replacing the one before, so sending one again (a retry, a
 * reload) changes nothing and an arrow is in effect once. Sizes are bounded here, on both sides.
 */

const sessionId = z.uuid('A practice session is named by its id (a UUID).');
const isoTime = z.iso.datetime({ error: 'Times are ISO 8601 in UTC, like 2026-05-01T09:30:00.000Z.' });
const faceId = z.enum(FACE_IDS as [FaceId, ...FaceId[]], { error: 'Choose a face this app knows.' });
const roundIds = new Set(ROUND_CATALOG.map((r) => r.id));
const SHAFT_WORDS = `A shaft is ${SHAFT_DIAMETER_MM.min} to ${SHAFT_DIAMETER_MM.max} mm across.`;
const distanceMessage = 'A distance is a number of metres from 1 to 150.';
const distanceM = z.number({ error: distanceMessage }).min(1, distanceMessage).max(150, distanceMessage);
/** A count the phone sends as a number; its message names the bounds, whatever was wrong. */
const wholeNumber = (min: number, max: number, what: string) => {
  const message = `${what} a whole number from ${min} to ${max}.`;
  return z.number({ error: message }).int(message).min(min, message).max(max, message);
};
const indexMessage = 'An end is numbered by a whole number from 0 (the first end).';

/** A session's setup: what the phone's practiceSessions row holds, without owner and progress. */
export const practiceSessionSchema = z.object({
  id: sessionId,
  startedAt: isoTime,
  roundId: z
    .string()
    .max(60)
    .refine(
      (id) => roundIds.has(id),
      'This round is not in the catalog. This phone may need the newest version.',
    )
    .optional(),
  bowStyle: z.enum(BOW_STYLES as [BowStyle, ...BowStyle[]], {
    error: 'Bow style must be recurve, compound or barebow.',
  }),
  venue: z.enum(VENUES as [Venue, ...Venue[]], { error: 'Venue must be outdoor or indoor.' }),
  distanceM,
  faceId,
  arrowsPerEnd: wholeNumber(1, PRACTICE_MAX_ARROWS_PER_END, 'Arrows per end are'),
  plannedEnds: wholeNumber(1, PRACTICE_MAX_ENDS, 'Planned ends are').nullable(),
  // The core's range (src/core/shaft.ts): the phone and the server read a shaft alike.
  shaftDiameterMm: z
    .number({ error: SHAFT_WORDS })
    .min(SHAFT_DIAMETER_MM.min, SHAFT_WORDS)
    .max(SHAFT_DIAMETER_MM.max, SHAFT_WORDS),
  note: z.string().max(PRACTICE_NOTE_MAX, `A note has at most ${PRACTICE_NOTE_MAX} characters.`).optional(),
  finishedAt: isoTime.optional(),
});
export type PracticeSessionDto = z.infer<typeof practiceSessionSchema>;

/**
 * A setup as the server gives it back: with `revivedAt` when the session was deleted on one phone
 * and another phone's later change brought it back (set by the server only; a phone never sends it).
 */
export type PulledPracticeSession = PracticeSessionDto & { revivedAt?: string };

/** Where a plotted arrow hit, in mm from the centre of the sheet: well within any sheet. */
const mm = z.number().min(-1000).max(1000);

export const practiceArrowSchema = z.object({
  value: arrowValueSchema,
  xMm: mm.optional(),
  yMm: mm.optional(),
  spot: z.number().int().min(0).max(2).optional(),
});

/** One end as the phone holds it now; no arrows means the end was taken back. */
export const practiceEndSchema = z.object({
  sessionId,
  index: z
    .number({ error: indexMessage })
    .int(indexMessage)
    .min(0, indexMessage)
    .max(PRACTICE_MAX_ENDS - 1, `A practice session holds at most ${PRACTICE_MAX_ENDS} ends.`),
  distanceM,
  faceId,
  arrows: z
    .array(practiceArrowSchema)
    .max(PRACTICE_MAX_ARROWS_PER_END, `An end holds at most ${PRACTICE_MAX_ARROWS_PER_END} arrows.`),
  at: isoTime,
});
export type PracticeEndDto = z.infer<typeof practiceEndSchema>;

export const practiceDeleteSchema = z.object({ sessionId });
export type PracticeDeleteArgs = z.infer<typeof practiceDeleteSchema>;
