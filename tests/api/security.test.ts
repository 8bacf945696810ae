import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import request from 'supertest';
import { systemClock } from '../../server/src/adapters/clock';
import { noCookieOnCacheable } from '../../server/src/middleware/cache-control';
import { sessionMiddleware } from '../../server/src/middleware/session';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

// Regression tests for the findings of a security review: each one failed before its fix.
describe('security hardening', () => {
  let t: TestApp;
  let dist: string;
  beforeAll(async () => {
    // A client build of our own, so the test does not depend on `ng build` having run.
    dist = fs.mkdtempSync(path.join(os.tmpdir(), 'thalpos-dist-'));
    fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><thalpos-root></thalpos-root>');
    fs.writeFileSync(path.join(dist, 'main-TESTHASH.js'), 'console.log("thalpos");');
    t = await createTestApp({ CLIENT_DIST: dist });
  });
  afterAll(async () => {
    await t.close();
    fs.rmSync(dist, { recursive: true, force: true });
  });

  const idOf = async (login: string): Promise<number> =>
    (await t.db.pool.query('select id from users where login = $1', [login])).rows[0].id;
  const roleOf = async (id: number): Promise<string> =>
    (await t.db.pool.query('select role from users where id = $1', [id])).rows[0].role;

  async function as(login: string): Promise<{ agent: Agent; xsrf: string }> {
    const agent = request.agent(t.app);
    return { agent, xsrf: await signIn(agent, login) };
  }

  const setCookies = (res: request.Response) =>
    ([] as string[]).concat(res.headers['set-cookie'] ?? []);

  describe('a bearer header does not switch CSRF protection off (finding 1)', () => {
    it('refuses an unknown token with 401 and changes nothing, even with an admin cookie', async () => {
      const { agent } = await as('demo-admin');
      const target = await idOf('demo-reader');
      const res = await agent
        .patch(`/api/v1/users/${target}`)
        .set('Authorization', 'Bearer x')
        .send({ role: 'editor' })
        .expect(401);
      expect(res.body.error.code).toBe('invalid_token');
      expect(res.headers['www-authenticate']).toMatch(/^Bearer/);
      expect(await roleOf(target)).toBe('reader');
    });

    it('does not sign out a cookie session through POST /auth/logout with a bearer header', async () => {
      const { agent } = await as('demo-editor');
      await agent.post('/auth/logout').set('Authorization', 'Bearer x').expect(401);
      await agent.get('/api/v1/me').expect(200);
    });

    it('answers 401 to a malformed or empty bearer header too', async () => {
      for (const header of ['Bearer', 'Bearer ', 'bearer x y', `Bearer ${'a'.repeat(600)}`]) {
        const res = await request(t.app).get('/api/v1/me').set('Authorization', header);
        expect(res.status).toBe(401);
      }
    });

    it('ignores the session cookie for a request that a token authenticated', async () => {
      // A token feature stand-in: one token that stands for the reader.
      const reader = (await t.db.pool.query(`select * from users where login = 'demo-reader'`))
        .rows[0];
      const tokenApp = await createTestApp({ CLIENT_DIST: dist });
      try {
        const { createApp } = await import('../../server/src/app');
        const { createLogger } = await import('../../server/src/lib/logger');
        const { usersRepository } = await import('../../server/src/modules/users/users-repository');
        const app = createApp({
          config: tokenApp.config,
          database: tokenApp.db,
          logger: createLogger('silent'),
          verifyToken: async (token) =>
            token === 'reader-token'
              ? ((await usersRepository.findById(tokenApp.db.db, reader.id)) ?? null)
              : null,
        });
        const admin = request.agent(app);
        await signIn(admin, 'demo-admin');
        // The admin's cookie rides along, but the token says "reader": the reader's rights apply.
        const me = await admin
          .get('/api/v1/me')
          .set('Authorization', 'Bearer reader-token')
          .expect(200);
        expect(me.body.login).toBe('demo-reader');
        await admin
          .patch(`/api/v1/users/${reader.id}`)
          .set('Authorization', 'Bearer reader-token')
          .send({ role: 'admin' })
          .expect(403);
        // No session was read or renewed for the token request.
        const res = await admin.get('/api/v1/me').set('Authorization', 'Bearer reader-token');
        expect(setCookies(res).join()).not.toMatch(/thalpos\.sid|XSRF-TOKEN/);
      } finally {
        await tokenApp.close();
      }
    });
  });

  describe('no session cookie on cacheable answers (finding 2)', () => {
    it('serves static files to a signed-in user without Set-Cookie', async () => {
      const { agent } = await as('demo-reader');
      const js = await agent.get('/main-TESTHASH.js').expect(200);
      expect(js.headers['cache-control']).toMatch(/max-age=/);
      expect(js.headers['set-cookie']).toBeUndefined();
      const page = await agent.get('/species/water').expect(200);
      expect(page.headers['set-cookie']).toBeUndefined();
    });

    it('never sends Set-Cookie together with a cacheable Cache-Control', async () => {
      const { agent } = await as('demo-admin');
      for (const url of ['/', '/main-TESTHASH.js', '/api/v1/me', '/api/v1/users', '/api/health']) {
        const res = await agent.get(url);
        if (res.headers['set-cookie']) {
          expect(res.headers['cache-control']).toMatch(/no-store|private/);
        }
      }
    });

    it('strips the session cookie from a route that marks its answer cacheable', async () => {
      // The guard in front of the real session middleware, as createApp mounts them.
      const app = express();
      app.use(noCookieOnCacheable);
      app.use(sessionMiddleware({ pool: t.db.pool, secret: 'x'.repeat(20), clock: systemClock }));
      app.get('/cacheable', (req, res) => {
        req.session.returnTo = '/somewhere';
        res.setHeader('Cache-Control', 'public, max-age=60');
        res.json({ ok: true });
      });
      app.get('/uncached', (req, res) => {
        req.session.returnTo = '/somewhere';
        res.json({ ok: true });
      });
      expect(
        (await request(app).get('/cacheable').expect(200)).headers['set-cookie'],
      ).toBeUndefined();
      expect((await request(app).get('/uncached').expect(200)).headers['set-cookie']).toBeDefined();
    });

    it('marks API answers no-store, errors included', async () => {
      const { agent } = await as('demo-reader');
      expect((await agent.get('/api/v1/me')).headers['cache-control']).toBe('no-store');
      expect((await agent.get('/api/v1/users')).headers['cache-control']).toBe('no-store');
      expect((await request(t.app).get('/api/v1/nothing')).headers['cache-control']).toBe(
        'no-store',
      );
      expect(
        (await request(t.app).post('/api/v1/equations/parse').send({ equation: 'H2 -> H' }))
          .headers['cache-control'],
      ).toBe('no-store');
    });
  });

  describe('ids beyond the column range are a 400, never a 500 (finding 3)', () => {
    it.each([
      '2147483648',
      '9007199254740991',
      '99999999999999999999',
      '0',
      '-1',
      '1e3',
      '0x10',
      ' 7',
      '1.5',
    ])('PATCH /api/v1/users/%s answers 400', async (id) => {
      const { agent, xsrf } = await as('demo-admin');
      const res = await agent
        .patch(`/api/v1/users/${encodeURIComponent(id)}`)
        .set('X-XSRF-TOKEN', xsrf)
        .send({ role: 'editor' });
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('validation_error');
    });

    it('answers 404 for the largest id the column holds', async () => {
      const { agent, xsrf } = await as('demo-admin');
      await agent
        .patch('/api/v1/users/2147483647')
        .set('X-XSRF-TOKEN', xsrf)
        .send({ role: 'editor' })
        .expect(404);
    });
  });

  describe('request ids (finding 6)', () => {
    it('keeps a short id of safe characters', async () => {
      const res = await request(t.app).get('/api/health').set('X-Request-Id', 'kestrel-run-42.a');
      expect(res.headers['x-request-id']).toBe('kestrel-run-42.a');
    });

    it.each([
      ['an 8 kB value', 'a'.repeat(8192)],
      ['a value with spaces and quotes', 'abc def "ghi" <jkl>'],
      ['Latin-1 bytes', 'caf\u00e9-\u00e9t\u00e9-2026'],
      ['a too-short value', 'abc'],
    ])('replaces %s with an id of its own', async (_label, offered) => {
      const res = await request(t.app)
        .get('/api/health')
        .set('X-Request-Id', Buffer.from(offered, 'latin1').toString('latin1'));
      expect(res.headers['x-request-id']).not.toBe(offered);
      expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    });
  });
});
