import type { Request, RequestHandler } from 'express';
import type { Pool } from 'pg';
import type { Clock } from '../../adapters';
import { bearerAuth, unlessBearer, type TokenVerifier } from '../../middleware/bearer-auth';
import { csrfProtection } from '../../middleware/csrf';
import { SESSION_COOKIE, sessionMiddleware } from '../../middleware/session';
import type { UsersService } from '../users/users-service';
import { authRouter } from './auth-router';
import { createPassport, type GithubEndpoints } from './auth-strategy';

export interface AuthModuleDeps {
  pool: Pool;
  users: UsersService;
  clock: Clock;
  github: GithubEndpoints;
  sessionSecret: string;
  /** True only for the local stand-in, which may sign a named demo account in directly. */
  allowLoginHint: boolean;
  rateLimitPerMinute: number;
  /** Resolves API tokens; the tokens feature supplies it. */
  verifyToken: TokenVerifier;
}

/**
 * Sign-in with GitHub (`/auth`), and `identify`: the middleware that works out who is calling —
 * a verified bearer token, else the session cookie — and enforces CSRF for cookie callers.
 */
/**
 * Session machinery runs only where a session can exist: under /auth (sign-in starts one) or
 * when the request carries the session cookie. Anonymous API calls skip the id generation and
 * store lookups; a request that a token authenticated never reads or renews the cookie.
 */
function withSession(handler: RequestHandler): RequestHandler {
  const sessionRelevant = (req: Request) =>
    req.path.startsWith('/auth') || (req.headers.cookie ?? '').includes(`${SESSION_COOKIE}=`);
  return unlessBearer((req, res, next) =>
    sessionRelevant(req) ? handler(req, res, next) : next(),
  );
}

export function createAuthModule(deps: AuthModuleDeps) {
  const passport = createPassport(deps.users, deps.github);
  const identify: RequestHandler[] = [
    bearerAuth(deps.verifyToken),
    // A request that a token authenticated does not read, write or renew the session cookie.
    ...sessionMiddleware({ pool: deps.pool, secret: deps.sessionSecret, clock: deps.clock }).map(
      withSession,
    ),
    passport.initialize(),
    withSession(passport.session()),
    csrfProtection,
  ];
  const router = authRouter({
    passport,
    users: deps.users,
    clock: deps.clock,
    allowLoginHint: deps.allowLoginHint,
    rateLimitPerMinute: deps.rateLimitPerMinute,
  });
  return { identify, router };
}
