import express, { type Express } from 'express';
import type { Logger } from 'pino';
import { authenticateBearer } from './auth/authenticate.ts';
import { loadEnv, type Env } from './config/env.ts';
import type { Database } from './db/client.ts';
import { clientAppRouter } from './http/client-app.ts';
import { apiNotFound, errorHandler } from './http/errors.ts';
import { requestLogger } from './http/logger.ts';
import { healthRouter } from './health/health.routes.ts';

export interface AppDeps {
  database: Database;
  logger: Logger;
  /** Parsed environment; defaults to the defaults (tests). */
  env?: Env;
  /** Folder of the built client; when set, the app serves it with history fallback. */
  clientDir?: string | undefined;
}

/** Builds the Express app without listening, so tests can mount it. */
export function createApp(deps: AppDeps): Express {
  const { database, logger, clientDir } = deps;
  const env = deps.env ?? loadEnv({});
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(requestLogger(logger));
  app.use(express.json({ limit: '1mb' }));
  app.use(authenticateBearer(database.db));
  void env;

  // Every API router, in one visible table.
  app.use('/api/health', healthRouter(database.pool));
  app.use('/api', apiNotFound);

  if (clientDir) app.use(clientAppRouter(clientDir));
  app.use(errorHandler);
  return app;
}
