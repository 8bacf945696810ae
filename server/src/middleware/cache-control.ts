import type { RequestHandler } from 'express';

/**
 * API answers may hold personal or session-bound data: no cache may keep them. A route whose
 * answer is safe to cache (immutable release data) sets its own Cache-Control, which wins.
 */
export const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};

/** Whether a Cache-Control value lets some cache store the answer. */
export function isCacheable(cacheControl: unknown): boolean {
  if (typeof cacheControl !== 'string') return false;
  const v = cacheControl.toLowerCase();
  if (/\b(no-store|no-cache|private)\b/.test(v)) return false;
  return /\bpublic\b|\bimmutable\b|\bs-maxage=\d*[1-9]|\bmax-age=\d*[1-9]/.test(v);
}

/**
 * A cacheable answer never carries Set-Cookie: a shared cache could store one user's cookie and
 * hand it to the next. Mounted before the session middleware, so that its check runs after
 * the session (and the CSRF cookie) have been added; the cookie then rides on the next
 * uncacheable answer instead.
 */
export const noCookieOnCacheable: RequestHandler = (_req, res, next) => {
  const writeHead = res.writeHead;
  res.writeHead = function (this: typeof res, ...args: Parameters<typeof writeHead>) {
    if (res.hasHeader('Set-Cookie') && isCacheable(res.getHeader('Cache-Control'))) {
      res.removeHeader('Set-Cookie');
    }
    return writeHead.apply(this, args);
  } as typeof writeHead;
  next();
};
