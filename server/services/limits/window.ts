import type { Knex } from 'knex';
import { HttpError } from '../../http/httpError';

/** At most `max` of something in any `minutes`. */
export type Window = { max: number; minutes: number };

const spoken = (minutes: number) =>
  minutes >= 120 ? `${Math.round(minutes / 60)} hours` : minutes === 60 ? 'hour' : `${minutes} minutes`;

/**
 * Refuses with 429 when `rows` (a query already narrowed to one person, event or address) hold
 * `max` rows whose `atColumn` lies in the last `minutes`. `says` gets the window in words ("hour")
 * and the wait ("12 minutes") and answers the sentence the person reads.
 */
export async function refuseOverWindow(
  rows: Knex.QueryBuilder,
  atColumn: string,
  window: Window,
  says: (within: string, wait: string) => string,
): Promise<void> {
  const span = window.minutes * 60_000;
  const recent = (await rows
    .where(atColumn, '>=', new Date(Date.now() - span).toISOString())
    .orderBy(atColumn, 'asc')
    .limit(window.max)
    .pluck(atColumn)) as string[];
  if (recent.length < window.max) return;
  const waitMinutes = Math.max(1, Math.ceil((Date.parse(recent[0]!) + span - Date.now()) / 60_000));
  throw new HttpError(
    429,
    'too_many',
    says(spoken(window.minutes), waitMinutes === 1 ? 'a minute' : `${waitMinutes} minutes`),
  );
}
