import type { Request, Response } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { AppError } from '../lib/app-error';
import { bearerKey } from './bearer-auth';

/**
 * Per-minute limit. Each API token has a bucket of its own with `tokenLimit`; a signed-in
 * caller (cookie session) has one per user with `signedInLimit`; anonymous callers share one
 * per address (an IPv6 /56 counts as one address).
 * A refusal is the usual JSON error (429 `rate_limited`) with `Retry-After` and the standard
 * `RateLimit` / `RateLimit-Policy` headers.
 */
export function perMinuteLimit(
  anonymousLimit: number,
  message: string,
  signedInLimit: number = anonymousLimit,
  tokenLimit: number = signedInLimit,
) {
  return rateLimit({
    windowMs: 60_000,
    limit: (req: Request, res: Response) =>
      bearerKey(res) ? tokenLimit : req.user ? signedInLimit : anonymousLimit,
    keyGenerator: (req: Request, res: Response) => {
      const token = bearerKey(res);
      if (token) return `token:${token}`;
      return req.user ? `user:${req.user.id}` : `ip:${ipKeyGenerator(req.ip ?? '')}`;
    },
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: () => {
      throw new AppError(429, 'rate_limited', message);
    },
  });
}
