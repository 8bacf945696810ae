import http from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { DEMO_ACCOUNTS, findDemoAccount } from './demo-accounts';

/**
 * A stand-in for GitHub's OAuth web flow on loopback, for development, demos and tests. It speaks
 * the authorize → access_token → /user exchange that passport-github2 performs, built on
 * oauth2-mock-server, and adds an account chooser page plus GitHub's `login` authorize parameter.
 * It listens on 127.0.0.1 only, answers no cross-origin requests, and sends codes only to the
 * app's own callback URL. A development dependency: the production bundle leaves it out.
 */
export interface FakeGithub {
  url: string;
  stop(): Promise<void>;
}

export interface FakeGithubOptions {
  port?: number;
  /**
   * The exact callback URLs that may receive a code. Without them (the test runner's shared
   * instance, whose apps listen on random ports) any loopback origin with the app's callback
   * path is accepted, and nothing else.
   */
  callbackUrls?: readonly string[];
}

const AUTHORIZE = '/login/oauth/authorize';
export const CALLBACK_PATH = '/auth/github/callback';
const LOOPBACK = new Set(['127.0.0.1', 'localhost', '[::1]']);

function callbackAllowed(value: unknown, callbackUrls?: readonly string[]): boolean {
  if (typeof value !== 'string') return false;
  if (callbackUrls) return callbackUrls.includes(value);
  try {
    const url = new URL(value);
    return (
      url.protocol === 'http:' &&
      LOOPBACK.has(url.hostname) &&
      url.pathname === CALLBACK_PATH &&
      !url.search &&
      !url.hash &&
      !url.username &&
      !url.password
    );
  } catch {
    return false;
  }
}

export async function startFakeGithub({
  port = 0,
  callbackUrls,
}: FakeGithubOptions = {}): Promise<FakeGithub> {
  const host = '127.0.0.1';
  // ESM-only package: loaded lazily so CommonJS code that never starts the fake need not load it.
  const { OAuth2Issuer, OAuth2Service } = await import('oauth2-mock-server');
  const issuer = new OAuth2Issuer();
  await issuer.keys.generate('RS256');
  const service = new OAuth2Service(issuer, {
    authorize: AUTHORIZE,
    token: '/login/oauth/access_token',
    userinfo: '/user',
  });

  // The code issued at authorize time remembers which account was chosen.
  const loginByCode = new Map<string, string>();
  service.on('beforeAuthorizeRedirect', ({ url }: { url: URL }, req: http.IncomingMessage) => {
    const login = new URL(req.url ?? '/', 'http://fake').searchParams.get('login');
    const code = url.searchParams.get('code');
    if (login && code) loginByCode.set(code, login);
  });
  service.on(
    'beforeTokenSigning',
    (token: { payload: Record<string, unknown> }, req: { body?: { code?: string } }) => {
      const login = req.body?.code ? loginByCode.get(req.body.code) : undefined;
      if (login) token.payload.sub = login;
    },
  );
  service.on(
    'beforeUserinfo',
    (res: { body: unknown; statusCode: number }, req: http.IncomingMessage) => {
      const account = findDemoAccount(subjectOf(req.headers.authorization) ?? '');
      if (!account) {
        res.statusCode = 401;
        res.body = { message: 'Bad credentials' };
        return;
      }
      res.body = {
        id: account.githubId,
        login: account.login,
        name: account.name,
        email: account.email,
        avatar_url: null,
        type: 'User',
      };
    },
  );

  const app = express();
  app.disable('x-powered-by');
  // oauth2-mock-server answers every origin (CORS *): a browser page elsewhere must not be
  // able to read its answers, so cross-origin headers are stripped and preflights refused.
  app.use((req, res, next) => {
    if (req.method === 'OPTIONS') {
      res.status(405).end();
      return;
    }
    const setHeader = res.setHeader.bind(res);
    res.setHeader = (name, value) =>
      /^access-control-/i.test(name) ? res : setHeader(name, value);
    next();
  });
  app.use(AUTHORIZE, (req, res, next) => {
    if (callbackAllowed(req.query.redirect_uri, callbackUrls)) return next();
    res.status(400).type('text').send('redirect_uri is not the application callback URL');
  });
  app.get(AUTHORIZE, (req, res, next) => {
    const login = typeof req.query.login === 'string' ? req.query.login : '';
    if (login && findDemoAccount(login)) return next();
    res.type('html').send(chooserPage(req.originalUrl, login));
  });
  app.use(service.requestHandler);

  const server = http.createServer(app);
  await new Promise<void>((resolve) => server.listen(port, host, resolve));
  const { port: bound } = server.address() as AddressInfo;
  const url = `http://${host}:${bound}`;
  issuer.url = url;
  return {
    url,
    stop: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}

/** The `sub` claim of the bearer JWT (the fake's tokens are its own; no signature check needed). */
function subjectOf(authorization: string | undefined): string | undefined {
  const token = authorization?.replace(/^(Bearer|token)\s+/i, '');
  const payload = token?.split('.')[1];
  if (!payload) return undefined;
  try {
    const claims = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as {
      sub?: unknown;
    };
    return typeof claims.sub === 'string' ? claims.sub : undefined;
  } catch {
    return undefined;
  }
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function chooserPage(originalUrl: string, unknownLogin: string): string {
  const links = DEMO_ACCOUNTS.map((a) => {
    const target = new URL(originalUrl, 'http://fake');
    target.searchParams.set('login', a.login);
    const href = escapeHtml(target.pathname + target.search);
    return `<li><a href="${href}"><strong>${escapeHtml(a.login)}</strong> — ${escapeHtml(a.name)} (${a.role})</a></li>`;
  }).join('\n');
  const warning = unknownLogin
    ? `<p role="alert">No demo account is called “${escapeHtml(unknownLogin)}”.</p>`
    : '';
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Choose a demo account</title>
<style>body{font:16px system-ui,sans-serif;max-width:36rem;margin:3rem auto;padding:0 1rem}
li{margin:.6rem 0}a{color:#8a3b12}</style></head>
<body><h1>Local sign-in provider</h1>
<p>This stand-in for GitHub runs on your machine for development and tests. Choose a demo account:</p>
${warning}<ul>${links}</ul></body></html>`;
}
