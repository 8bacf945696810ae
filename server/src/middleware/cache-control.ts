import type { RequestHandler } from 'express';

/**
 * API answers may hold personal or session-bound data: no cache may keep them. A route whose
 * answer is safe to cache (immutable release data) sets its own Cache-Control, which wins.
 */
export const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};
