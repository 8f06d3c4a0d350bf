import type { Db } from '../../db';
import { HttpError } from '../../http/httpError';

/**
 * How much one event may hold. Each is well above the largest tournaments (a world championship
 * enters about 1,000 archers in some 30 divisions over a dozen sessions; common practice, no
 * published source), and each keeps every list, printout and card view of an event bounded.
 */
export const EVENT_LIMITS = {
  entries: 2000,
  divisions: 60,
  sessions: 40,
} as const;

type Counted = keyof typeof EVENT_LIMITS;

const TABLES: Record<Counted, string> = {
  entries: 'entries',
  divisions: 'divisions',
  sessions: 'event_sessions',
};

const WORDS: Record<Counted, string> = {
  entries: 'archers on its entry list',
  divisions: 'divisions',
  sessions: 'sessions',
};

/** Refuses (422) adding `adding` more of a kind when the event would hold more than its limit. */
export async function refuseOverLimit(db: Db, eventId: number, kind: Counted, adding = 1): Promise<void> {
  const row = (await db(TABLES[kind]).where({ event_id: eventId }).count({ n: '*' }).first()) as
    { n: number | string } | undefined;
  const held = Number(row?.n ?? 0);
  const limit = EVENT_LIMITS[kind];
  if (held + adding > limit)
    throw new HttpError(
      422,
      'limit_reached',
      `An event holds at most ${limit} ${WORDS[kind]}; this one has ${held}${adding > 1 ? ` and the file adds ${adding}` : ''}.`,
    );
}
