import type { RequestHandler } from 'express';
import type { EventRole } from '../../src/contract/auth';
import type { Db } from '../db';
import { badRequest, forbidden, notFound, unauthorized } from '../http/httpError';
import './types';

export async function rolesInEvent(db: Db, userId: number, eventId: number): Promise<EventRole[]> {
  const rows = await db('event_roles').where({ event_id: eventId, user_id: userId }).select('role');
  return rows.map((r) => r.role as EventRole);
}

/**
 * Allows the request only when the signed-in person holds one of `allowed` in the event named by
 * the `:eventId` route parameter. Must run after requireUser.
 */
export function requireEventRole(db: Db, ...allowed: EventRole[]): RequestHandler {
  return async (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    const eventId = Number(req.params.eventId);
    if (!Number.isInteger(eventId) || eventId <= 0)
      return next(badRequest('The event number in the address is not valid.'));
    const event = await db('events').where({ id: eventId }).first('id');
    if (!event) return next(notFound('That event does not exist.'));
    const roles = await rolesInEvent(db, req.user.id, eventId);
    if (!roles.some((r) => allowed.includes(r))) {
      const needed = allowed.join(' or ');
      return next(forbidden(`Only an event ${needed} can do this.`));
    }
    req.eventRoles = roles;
    next();
  };
}
