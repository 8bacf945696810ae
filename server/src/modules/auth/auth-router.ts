import { Router } from 'express';
import { z } from 'zod';
import type { AuthenticateOptions } from 'passport';
import type { Clock } from '../../adapters';
import { AppError } from '../../lib/app-error';
import { CSRF_COOKIE, issueCsrfToken } from '../../middleware/csrf';
import { perMinuteLimit } from '../../middleware/rate-limit';
import { validate } from '../../middleware/validate';
import { PENDING_SIGN_IN_MS, SESSION_COOKIE, startSignedInSession } from '../../middleware/session';
import type { UsersService } from '../users/users-service';
import type { PassportInstance } from './auth-strategy';
import { safeReturnTo } from './return-to';

export { SESSION_COOKIE };

declare module 'express-session' {
  interface SessionData {
    /** The site path to go back to after the OAuth round trip. */
    returnTo?: string;
  }
}

/** `GET /auth/github`: an optional account hint and the page to come back to. */
export const SignInQuery = z.object({
  /** A GitHub login (1–39 letters, digits, hyphens); only the local stand-in acts on it. */
  login: z
    .string()
    .regex(/^[A-Za-z0-9-]{1,39}$/, 'is not a GitHub login')
    .optional(),
  /** Checked by safeReturnTo: anything but a path on this site goes home, without an error. */
  returnTo: z.string().optional(),
});

export interface AuthRouterOptions {
  passport: PassportInstance;
  users: UsersService;
  clock: Clock;
  /** Only the fake provider may be asked to sign a named account in without a page. */
  allowLoginHint: boolean;
  rateLimitPerMinute: number;
}

export function authRouter({
  passport,
  users,
  clock,
  allowLoginHint,
  rateLimitPerMinute,
}: AuthRouterOptions): Router {
  const router = Router();
  router.use(
    perMinuteLimit(rateLimitPerMinute, 'Too many sign-in attempts; wait a minute and try again'),
  );

  const signIn = validate({ query: SignInQuery });
  router.get('/github', signIn, (req, res, next) => {
    const { login, returnTo: asked } = signIn.input(res).query;
    // GitHub's own `login` parameter only suggests an account; the fake honours it outright.
    const options = (allowLoginHint && login ? { login } : {}) as AuthenticateOptions;
    // A visitor's session now holds only the OAuth state (and where to return): it need not
    // live long. A signed-in user's session keeps its lifetime if they abandon the round trip.
    if (!req.user) req.session.cookie.maxAge = PENDING_SIGN_IN_MS;
    const returnTo = safeReturnTo(asked);
    if (returnTo) req.session.returnTo = returnTo;
    else delete req.session.returnTo;
    passport.authenticate('github', options)(req, res, next);
  });

  router.get('/github/callback', (req, res, next) => {
    passport.authenticate('github', (err: unknown, user: Express.User | false) => {
      if (err) {
        req.log?.warn({ err }, 'sign-in failed');
        return next(new AppError(502, 'sign_in_failed', 'Sign-in with GitHub failed; try again'));
      }
      if (!user) return res.redirect('/?signin=failed');
      // Read before logIn: it regenerates the session (a fresh id against fixation).
      const returnTo = safeReturnTo(req.session.returnTo) ?? '/';
      req.logIn(user, (loginErr) => {
        if (loginErr) return next(loginErr);
        startSignedInSession(req.session, clock);
        issueCsrfToken(req, res);
        res.redirect(returnTo);
      });
    })(req, res, next);
  });

  router.post('/logout', (req, res, next) => {
    const userId = req.user?.id;
    if (!req.session) {
      // A token request has no session to end.
      res.status(204).end();
      return;
    }
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy(async () => {
        res.clearCookie(CSRF_COOKIE, { path: '/' });
        res.clearCookie(SESSION_COOKIE, { path: '/' });
        try {
          if (userId !== undefined) await users.recordSignOut(userId);
          res.status(204).end();
        } catch (auditErr) {
          next(auditErr);
        }
      });
    });
  });
  return router;
}
