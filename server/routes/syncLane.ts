import express, { Router, type RequestHandler } from 'express';
import {
  PUSH_MAX_CHANGES,
  pullQuerySchema,
  pushRequestSchema,
  type ReceivedPush,
} from '../../src/contract/sync';
import type { AppContext } from '../context';
import { HttpError, badRequest } from '../http/httpError';
import { checkBodyShape } from '../http/bodyShape';
import { leanHeaders, sendJson } from '../http/leanJson';
import { compressLargeAnswers } from '../http/compressAnswers';
import { describeIssues, validateBody } from '../http/validate';
import { pullChanges } from '../services/sync/pullChanges';
import { pushAndPull } from '../services/sync/pushAndPull';
import { mailFinalCards } from '../services/judging/finalCard';

/** More changes than one push takes: 413, which tells the phone to send its batch in halves. */
const refuseLargeBatch: RequestHandler = (req, _res, next) => {
  const changes = (req.body as { mutations?: unknown } | undefined)?.mutations;
  next(
    Array.isArray(changes) && changes.length > PUSH_MAX_CHANGES
      ? new HttpError(413, 'too_large', `Send at most ${PUSH_MAX_CHANGES} changes at once.`)
      : undefined,
  );
};

/**
 * The field lane: the push and the pull, nearly every request of a tournament day (each phone
 * every few seconds). Mounted before the app-wide middleware, each route runs only what it needs:
 * the JSON answer's headers (leanJson.ts), the JSON body parser with the API's limit and shape
 * check, the person remembered with their token, the contract's schema. No cookie parser (a
 * phone signs in with its token), and answers are compressed only when large. A failure goes to
 * the app's error handler like any other (`{error: {code, message}}`).
 */
export function syncLane(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.post(
    '/sync/push',
    leanHeaders,
    compressLargeAnswers,
    express.json({ limit: '256kb' }),
    checkBodyShape,
    ctx.requireFieldUser,
    refuseLargeBatch,
    validateBody(pushRequestSchema),
    async (req, res) => {
      const answer = await pushAndPull(db, req.user!.id, req.body as ReceivedPush, {
        signingKeys: ctx.signingKeys,
        // Mailed after the push is committed, without holding up its answer.
        onFinalCards: (cards) => void mailFinalCards(db, ctx.mailer, cards, ctx.linkAddress.url),
      });
      sendJson(res, answer);
    },
  );

  router.get('/sync/pull', leanHeaders, compressLargeAnswers, ctx.requireFieldUser, async (req, res) => {
    const query = pullQuerySchema.safeParse(req.query);
    if (!query.success) {
      const fields = describeIssues(query.error.issues);
      throw badRequest(
        `The request was not accepted. ${fields.map((f) => `${f.path}: ${f.message}`).join('; ')}`,
        fields,
      );
    }
    sendJson(res, await pullChanges(db, req.user!.id, query.data));
  });

  return router;
}
