import type { IncomingMessage, ServerResponse } from 'node:http';
import { parse as parseQuery } from 'node:querystring';
import { PUSH_MAX_CHANGES, pullQuerySchema, pushRequestSchema } from '../../src/contract/sync';
import type { AppContext } from '../context';
import { personOfHeader } from '../auth/requireUser';
import { HttpError, badRequest } from '../http/httpError';
import { bodyShapeProblem } from '../http/bodyShape';
import { errorBody, httpErrorOf } from '../http/errorHandler';
import { readJsonBody } from '../http/jsonBody';
import { sendLeanJson } from '../http/leanJson';
import { checkedBody } from '../http/validate';
import { pullChanges } from '../services/sync/pullChanges';
import { pushAndPull } from '../services/sync/pushAndPull';
import { mailFinalCards } from '../services/judging/finalCard';

/** The API's body limit (server/app.ts). */
const BODY_LIMIT = 256 * 1024;

const PUSH = { method: 'POST', path: '/api/sync/push' } as const;
const PULL = { method: 'GET', path: '/api/sync/pull' } as const;
/** The lane's routes, which Express's router does not list (the authorization table covers them). */
export const LANE_ROUTES = [PUSH, PULL].map((r) => `${r.method} ${r.path}`);

/** Answers the request when it is the lane's (true), or leaves it to Express (false). */
export type Lane = (req: IncomingMessage, res: ServerResponse) => boolean;

/**
 * The field lane: the push and the pull, nearly every request of a tournament day (each phone
 * every few seconds), answered on Node's own request before Express (server/app.ts), running
 * only what they need, in the order the app's middleware would: the JSON body with the API's
 * limit and shape check, the person remembered with their token, the contract's schema; the
 * JSON answer's headers (leanJson.ts), compressed only when large. No cookie parser (a phone
 * signs in with its token), no request log. Every failure is answered like the app's error
 * handler answers it (`{error: {code, message}}`, a 500 logged).
 */
export function syncLane(ctx: AppContext): Lane {
  const { db } = ctx;
  // Push and pull use only the person's id: kept with the token (personOfHeader's `remember`).
  const personOf = personOfHeader(db, ctx.secret, { remember: true });

  const push = async (req: IncomingMessage) => {
    const body = await readJsonBody(req, BODY_LIMIT);
    const problem = bodyShapeProblem(body);
    if (problem) throw badRequest(`The request was not accepted. ${problem}`);
    const person = await personOf(req.headers.authorization);
    // More changes than one push takes: 413, which tells the phone to send its batch in halves.
    const changes = (body as { mutations?: unknown } | undefined)?.mutations;
    if (Array.isArray(changes) && changes.length > PUSH_MAX_CHANGES)
      throw new HttpError(413, 'too_large', `Send at most ${PUSH_MAX_CHANGES} changes at once.`);
    return pushAndPull(db, person.id, checkedBody(pushRequestSchema, body), {
      signingKeys: ctx.signingKeys,
      // Mailed after the push is committed, without holding up its answer.
      onFinalCards: (cards) => void mailFinalCards(db, ctx.mailer, cards, ctx.linkAddress.url),
    });
  };

  const pull = async (req: IncomingMessage, search: string) => {
    const person = await personOf(req.headers.authorization);
    // Express's own ("simple") query parser, so the contract reads the same values.
    return pullChanges(db, person.id, checkedBody(pullQuerySchema, parseQuery(search)));
  };

  return (req, res) => {
    const url = req.url ?? '';
    const mark = url.indexOf('?');
    const path = mark < 0 ? url : url.slice(0, mark);
    const answer =
      req.method === PUSH.method && path === PUSH.path
        ? push(req)
        : req.method === PULL.method && path === PULL.path
          ? pull(req, mark < 0 ? '' : url.slice(mark + 1))
          : undefined;
    if (!answer) return false;
    answer.then(
      (value) => sendLeanJson(req, res, value),
      (error: unknown) => {
        const httpError = httpErrorOf(error, `${req.method} ${url}`);
        sendLeanJson(req, res, errorBody(httpError), httpError.status);
      },
    );
    return true;
  };
}
