import type { IncomingMessage, ServerResponse } from 'node:http';
import express, { type Express } from 'express';
import cookieParser from 'cookie-parser';
import morgan from 'morgan';
import type { LinkAddress } from '../src/contract/linkAddress';
import type { Db } from './db';
import type { Mailer } from './mail/mailer';
import type { AppContext } from './context';
import type { SigningKeys } from './services/signing/serverKeys';
import { securityHeaders } from './http/security';
import { checkBodyShape } from './http/bodyShape';
import { noStore } from './http/noStore';
import { clientFiles } from './http/clientFiles';
import { compressAnswers } from './http/compressAnswers';
import { routeNotFound, errorHandler } from './http/errorHandler';
import { requireUser } from './auth/requireUser';
import { BCRYPT_COST } from './auth/passwords';
import { healthRoutes } from './routes/health';
import { authRoutes } from './routes/auth';
import { operatorMailRoutes } from './routes/operatorMail';
import { eventRoutes } from './routes/events';
import { divisionRoutes } from './routes/divisions';
import { sessionRoutes } from './routes/sessions';
import { entryRoutes } from './routes/entries';
import { staffRoutes } from './routes/staff';
import { sessionTargetRoutes } from './routes/sessionTargets';
import { printoutRoutes } from './routes/printouts';
import { syncRoutes } from './routes/sync';
import { syncLane, type Lane } from './routes/syncLane';
import { joinRoutes } from './routes/join';
import { targetRoutes } from './routes/targets';
import { wellKnownRoutes } from './routes/wellKnown';
import { judgingRoutes } from './routes/judging';
import { cardRoutes } from './routes/cards';
import { verifyRoutes } from './routes/verify';
import { meRoutes } from './routes/me';
import { invitationRoutes } from './routes/invitations';
import { lateValueRoutes } from './routes/lateValues';
import { targetTaskRoutes } from './routes/targetTasks';
import { archerPlaceRoutes } from './routes/archerPlace';
import { cardBoardRoutes } from './routes/cardBoard';
import { resultsRoutes } from './routes/results';
import { matchRoutes } from './routes/matches';

export type AppDeps = {
  db: Db;
  version: string;
  secret: Uint8Array;
  mailer: Mailer;
  /** The operator's key to the caught-mail inbox; leave it out when mail is not caught. */
  mailInboxKey?: string;
  dataDir: string;
  signingKeys: SigningKeys;
  /** Where links in mail and on paper point (server/linkAddress.ts). */
  linkAddress: LinkAddress;
  /** Defaults to the production cost; tests lower it to stay fast. */
  bcryptCost?: number;
  /** Folder of the built client; when it has no index.html only the API is served. */
  clientDir?: string;
  logRequests?: boolean;
  /** Express's `trust proxy` (TRUST_PROXY); off unless given. */
  trustProxy?: boolean | number | string;
};

/** Builds the whole HTTP app without opening a port, so tests can drive it with supertest. */
export function createApp(deps: AppDeps): Express {
  const ctx: AppContext = {
    db: deps.db,
    secret: deps.secret,
    mailer: deps.mailer,
    mailInboxKey: deps.mailInboxKey,
    dataDir: deps.dataDir,
    signingKeys: deps.signingKeys,
    linkAddress: deps.linkAddress,
    bcryptCost: deps.bcryptCost ?? BCRYPT_COST,
    requireUser: requireUser(deps.db, deps.secret),
  };

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', deps.trustProxy ?? false);
  app.use(securityHeaders);
  app.use(compressAnswers);
  if (deps.logRequests) app.use(morgan(':method :url :status :res[content-length] - :response-time ms'));

  const api = express.Router();
  api.use(noStore);
  api.use(express.json({ limit: '256kb' }));
  api.use(checkBodyShape);
  api.use(cookieParser());
  api.use(syncRoutes(ctx));
  api.use(healthRoutes(deps.version));
  api.use(authRoutes(ctx));
  api.use(meRoutes(ctx));
  api.use(invitationRoutes(ctx));
  api.use(operatorMailRoutes(ctx));
  api.use(eventRoutes(ctx));
  api.use(divisionRoutes(ctx));
  api.use(sessionRoutes(ctx));
  api.use(entryRoutes(ctx));
  api.use(staffRoutes(ctx));
  api.use(sessionTargetRoutes(ctx));
  api.use(printoutRoutes(ctx));
  api.use(joinRoutes(ctx));
  api.use(targetRoutes(ctx));
  api.use(judgingRoutes(ctx));
  api.use(cardRoutes(ctx));
  api.use(verifyRoutes(ctx));
  api.use(lateValueRoutes(ctx));
  api.use(targetTaskRoutes(ctx));
  api.use(resultsRoutes(ctx));
  api.use(matchRoutes(ctx));
  api.use(archerPlaceRoutes(ctx));
  api.use(cardBoardRoutes(ctx));
  api.use(routeNotFound);
  app.use('/api', api);
  // Public and outside /api: the key that checks printed and mailed signatures.
  app.use(wellKnownRoutes(ctx));

  const client = deps.clientDir ? clientFiles(deps.clientDir) : undefined;
  if (client) app.use(client);

  app.use(routeNotFound);
  app.use(errorHandler);
  return withFieldLane(app, syncLane(ctx));
}

type Handle = (req: IncomingMessage, res: ServerResponse, next?: (err?: unknown) => void) => void;

/**
 * The field lane answers before Express: nearly every request on a tournament day is a phone's
 * push or pull, and Express's routing, request set-up and body parser cost more than the lane's
 * own work (syncLane.ts). It is left out of the request log too: a line per phone every few
 * seconds would bury the rest. Express calls its `handle` for every request, whether the app is
 * given to `http.createServer`, `app.listen` or a test's supertest, so the lane goes there.
 */
function withFieldLane(app: Express, lane: Lane): Express {
  const express = app as Express & { handle: Handle };
  const handle = express.handle.bind(app);
  express.handle = (req, res, next) => {
    if (!lane(req, res)) handle(req, res, next);
  };
  return app;
}
