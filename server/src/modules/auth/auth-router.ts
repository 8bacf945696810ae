import { Router } from 'express';
import type { AuthenticateOptions } from 'passport';
import { AppError } from '../../lib/app-error';
import { CSRF_COOKIE, issueCsrfToken } from '../../middleware/csrf';
import { perMinuteLimit } from '../../middleware/rate-limit';
import type { PassportInstance } from './auth-strategy';

export const SESSION_COOKIE = 'thalpos.sid';

export interface AuthRouterOptions {
  passport: PassportInstance;
  /** Only the fake provider may be asked to sign a named account in without a page. */
  allowLoginHint: boolean;
  rateLimitPerMinute: number;
}

export function authRouter({
  passport,
  allowLoginHint,
  rateLimitPerMinute,
}: AuthRouterOptions): Router {
  const router = Router();
  router.use(
    perMinuteLimit(rateLimitPerMinute, 'Too many sign-in attempts; wait a minute and try again'),
  );

  router.get('/github', (req, res, next) => {
    const login = typeof req.query.login === 'string' ? req.query.login : undefined;
    // GitHub's own `login` parameter only suggests an account; the fake honours it outright.
    const options = (allowLoginHint && login ? { login } : {}) as AuthenticateOptions;
    passport.authenticate('github', options)(req, res, next);
  });

  router.get('/github/callback', (req, res, next) => {
    passport.authenticate('github', (err: unknown, user: Express.User | false) => {
      if (err) {
        req.log?.warn({ err }, 'sign-in failed');
        return next(new AppError(502, 'sign_in_failed', 'Sign-in with GitHub failed; try again'));
      }
      if (!user) return res.redirect('/?signin=failed');
      req.logIn(user, (loginErr) => {
        if (loginErr) return next(loginErr);
        issueCsrfToken(req, res);
        res.redirect('/');
      });
    })(req, res, next);
  });

  router.post('/logout', (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy(() => {
        res.clearCookie(CSRF_COOKIE, { path: '/' });
        res.clearCookie(SESSION_COOKIE, { path: '/' });
        res.status(204).end();
      });
    });
  });

  return router;
}
