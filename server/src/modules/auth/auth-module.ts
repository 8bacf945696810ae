import type { RequestHandler } from 'express';
import type { Pool } from 'pg';
import type { Clock } from '../../adapters';
import { bearerAuth, unlessBearer, type TokenVerifier } from '../../middleware/bearer-auth';
import { csrfProtection } from '../../middleware/csrf';
import { sessionMiddleware } from '../../middleware/session';
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
export function createAuthModule(deps: AuthModuleDeps) {
  const passport = createPassport(deps.users, deps.github);
  const identify: RequestHandler[] = [
    bearerAuth(deps.verifyToken),
    // A request that a token authenticated does not read, write or renew the session cookie.
    ...sessionMiddleware({ pool: deps.pool, secret: deps.sessionSecret, clock: deps.clock }).map(
      unlessBearer,
    ),
    passport.initialize(),
    unlessBearer(passport.session()),
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
