import { createHash } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { AppError } from '../lib/app-error';

/**
 * Looks a presented API token up: the user it stands for, or null when it is unknown, expired
 * or revoked (the tokens module supplies the real one).
 */
export type TokenVerifier = (token: string) => Promise<Express.User | null>;

const BEARER = /^Bearer[ \t]+([\x21-\x7e]{1,512})[ \t]*$/i;

/**
 * A request that presents `Authorization: Bearer …` is authenticated by that token alone: a
 * token that does not verify is 401, and one that does makes the request a token request, for
 * which the session cookie is ignored (so the CSRF exemption cannot be borrowed by a cookie).
 */
export function bearerAuth(verify: TokenVerifier): RequestHandler {
  return async (req, res, next) => {
    const header = req.headers.authorization;
    if (!header || !/^Bearer\b/i.test(header)) return next();
    const token = BEARER.exec(header)?.[1];
    const user = token ? await verify(token) : null;
    if (!user) {
      res.setHeader('WWW-Authenticate', 'Bearer error="invalid_token"');
      throw new AppError(401, 'invalid_token', 'The API token is unknown, expired or revoked');
    }
    req.user = user;
    res.locals.authenticatedBy = 'bearer';
    // Names the token (for its own rate-limit bucket) without keeping the secret around.
    res.locals.bearerKey = createHash('sha256').update(token!).digest('base64url').slice(0, 22);
    next();
  };
}

/** True when a verified bearer token, not a cookie, authenticated this request. */
export const viaBearerToken = (res: Response): boolean => res.locals.authenticatedBy === 'bearer';

/** A stable, non-secret key of the token that authenticated this request, if one did. */
export const bearerKey = (res: Response): string | undefined =>
  viaBearerToken(res) ? (res.locals.bearerKey as string) : undefined;

/** Runs `handler` only for requests that a bearer token did not authenticate. */
export function unlessBearer(handler: RequestHandler): RequestHandler {
  return (req: Request, res, next) => (viaBearerToken(res) ? next() : handler(req, res, next));
}
