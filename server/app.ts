import express, { type Express } from 'express';
import type { Logger } from 'pino';
import { authRouter } from './auth/auth.routes.ts';
import { authenticateBearer } from './auth/authenticate.ts';
import { refuseCrossSiteWrites } from './auth/csrf.ts';
import { createRateLimits } from './auth/rate-limits.ts';
import { createSessionAuth } from './auth/session.ts';
import { loadEnv, type Env } from './config/env.ts';
import type { Database } from './db/client.ts';
import { clientAppRouter } from './http/client-app.ts';
import { apiNotFound, errorHandler } from './http/errors.ts';
import { requestLogger } from './http/logger.ts';
import { securityHeaders } from './http/security-headers.ts';
import { healthRouter } from './health/health.routes.ts';
import { meRouter } from './me/me.routes.ts';
import { tokensRouter } from './tokens/tokens.routes.ts';
import { mailboxReaderFromEnv } from './mail/mailbox-reader.ts';
import { mailboxRouter } from './mail/mailbox.routes.ts';
import type { TrialQueue } from './jobs/trial-queue.ts';
import { candidatesRouter } from './candidates/candidates.routes.ts';
import { revisionsRouter } from './revisions/revisions.routes.ts';
import { trialsRouter } from './trials/trials.routes.ts';
import { commentsRouter } from './comments/comments.routes.ts';
import { reviewsRouter } from './reviews/reviews.routes.ts';
import { promotionsRouter } from './promotions/promotions.routes.ts';
import { logbookRouter } from './logbook/logbook.routes.ts';
import { teamsRouter } from './teams/teams.routes.ts';
import { membersRouter } from './members/members.routes.ts';
import { invitationsRouter } from './invitations/invitations.routes.ts';
import { routinesRouter } from './routines/routines.routes.ts';
import { matrixSetsRouter } from './matrix-sets/matrix-sets.routes.ts';
import { uploadsRouter } from './uploads/uploads.routes.ts';
import { auditRouter } from './audit/audit.routes.ts';

export interface AppDeps {
  database: Database;
  logger: Logger;
  /** Parsed environment; defaults to the defaults (tests). */
  env?: Env;
  /** Folder of the built client; when set, the app serves it with history fallback. */
  clientDir?: string | undefined;
  /** Where submitted revisions' trials are queued; without it they stay queued (tests). */
  queue?: TrialQueue | undefined;
}

/** Builds the Express app without listening, so tests can mount it. */
export function createApp(deps: AppDeps): Express {
  const { database, logger, clientDir } = deps;
  const env = deps.env ?? loadEnv({});
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(requestLogger(logger));
  app.use(securityHeaders(env));
  const limits = createRateLimits(env);
  app.use('/auth/github', limits.signIn);
  app.use(express.json({ limit: '1mb' }));
  // Sign-in: the session cookie first, then a Bearer token (which wins when both are sent);
  // both end in req.currentUser. Cookie-authenticated writes must come from our own pages.
  const sessionAuth = createSessionAuth(database, env);
  app.use(['/api', '/auth'], sessionAuth.middleware);
  app.use(limits.tokenFailures, authenticateBearer(database.db));
  app.use(refuseCrossSiteWrites(env));
  app.post(['/api/routines/:id/candidates', '/api/candidates/:id/revisions'], limits.submissions);

  // Every API router, in one visible table.
  app.use('/auth', authRouter({ db: database.db, env, sessionAuth }));
  app.use('/api/health', healthRouter(database.pool));
  app.use('/api/me', meRouter(database.db));
  app.use('/api/tokens', tokensRouter(database.db));
  app.use('/api/dev/mailbox', mailboxRouter(env, mailboxReaderFromEnv(env)));
  // The review process: each router names its full paths under /api.
  app.use('/api', candidatesRouter(database.db, deps.queue));
  app.use('/api', revisionsRouter(database.db, deps.queue));
  app.use('/api', trialsRouter(database.db));
  app.use('/api', commentsRouter(database.db));
  app.use('/api', reviewsRouter(database.db, env));
  app.use('/api', promotionsRouter(database.db, env));
  app.use('/api', logbookRouter(database.db));
  // The team side: teams, members, invitations, routines, matrix sets, uploads, audit log.
  app.use('/api', teamsRouter(database.db));
  app.use('/api', membersRouter(database.db));
  app.use('/api', invitationsRouter(database.db, env));
  app.use('/api', routinesRouter(database.db));
  app.use('/api', matrixSetsRouter(database.db));
  app.use('/api', uploadsRouter(database.db));
  app.use('/api', auditRouter(database.db));
  app.use('/api', apiNotFound);

  if (clientDir) app.use(clientAppRouter(clientDir));
  app.use(errorHandler);
  return app;
}
