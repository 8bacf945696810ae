import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';

/**
 * API tokens look like `thp_0123456789abcdef_<43 base64url characters>`: a fixed marker that
 * secret scanners can match, a public id part (the prefix shown in lists, and the lookup key),
 * and a 32-byte random secret. Only the prefix and a keyed hash of the whole token are stored.
 */
export const TOKEN_PATTERN = /^(thp_[0-9a-f]{16})_([A-Za-z0-9_-]{43})$/;

export interface NewToken {
  /** The whole token, shown to its owner once. */
  token: string;
  /** `thp_` + the id part: stored, listed, and enough to recognise a leaked token. */
  prefix: string;
}

export function generateToken(): NewToken {
  const prefix = `thp_${randomBytes(8).toString('hex')}`;
  return { prefix, token: `${prefix}_${randomBytes(32).toString('base64url')}` };
}

/** The prefix of a well-formed token, or null: a malformed token never reaches the database. */
export function tokenPrefix(token: string): string | null {
  return TOKEN_PATTERN.exec(token)?.[1] ?? null;
}

/**
 * HMAC-SHA-256 under the server's key, hex. A fast keyed hash suffices: the secret has 256 bits
 * of entropy, so there is nothing to stretch, and without the key a leaked table reveals nothing.
 */
export function hashToken(token: string, key: string): string {
  return createHmac('sha256', key).update(token).digest('hex');
}

/** Constant-time comparison of a presented token's hash with the stored one. */
export function hashMatches(token: string, storedHash: string, key: string): boolean {
  const a = Buffer.from(hashToken(token, key), 'hex');
  const b = Buffer.from(storedHash, 'hex');
  return a.length === b.length && timingSafeEqual(a, b);
}
