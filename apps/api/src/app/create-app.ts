import cors from 'cors';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Knex } from 'knex';
import pino, { type Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import { analysesRoutes } from './analyses/analyses.routes';
import { auditRoutes } from './audit/audit.routes';
import { authRoutes } from './auth/auth.routes';
import { createAuthenticate } from './auth/authenticate';
import type { Config } from './config';
import { serveConsole } from './console/console-static';
import type { EngineRunner } from './engine/engine-runner';
import { engineRoutes } from './engine/engine.routes';
import { datasetsRoutes } from './datasets/datasets.routes';
import { healthRoutes } from './health/health.routes';
import { openApiRoutes } from './openapi/openapi.routes';
import type { MailService } from './mail/mail-service';
import { peopleRoutes } from './people/people.routes';
import { reportsRoutes } from './reports/reports.routes';
import { sharesRoutes } from './shares/shares.routes';
import { apiTokensRoutes } from './tokens/api-tokens.routes';
import { apiNotFound, errorHandler } from './http/error-handler';
import { reviewsRoutes } from './reviews/reviews.routes';
import { notificationsRoutes } from './notifications/notifications.routes';
import { studiesRoutes } from './studies/studies.routes';
import { API_PREFIX, mountRoutes, type RouteDefinition } from './http/route-table';
import { WriteHealth } from './storage/write-health';
import { sourceConnectionsRoutes } from './watches/source-connections.routes';
import { watchesRoutes } from './watches/watches.routes';
import { startWatchRuntime, type WatchRuntime, type WatchRuntimeOptions } from './watches/watch-runtime';

export interface AppContext {
  config: Config;
  db: Knex;
  /** Where engine runs happen: the worker pool on a server; in-process only when a test asks for it. */
  engine: EngineRunner;
  /** Mail delivery: the configured SMTP server or the local stand-in, started before the app. */
  mail: MailService;
  logger?: Logger;
  /** How alert deliveries are retried and schedules re-read (tests shorten the waits). */
  watchOptions?: Pick<WatchRuntimeOptions, 'delivery' | 'scheduleSyncMs'>;
}

export interface TallyfitApp {
  app: Express;
  /** Scheduled pulls and alert deliveries, started with the app; stop it before closing the database. */
  watches: WatchRuntime;
  /** Every API route with its access rule, for the OpenAPI document and the role matrix test. */
  routes: readonly RouteDefinition[];
}

/** Every resource's routes. A new resource is added here and nowhere else. */
function allRoutes(
  { config, db, engine, mail }: AppContext,
  watches: WatchRuntime,
  writeHealth: WriteHealth,
  logger: Logger,
): RouteDefinition[] {
  const routes: RouteDefinition[] = [
    ...healthRoutes(db, writeHealth),
    ...authRoutes(db, config),
    ...peopleRoutes(db),
    ...apiTokensRoutes(db),
    ...analysesRoutes(db, config, engine),
    ...reviewsRoutes(db, { mail, publicUrl: config.publicUrl, logger }),
    ...notificationsRoutes(db),
    ...engineRoutes(engine),
    ...studiesRoutes(db),
    ...auditRoutes(db),
    ...datasetsRoutes(db, config),
    ...reportsRoutes(db, config),
    ...sharesRoutes(db, config, mail),
    ...watchesRoutes(watches.context, config.dataDir),
    ...sourceConnectionsRoutes(db, config.secretKey),
  ];
  routes.push(...openApiRoutes(() => routes));
  return routes;
}

/**
 * Builds the Express app on an open, migrated database. Middleware order is fixed: security
 * headers, request log, CORS, body limits, resource routes (each with its auth and role check),
 * not-found, console, error handler.
 */
export function createApp(context: AppContext): TallyfitApp {
  const { config, db } = context;
  const logger = context.logger ?? pino({ level: config.logLevel });
  const app = express();
  app.disable('x-powered-by');
  // Forwarded headers are believed only from the proxies TRUST_PROXY names (none by default).
  app.set('trust proxy', config.trustProxy);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Angular Material sets inline styles; scripts stay same-origin only.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  app.use(
    pinoHttp({
      logger,
      redact: ['req.headers.authorization', 'req.headers.cookie'],
      autoLogging: { ignore: (req) => req.url === `${API_PREFIX}/health` },
    }),
  );
  app.use(cors({ origin: config.consoleOrigin ?? false }));
  app.use(express.json({ limit: '1mb' }));
  // API answers carry tokens and personal data: no browser or proxy may keep a copy.
  app.use(API_PREFIX, (_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  const writeHealth = new WriteHealth(config.dataDir);
  app.use(writeHealth.noteSuccesses);

  const watches = startWatchRuntime({ db, engine: context.engine, mail: context.mail, config, logger, ...context.watchOptions });
  const routes = allRoutes(context, watches, writeHealth, logger);
  mountRoutes(app, routes, createAuthenticate(db, config.jwtSecret));
  app.use('/api', apiNotFound);
  if (config.consoleDir) serveConsole(app, config.consoleDir);
  app.use(writeHealth.noteFailures);
  app.use(errorHandler);
  return { app, routes, watches };
}
