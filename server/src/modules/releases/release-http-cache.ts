import { createHash } from 'node:crypto';
import type { Request, Response } from 'express';

/** A named published release never changes: its answers may be cached for a year. */
export const IMMUTABLE_CACHE = 'public, max-age=31536000, immutable';
/** `latest` moves when a release is published: caches check back after a minute. */
export const LATEST_CACHE = 'public, max-age=60';

/**
 * Sends an answer computed from one published release with a strong ETag over its bytes and a
 * Cache-Control that fits how the release was named; `If-None-Match` then answers 304.
 */
export function sendReleaseAnswer(
  req: Request,
  res: Response,
  body: unknown,
  requestedVersion: string,
): void {
  // Encoded once: hashing the string and sending it would each encode 14 MB of a large diff.
  const json = Buffer.from(JSON.stringify(body, req.app.get('json replacer') as never), 'utf8');
  const tag = createHash('sha256').update(json).digest('base64url').slice(0, 27);
  res.setHeader('ETag', `"${tag}"`);
  res.setHeader('Cache-Control', requestedVersion === 'latest' ? LATEST_CACHE : IMMUTABLE_CACHE);
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.send(json);
}
