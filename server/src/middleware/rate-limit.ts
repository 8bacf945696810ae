import type { Request } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { AppError } from '../lib/app-error';

/**
 * Per-minute limit. A signed-in caller (cookie or token) has a bucket of their own with
 * `signedInLimit`; anonymous callers share one per address (an IPv6 /56 counts as one address).
 * A refusal is the usual JSON error (429 `rate_limited`) with `Retry-After` and the standard
 * `RateLimit` / `RateLimit-Policy` headers.
 */
export function perMinuteLimit(
  anonymousLimit: number,
  message: string,
  signedInLimit: number = anonymousLimit,
) {
  return rateLimit({
    windowMs: 60_000,
    limit: (req: Request) => (req.user ? signedInLimit : anonymousLimit),
    keyGenerator: (req: Request) =>
      req.user ? `user:${req.user.id}` : `ip:${ipKeyGenerator(req.ip ?? '')}`,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: () => {
      throw new AppError(429, 'rate_limited', message);
    },
  });
}
