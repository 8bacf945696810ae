import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { defaultAdapters, type Adapters } from './adapters';
import { fileStoreFor } from './adapters/file-store';
import type { AppConfig } from './config/env';
import type { DbHandle } from './db/client';
import type { Logger } from './lib/logger';
import type { TokenVerifier } from './middleware/bearer-auth';
import { noCookieOnCacheable, noStore } from './middleware/cache-control';
import { errorHandler } from './middleware/error-handler';
import { notFoundHandler } from './middleware/not-found';
import { perMinuteLimit } from './middleware/rate-limit';
import { requestId } from './middleware/request-id';
import { createAuditModule } from './modules/audit/audit-router';
import { createAuthModule } from './modules/auth/auth-module';
import { REAL_GITHUB, type GithubEndpoints } from './modules/auth/auth-strategy';
import { createCalculateModule } from './modules/calculate/calculate-router';
import { createDocsModule } from './modules/docs/docs-router';
import { createHealthModule } from './modules/health/health-router';
import { createSearchModule } from './modules/search/search-router';
import { createSourcesModule } from './modules/sources/sources-router';
import { createSpeciesModule } from './modules/species/species-router';
import { createReactionsModule } from './modules/reactions/reactions-router';
import { createReleaseDraftsModule } from './modules/releases/release-drafts-router';
import { createReleasesModule } from './modules/releases/releases-router';
import { createProposalNotifier } from './modules/notifications/proposal-notifications';
import { createProposalsModule } from './modules/proposals/proposals-router';
import { createTokensModule } from './modules/tokens/tokens-router';
import { createUsersModule } from './modules/users/users-router';
import { createUploadsModule } from './modules/uploads/uploads-router';
import { createWatchlistsModule } from './modules/watchlists/watchlists-router';
import { thermoJsonReplacer } from './thermo';

export interface AppDeps {
  config: AppConfig;
  database: DbHandle;
  logger: Logger;
  /** URL of the fake GitHub when no real one is configured. */
  fakeGithubUrl?: string | null;
  /** Outside services (clock; later mailer, file store); defaults are the real ones. */
  adapters?: Partial<Adapters>;
  /** Resolves API tokens to users; defaults to the tokens module's own verifier. */
  verifyToken?: TokenVerifier;
}

/** Builds the application without listening, so tests drive it directly with supertest. */
export function createApp(deps: AppDeps): Express {
  const { config, database, logger } = deps;
  const adapters: Adapters = { ...defaultAdapters(), ...deps.adapters };
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy ? 1 : false);
  app.set('query parser', 'simple');
  // Exact engine values (fractions) serialise as text such as "1/2" wherever they appear.
  app.set('json replacer', thermoJsonReplacer);

  app.use(requestLogger(logger));
  app.use(securityHeaders(config.trustProxy));
  app.use(['/api', '/auth'], noStore);
  app.use(noCookieOnCacheable);

  // Modules: each owns its routes, body parser and size limit.
  const health = createHealthModule({ pool: database.pool });
  const users = createUsersModule({ db: database.db, adminLogins: config.adminLogins });
  const tokens = createTokensModule({
    db: database.db,
    clock: adapters.clock,
    hashKey: config.tokenHashKey,
  });
  const auth = createAuthModule({
    pool: database.pool,
    users: users.service,
    clock: adapters.clock,
    github: githubEndpoints(config, deps.fakeGithubUrl),
    sessionSecret: config.sessionSecret,
    allowLoginHint: !config.github,
    rateLimitPerMinute: config.authRateLimit,
    verifyToken: deps.verifyToken ?? tokens.verifyToken,
  });
  const audit = createAuditModule({ db: database.db });
  const calculate = createCalculateModule();
  const releases = createReleasesModule({ db: database.db, publicUrl: config.publicUrl });
  const releaseDrafts = createReleaseDraftsModule({ db: database.db, releases: releases.service });
  const species = createSpeciesModule({ db: database.db, releases: releases.service });
  const sources = createSourcesModule({
    db: database.db,
    doiBaseUrl: config.doiBaseUrl,
    files: adapters.fileStore ?? fileStoreFor(config.fileStore),
  });
  const search = createSearchModule({ db: database.db, releases: releases.service });
  const reactions = createReactionsModule({ snapshots: (v) => releases.service.getSnapshot(v) });
  const proposals = createProposalsModule({
    db: database.db,
    releases: releases.service,
    onEvent: createProposalNotifier({ publicUrl: config.publicUrl }),
  });
  const uploads = createUploadsModule({ db: database.db, releases: releases.service });
  const watchlists = createWatchlistsModule({ db: database.db, reactions: reactions.service });
  const docs = createDocsModule();

  // Before any session: health answers while the database is down, and static files and the
  // SPA page never carry (or renew) a session cookie, so shared caches may keep them.
  app.use('/api', health.router, docs.page);
  serveClient(app, config.clientDist);

  app.use(auth.identify);
  app.use('/auth', auth.router);
  app.use(
    '/api/v1',
    perMinuteLimit(
      config.apiRateLimit,
      'Too many requests; slow down and try again shortly',
      config.apiRateLimitSignedIn,
      config.apiRateLimitToken,
    ),
    users.router,
    audit.router,
    calculate.router,
    sources.router,
    releaseDrafts.router,
    releases.router,
    reactions.router,
    species.router,
    search.router,
    docs.api,
    uploads.router,
    proposals.router,
    tokens.router,
    watchlists.router,
  );
  app.use(['/api', '/auth'], notFoundHandler);
  app.use(errorHandler);
  return app;
}

function requestLogger(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId: requestId,
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
  });
}

function securityHeaders(behindTls: boolean) {
  return helmet({
    strictTransportSecurity: behindTls,
    contentSecurityPolicy: {
      directives: {
        'connect-src': ["'self'"],
        // Everything the client needs ships with it: no outside hosts at all.
        'img-src': ["'self'", 'data:'],
        'style-src': ["'self'", "'unsafe-inline'"],
        'font-src': ["'self'", 'data:'],
        // Only upgrade where the site is actually served over TLS.
        'upgrade-insecure-requests': behindTls ? [] : null,
      },
    },
  });
}

function githubEndpoints(config: AppConfig, fakeGithubUrl?: string | null): GithubEndpoints {
  if (config.github) return { ...config.github, ...REAL_GITHUB };
  const fake = fakeGithubUrl ?? config.fakeGithubUrl;
  if (!fake) throw new Error('No GitHub credentials and no fake GitHub URL: cannot offer sign-in');
  return {
    clientId: 'thalpos-local',
    clientSecret: 'thalpos-local-secret',
    webBase: fake,
    apiBase: fake,
  };
}

/** The built Angular app, with the SPA fallback for every GET outside /api and /auth. */
function serveClient(app: Express, dist: string): void {
  const index = path.join(dist, 'index.html');
  const clientPath = /^\/(?!(api|auth)(\/|$))/;
  const files = express.static(dist, { index: false, maxAge: '1h' });
  // API calls never look for a file first: no disk lookup on the hot read routes.
  app.use((req, res, next) => (clientPath.test(req.path) ? files(req, res, next) : next()));
  app.get(clientPath, (_req, res) => {
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
