import express from 'express';
import request from 'supertest';
import { isCacheable, noCookieOnCacheable } from './cache-control';

describe('isCacheable', () => {
  it.each([
    'public, max-age=60',
    'max-age=3600',
    'public, max-age=31536000, immutable',
    's-maxage=5',
  ])('%s may be stored', (v) => expect(isCacheable(v)).toBe(true));
  it.each([
    undefined,
    'no-store',
    'no-cache',
    'private, max-age=60',
    'max-age=0',
    'public, no-store',
  ])('%s may not', (v) => expect(isCacheable(v)).toBe(false));
});

describe('noCookieOnCacheable', () => {
  // Stands in for the session middleware: it adds its cookie just before the headers go out.
  const app = express();
  app.use(noCookieOnCacheable);
  app.use((_req, res, next) => {
    const writeHead = res.writeHead;
    res.writeHead = function (this: typeof res, ...args: Parameters<typeof writeHead>) {
      res.setHeader('Set-Cookie', 'thalpos.sid=abc; Path=/; HttpOnly');
      return writeHead.apply(this, args);
    } as typeof writeHead;
    next();
  });
  app.get('/cached', (_req, res) => {
    res.setHeader('Cache-Control', 'public, max-age=60');
    res.json({ ok: true });
  });
  app.get('/private', (_req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json({ ok: true });
  });

  it('strips the cookie from a cacheable answer', async () => {
    const res = await request(app).get('/cached').expect(200);
    expect(res.headers['set-cookie']).toBeUndefined();
    expect(res.headers['cache-control']).toBe('public, max-age=60');
  });

  it('keeps it on an answer no cache may store', async () => {
    const res = await request(app).get('/private').expect(200);
    expect(res.headers['set-cookie']).toEqual(['thalpos.sid=abc; Path=/; HttpOnly']);
  });
});
