import { rateLimit } from 'express-rate-limit';
import { AppError } from '../lib/app-error';

/** Per-client limit per minute; refusals are the usual JSON error (429 `rate_limited`). */
export function perMinuteLimit(limit: number, message: string) {
  return rateLimit({
    windowMs: 60_000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: () => {
      throw new AppError(429, 'rate_limited', message);
    },
  });
}
