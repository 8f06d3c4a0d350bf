import type { Request } from 'express';
import { badRequest, notFound } from './httpError';

/**
 * A numeric id from the address (`:sessionId`, `:entryId`…). Anything that is not a whole number
 * above 0 cannot name a row, so it answers like a missing one: "That session does not exist."
 */
export function idParam(req: Request, name: string, what: string): number {
  const raw = req.params[name];
  const id = Number(raw);
  if (typeof raw !== 'string' || !/^\d{1,9}$/.test(raw) || !Number.isInteger(id) || id <= 0) {
    throw notFound(`That ${what} does not exist.`);
  }
  return id;
}

/**
 * `?division=ID` of a results or bracket printout: absent → undefined (the whole event); anything
 * but a whole number above 0 is a 400 that says what is expected.
 */
export function divisionQuery(req: Request): number | undefined {
  const raw = req.query.division;
  if (raw === undefined) return undefined;
  const divisionId = typeof raw === 'string' && /^\d{1,9}$/.test(raw) ? Number(raw) : NaN;
  if (!(divisionId > 0)) throw badRequest('division must be the number of one of the event’s divisions.');
  return divisionId;
}
