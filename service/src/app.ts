import { existsSync } from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pino, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import { authRouter } from './auth/auth.routes.js';
import { passwordRouter } from './auth/password.routes.js';
import { mailSettingsRouter } from './auth/mail-settings.routes.js';
import { adminRouter } from './admin/admin.routes.js';
import { codeEditionsRouter } from './code-tables/code-tables.routes.js';
import type { Config } from './config.js';
import type { Database } from './db/database.js';
import { healthRouter } from './health/health.routes.js';
import { historyRouter } from './history/history.routes.js';
import { errorHandler, notFoundHandler } from './http/error-handler.js';
import { exactJsonBody } from './http/json-body.js';
import { hstsWhenSecure, noStore, permissionsPolicy } from './http/security-headers.js';
import { loadProject } from './http/project-access.js';
import { readSession, requireSignIn } from './http/session.js';
import { projectsRouter } from './projects/projects.routes.js';
import { designRouter } from './design/design.routes.js';
import { cutSheetsRouter } from './design/cut-sheets.routes.js';
import { evaluateRouter, openApiRouter, projectResultsRouter } from './evaluation/evaluation.routes.js';
import { teamRouter } from './team/team.routes.js';
import { projectInvitationsRouter, publicInvitationsRouter } from './team/invitations.routes.js';
import { liveRouter } from './live/live.routes.js';
import { reviewRouter } from './review/review.routes.js';
import { exteriorScheduleRouter } from './exterior-schedule/exterior-schedule.routes.js';
import { reviewDeskRouter, reviewItemsRouter } from './review/review-items.routes.js';
import { packageRouter } from './package/package.routes.js';
import { fieldTestsRouter } from './field-tests/field-tests.routes.js';
import type { PackageJobs } from './package/package-jobs.js';
import { s3Storage, type FileStorage } from './package/storage.js';
import { verifyRouter } from './package/verify.routes.js';
import { ProjectChanges } from './live/project-changes.js';
import type { Knex } from 'knex';
import type { ClientConfig as PgClientConfig } from 'pg';

export interface AppDeps {
  db: Database;
  config: Config;
  logger?: Logger;
  /** Who watches which project; one is made from the database's connection when not given. */
  changes?: ProjectChanges;
  /** Told when a message was queued in the outbox (the server's mail sender); nothing by default. */
  mailQueued?: () => void;
  /** Where package files are kept; the S3 bucket the settings name when not given. */
  storage?: FileStorage;
  /** The background jobs that make large packages (started beside the mail sender); without them every package is made at once. */
  packageJobs?: PackageJobs;
}

/** The connection the change listener opens: the same database as the pool's. */
function connectionOf(db: Database): string | PgClientConfig {
  return (db.client as { config: Knex.Config }).config.connection as string | PgClientConfig;
}

export function createApp({
  db,
  config,
  logger = pino({ level: config.LOG_LEVEL }),
  changes = new ProjectChanges(connectionOf(db), logger),
  mailQueued = () => {},
  storage = s3Storage(config),
  packageJobs,
}: AppDeps): Express {
  const app = express();
  app.locals['changes'] = changes;
  app.disable('x-powered-by');
  app.set('trust proxy', config.TRUST_PROXY);

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: null,
        },
      },
      strictTransportSecurity: false,
    }),
  );
  app.use(hstsWhenSecure, permissionsPolicy);
  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      // A logged cookie or CSRF token is a session anyone who can read the logs could take over.
      redact: ['req.headers.cookie', 'req.headers.authorization', 'req.headers["x-csrf-token"]', 'res.headers["set-cookie"]'],
    }),
  );
  app.use(exactJsonBody(config.JSON_BODY_LIMIT));
  app.use(cookieParser());

  const api = express.Router();
  api.use(noStore);
  api.use(readSession(db, config.JWT_SECRET));
  api.use('/health', healthRouter(db));
  api.use(
    '/auth',
    authRouter(db, {
      secret: config.JWT_SECRET,
      sessionHours: config.SESSION_HOURS,
      cookieSecure: config.COOKIE_SECURE,
      loginRateLimit: config.LOGIN_RATE_LIMIT,
      loginRateWindowMinutes: config.LOGIN_RATE_WINDOW_MINUTES,
      loginAccountRateLimit: config.LOGIN_ACCOUNT_RATE_LIMIT,
      loginAccountRateWindowMinutes: config.LOGIN_ACCOUNT_RATE_WINDOW_MINUTES,
      logger,
    }),
  );
  api.use('/auth', passwordRouter(db, { appUrl: config.APP_URL, resetMinutes: config.PASSWORD_RESET_MINUTES, mailQueued, logger }));
  api.use(
    '/invitations',
    publicInvitationsRouter(db, {
      secret: config.JWT_SECRET,
      sessionHours: config.SESSION_HOURS,
      cookieSecure: config.COOKIE_SECURE,
      logger,
    }),
  );
  api.use(requireSignIn);
  api.use('/auth', mailSettingsRouter(db));
  api.use('/admin', adminRouter(db, { appUrl: config.APP_URL, mailQueued }));
  api.use('/code-editions', codeEditionsRouter(db));
  // Every route under one project reads it, and the caller's role on it, from what this loads once.
  api.use('/projects/:projectId', loadProject(db));
  api.use('/projects', projectsRouter(db));
  api.use('/projects/:projectId', designRouter(db, storage));
  api.use('/projects/:projectId', cutSheetsRouter(db, storage));
  api.use('/projects/:projectId', projectResultsRouter(db));
  api.use('/projects/:projectId', teamRouter(db));
  api.use('/projects/:projectId', projectInvitationsRouter(db, { appUrl: config.APP_URL, days: config.INVITATION_DAYS, mailQueued }));
  api.use('/projects/:projectId', historyRouter(db));
  api.use('/projects/:projectId', reviewRouter(db, { appUrl: config.APP_URL, mailQueued }));
  api.use('/projects/:projectId', exteriorScheduleRouter(db));
  api.use('/projects/:projectId', reviewItemsRouter(db));
  api.use('/review-desk', reviewDeskRouter(db));
  api.use('/projects/:projectId', fieldTestsRouter(db, storage));
  api.use(
    '/projects/:projectId',
    packageRouter(db, storage, { appUrl: config.APP_URL, mailQueued, jobs: packageJobs, jobMinSpaces: config.PACKAGE_JOB_MIN_SPACES }),
  );
  api.use('/projects/:projectId', liveRouter(db, changes));
  api.use('/evaluate', evaluateRouter(db));
  api.use('/openapi.json', openApiRouter());
  api.use(notFoundHandler);
  app.use('/api', api);
  // Open to anyone: a permit office checks a printed package's fingerprint without an account.
  app.use('/verify', verifyRouter(db));

  if (config.WEB_DIST && existsSync(config.WEB_DIST)) {
    const webDist = path.resolve(config.WEB_DIST);
    app.use(express.static(webDist, { index: false, maxAge: '1h', setHeaders: noCacheForIndex }));
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(path.join(webDist, 'index.html'));
    });
  }

  app.use(notFoundHandler);
  app.use(errorHandler);
  return app;
}

function noCacheForIndex(res: express.Response, filePath: string): void {
  if (filePath.endsWith('index.html')) {
    res.setHeader('Cache-Control', 'no-cache');
  }
}
