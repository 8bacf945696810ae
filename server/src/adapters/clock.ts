/**
 * The time source for anything that reasons about "now" (session lifetimes, audit stamps,
 * later: token expiry, release dates), injected so tests can move it instead of waiting.
 */
export interface Clock {
  now(): Date;
}

export const systemClock: Clock = { now: () => new Date() };

/** A clock that stands still until told to move; for tests. */
export function manualClock(start = new Date('2026-01-01T00:00:00Z')) {
  let t = start.getTime();
  return {
    now: () => new Date(t),
    advance(ms: number) {
      t += ms;
    },
  };
}
