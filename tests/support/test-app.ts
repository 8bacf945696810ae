import type { Express } from 'express';
import request from 'supertest';
import { createApp, type AppDeps } from '../../server/src/app';
import { loadConfig, type AppConfig } from '../../server/src/config/env';
import { createLogger } from '../../server/src/lib/logger';
import { createTestDatabase, type TestDatabase } from './test-db';

export interface TestApp {
  app: Express;
  db: TestDatabase;
  config: AppConfig;
  close(): Promise<void>;
}

/** The real application on a database of its own, signed in through the fake GitHub. */
export async function createTestApp(
  overrides: Record<string, string> = {},
  deps: Pick<AppDeps, 'adapters' | 'verifyToken'> = {},
): Promise<TestApp> {
  const db = await createTestDatabase();
  const config = loadConfig({
    ...process.env,
    NODE_ENV: 'test',
    DATABASE_URL: db.url,
    AUTH_RATE_LIMIT: '1000',
    API_RATE_LIMIT: '10000',
    ...overrides,
  });
  const app = createApp({ config, database: db, logger: createLogger('silent'), ...deps });
  return { app, db, config, close: () => db.drop() };
}

export type Agent = ReturnType<typeof request.agent>;

/**
 * Signs a demo account in the way a browser would: our /auth/github redirects to the fake
 * provider, the provider redirects back with a code, our callback exchanges it and sets the
 * session. Returns the callback's response (its cookies) and the CSRF token issued at sign-in.
 */
export async function signInFlow(
  agent: Agent,
  login: string,
  returnTo?: string,
): Promise<{ setCookie: string[]; xsrf: string; location: string }> {
  const query = new URLSearchParams({ login });
  if (returnTo !== undefined) query.set('returnTo', returnTo);
  const start = await agent.get(`/auth/github?${query}`).expect(302);
  const authorize = await fetch(start.headers.location, { redirect: 'manual' });
  if (authorize.status !== 302) throw new Error(`fake provider answered ${authorize.status}`);
  const callback = new URL(authorize.headers.get('location') ?? '');
  const done = await agent.get(callback.pathname + callback.search);
  if (done.status !== 302 || !done.headers.location?.startsWith('/')) {
    throw new Error(`sign-in of ${login} failed: ${done.status} ${JSON.stringify(done.body)}`);
  }
  const setCookie = ([] as string[]).concat(done.headers['set-cookie'] ?? []);
  const xsrf = cookieValue(setCookie, 'XSRF-TOKEN');
  if (!xsrf) throw new Error('no XSRF-TOKEN cookie issued at sign-in');
  return { setCookie, xsrf, location: done.headers.location };
}

/** Signs in and returns the CSRF token to send as X-XSRF-TOKEN. */
export async function signIn(agent: Agent, login: string): Promise<string> {
  return (await signInFlow(agent, login)).xsrf;
}

export function cookieValue(
  setCookie: string | string[] | undefined,
  name: string,
): string | undefined {
  const list = Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : [];
  for (const c of list) {
    const [pair] = c.split(';');
    const [k, ...v] = pair.split('=');
    if (k.trim() === name) return v.join('=');
  }
  return undefined;
}
