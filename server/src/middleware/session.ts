import connectPgSimple from 'connect-pg-simple';
import type { RequestHandler } from 'express';
import session from 'express-session';
import type { Pool } from 'pg';
import type { Clock } from '../adapters';

export const SESSION_COOKIE = 'thalpos.sid';
const MINUTE = 60_000;

declare module 'express-session' {
  interface SessionData {
    /** Epoch ms of the sign-in; the absolute lifetime counts from here. */
    signedInAt?: number;
    /** Epoch ms of the last write that extended the idle lifetime. */
    seenAt?: number;
  }
}

export interface SessionOptions {
  pool: Pool;
  secret: string;
  clock: Clock;
  /** Signed out after this long without a request. */
  idleMs?: number;
  /** Signed out this long after sign-in, however active. */
  absoluteMs?: number;
  /** The idle lifetime is extended (one row write) at most this often. */
  touchEveryMs?: number;
}

/** A session before sign-in holds only the OAuth state: it need not outlive the round trip. */
export const PENDING_SIGN_IN_MS = 10 * MINUTE;

/**
 * Cookie sessions in PostgreSQL. A row is written only once something is in the session (the
 * OAuth state, then the user), never for a mere visit; an active session is written at most
 * once a minute to push its idle expiry; and it ends at the absolute lifetime regardless.
 */
export function sessionMiddleware({
  pool,
  secret,
  clock,
  idleMs = 8 * 60 * MINUTE,
  absoluteMs = 7 * 24 * 60 * MINUTE,
  touchEveryMs = MINUTE,
}: SessionOptions): RequestHandler[] {
  const Store = connectPgSimple(session);
  const cookieSession = session({
    name: SESSION_COOKIE,
    secret,
    // The store's own touch would write on every request; the lifetime step below does it instead.
    store: new Store({
      pool,
      tableName: 'session',
      disableTouch: true,
      // A prune that starts while the app shuts down finds the pool ended: not worth a report.
      errorLog: (...args: unknown[]) => {
        if (!String(args[args.length - 1]).includes('Cannot use a pool after calling end')) {
          console.error(...args); // eslint-disable-line no-console -- the store reports through it
        }
      },
    }),
    resave: false,
    saveUninitialized: false,
    rolling: false,
    cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: idleMs },
  });

  const lifetime: RequestHandler = (req, _res, next) => {
    const s = req.session;
    if (!s?.signedInAt) return next();
    const now = clock.now().getTime();
    if (now - s.signedInAt > absoluteMs) {
      // A fresh, empty session: the old row is deleted and nothing is saved for the new one.
      return s.regenerate((err) => next(err));
    }
    if (now - (s.seenAt ?? 0) >= touchEveryMs) {
      s.seenAt = now;
      s.cookie.maxAge = idleMs;
    }
    next();
  };

  return [cookieSession, lifetime];
}

/** Marks a session as signed in now (called right after the login regenerated it). */
export function startSignedInSession(
  sessionData: session.Session & Partial<session.SessionData>,
  clock: Clock,
): void {
  const now = clock.now().getTime();
  sessionData.signedInAt = now;
  sessionData.seenAt = now;
}
