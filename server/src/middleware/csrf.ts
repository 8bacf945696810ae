import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { AppError } from '../lib/app-error';
import { viaBearerToken } from './bearer-auth';

export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

const newToken = () => randomBytes(24).toString('base64url');

/** Issues a fresh token bound to the session (called at sign-in) and sends it as a readable cookie. */
export function issueCsrfToken(req: Request, res: Response): void {
  req.session.csrfToken = newToken();
  setCsrfCookie(req, res);
}

function setCsrfCookie(req: Request, res: Response): void {
  // Readable by script on purpose: Angular's HttpClient copies it into the X-XSRF-TOKEN header.
  res.cookie(CSRF_COOKIE, req.session.csrfToken, {
    sameSite: 'lax',
    secure: req.secure,
    path: '/',
  });
}

// The token is base64url, so the raw cookie header can be compared without decoding.
const hasCookie = (req: Request, token: string) =>
  (req.headers.cookie ?? '').split(/;\s*/).includes(`${CSRF_COOKIE}=${token}`);

const matches = (a: string, b: string) => {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
};

/**
 * Cookie-authenticated mutations must echo the session's token in X-XSRF-TOKEN. Anonymous
 * requests carry no ambient credentials, and a request that a verified bearer token
 * authenticated ignores the cookie: both are exempt. A bearer header alone exempts nothing.
 */
export const csrfProtection: RequestHandler = (req, res, next) => {
  if (!req.user || viaBearerToken(res)) return next();
  if (!req.session.csrfToken) req.session.csrfToken = newToken();
  if (!hasCookie(req, req.session.csrfToken)) setCsrfCookie(req, res);
  if (SAFE_METHODS.has(req.method)) return next();
  const header = req.get(CSRF_HEADER);
  if (!header || !matches(header, req.session.csrfToken)) {
    throw new AppError(
      403,
      'csrf',
      'Missing or wrong X-XSRF-TOKEN header; reload the page and try again',
    );
  }
  next();
};
