import type { Request } from 'express';
import { notFound } from './httpError';

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
