import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import connectPgSimple from 'connect-pg-simple';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { AppConfig } from './config/env';
import type { DbHandle } from './db/client';
import type { Logger } from './lib/logger';
import { csrfProtection } from './middleware/csrf';
import { errorHandler } from './middleware/error-handler';
import { notFoundHandler } from './middleware/not-found';
import { perMinuteLimit } from './middleware/rate-limit';
import { authRouter, SESSION_COOKIE } from './modules/auth/auth-router';
import { createPassport, REAL_GITHUB, type GithubEndpoints } from './modules/auth/auth-strategy';
import {
  CALCULATE_PATHS,
  calculateBodyParser,
  calculateRouter,
} from './modules/calculate/calculate-router';
import { healthRouter } from './modules/health/health-router';
import { usersRouter } from './modules/users/users-router';
import { thermoJsonReplacer } from './thermo';
import { createUsersService } from './modules/users/users-service';

export interface AppDeps {
  config: AppConfig;
  database: DbHandle;
  logger: Logger;
  /** URL of the fake GitHub when no real one is configured. */
  fakeGithubUrl?: string | null;
}

const BODY_LIMIT = '100kb';

/** Builds the application without listening, so tests drive it directly with supertest. */
export function createApp({ config, database, logger, fakeGithubUrl }: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy ? 1 : false);
  app.set('query parser', 'simple');
  // Exact engine values (fractions) serialise as text such as "1/2" wherever they appear.
  app.set('json replacer', thermoJsonReplacer);

  app.use(
    pinoHttp({
      logger,
      genReqId: (req, res) => {
        const id = (req.headers['x-request-id'] as string | undefined) ?? randomUUID();
        res.setHeader('X-Request-Id', id);
        return id;
      },
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      // Method, path and status only: headers would put session cookies into the logs.
      serializers: {
        req: (req: { id: string; method: string; url: string }) => ({
          id: req.id,
          method: req.method,
          url: req.url,
        }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  );
  app.use(
    helmet({
      strictTransportSecurity: config.trustProxy,
      contentSecurityPolicy: {
        directives: {
          'connect-src': ["'self'"],
          // Everything the client needs ships with it: no outside hosts at all.
          'img-src': ["'self'", 'data:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'font-src': ["'self'", 'data:'],
          // Only upgrade where the site is actually served over TLS.
          'upgrade-insecure-requests': config.trustProxy ? [] : null,
        },
      },
    }),
  );

  app.use('/api', healthRouter(database.pool));

  // The public calculation routes take only small bodies; the parser that runs first wins.
  app.use(CALCULATE_PATHS, calculateBodyParser);
  app.use(express.json({ limit: BODY_LIMIT }));
  app.use(
    session({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      store: new (connectPgSimple(session))({ pool: database.pool, tableName: 'session' }),
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: 8 * 3600_000 },
    }),
  );

  const users = createUsersService(database.db, config.adminLogins);
  const github: GithubEndpoints = config.github
    ? { ...config.github, ...REAL_GITHUB }
    : {
        clientId: 'thalpos-local',
        clientSecret: 'thalpos-local-secret',
        webBase: requireFake(fakeGithubUrl ?? config.fakeGithubUrl),
        apiBase: requireFake(fakeGithubUrl ?? config.fakeGithubUrl),
      };
  const passport = createPassport(users, github);
  app.use(passport.initialize());
  app.use(passport.session());
  app.use(csrfProtection);

  app.use(
    '/auth',
    authRouter({
      passport,
      allowLoginHint: !config.github,
      rateLimitPerMinute: config.authRateLimit,
    }),
  );

  const apiLimiter = perMinuteLimit(
    config.apiRateLimit,
    'Too many requests; slow down and try again shortly',
  );
  app.use('/api/v1', apiLimiter, usersRouter(users), calculateRouter());
  app.use(['/api', '/auth'], notFoundHandler);

  serveClient(app, config.clientDist);
  app.use(errorHandler);
  return app;
}

function requireFake(url: string | null | undefined): string {
  if (!url) throw new Error('No GitHub credentials and no fake GitHub URL: cannot offer sign-in');
  return url;
}

/** The built Angular app, with the SPA fallback for every other GET. */
function serveClient(app: Express, dist: string): void {
  const index = path.join(dist, 'index.html');
  app.use(express.static(dist, { index: false, maxAge: '1h' }));
  app.get(/.*/, (_req, res) => {
    if (!fs.existsSync(index)) {
      res
        .status(503)
        .type('text')
        .send('The client has not been built yet: run `npm run build:client`.');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
