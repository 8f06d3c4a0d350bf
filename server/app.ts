import express, { type Express } from 'express';
import morgan from 'morgan';
import type { Db } from './db';
import { securityHeaders } from './http/security';
import { clientFiles } from './http/clientFiles';
import { routeNotFound, errorHandler } from './http/errorHandler';
import { healthRoutes } from './routes/health';

export type AppDeps = {
  db: Db;
  version: string;
  /** Folder of the built client; when it has no index.html only the API is served. */
  clientDir?: string;
  logRequests?: boolean;
};

/** Builds the whole HTTP app without opening a port, so tests can drive it with supertest. */
export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(securityHeaders);
  if (deps.logRequests) app.use(morgan(':method :url :status :res[content-length] - :response-time ms'));

  const api = express.Router();
  api.use(express.json({ limit: '256kb' }));
  api.use(healthRoutes(deps.version));
  api.use(routeNotFound);
  app.use('/api', api);

  const client = deps.clientDir ? clientFiles(deps.clientDir) : undefined;
  if (client) app.use(client);

  app.use(routeNotFound);
  app.use(errorHandler);
  return app;
}
