import request from 'supertest';
import { cookieValue, createTestApp, signIn, signInFlow, type TestApp } from '../support/test-app';

describe('sign-in through the fake GitHub', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('is anonymous before sign-in: /api/v1/me answers 401', async () => {
    const res = await request(t.app).get('/api/v1/me').expect(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('redirects /auth/github to the provider with state and the login hint', async () => {
    const res = await request(t.app).get('/auth/github?login=demo-curator').expect(302);
    const url = new URL(res.headers.location);
    expect(url.origin).toBe(process.env.FAKE_GITHUB_URL);
    expect(url.pathname).toBe('/login/oauth/authorize');
    expect(url.searchParams.get('login')).toBe('demo-curator');
    expect(url.searchParams.get('state')).toBeTruthy();
    expect(url.searchParams.get('redirect_uri')).toMatch(/\/auth\/github\/callback$/);
  });

  it('refuses a malformed login hint with 400 at the edge', async () => {
    const res = await request(t.app).get('/auth/github?login=%3Cscript%3E').expect(400);
    expect(res.body.error.code).toBe('validation_error');
  });

  it('uses PKCE: the authorize request carries an S256 code challenge', async () => {
    const res = await request(t.app).get('/auth/github?login=demo-curator').expect(302);
    const url = new URL(res.headers.location);
    expect(url.searchParams.get('code_challenge_method')).toBe('S256');
    expect(url.searchParams.get('code_challenge')).toMatch(/^[A-Za-z0-9_-]{43}$/);
  });

  describe('returning to where the user was', () => {
    const target =
      '/calculate/hess?target=CH4(g)%20-%3E%20C(graphite)%20%2B%202%20H2(g)&unit=kJ%2Fmol';

    it('redirects to the path given as returnTo after the callback', async () => {
      const { location } = await signInFlow(request.agent(t.app), 'demo-reader', target);
      expect(location).toBe(target);
    });

    it.each([
      'https://evil.example/steal',
      '//evil.example/steal',
      '/\\evil.example',
      'calculate/hess',
      '/a//b',
    ])('goes home instead of to %p', async (returnTo) => {
      const { location } = await signInFlow(request.agent(t.app), 'demo-reader', returnTo);
      expect(location).toBe('/');
    });

    it('goes home when no returnTo was given', async () => {
      expect((await signInFlow(request.agent(t.app), 'demo-reader')).location).toBe('/');
    });
  });

  it('audits the seeded demo roles, once each, with no acting user', async () => {
    const rows = await t.db.pool.query(
      `select a.actor_id, a.after, u.login, u.role from audit_log a
         join users u on u.id::text = a.entity_id
        where a.action = 'user.seeded' order by u.login`,
    );
    expect(rows.rows.map((r) => r.login)).toEqual([
      'demo-admin',
      'demo-curator',
      'demo-editor',
      'demo-editor-2',
      'demo-reader',
    ]);
    for (const r of rows.rows) {
      expect(r.actor_id).toBeNull();
      expect(r.after).toEqual({ login: r.login, role: expect.any(String) });
    }
  });

  it('never forwards the login hint to real GitHub', async () => {
    const real = await createTestApp({
      GITHUB_CLIENT_ID: 'real-id',
      GITHUB_CLIENT_SECRET: 'real-secret',
    });
    try {
      const res = await request(real.app).get('/auth/github?login=demo-admin').expect(302);
      const url = new URL(res.headers.location);
      expect(url.origin).toBe('https://github.com');
      expect(url.searchParams.get('client_id')).toBe('real-id');
      expect(url.searchParams.has('login')).toBe(false);
    } finally {
      await real.close();
    }
  });

  it('shows an account chooser when no account is named', async () => {
    const res = await request(t.app).get('/auth/github').expect(302);
    const page = await fetch(res.headers.location);
    const html = await page.text();
    for (const login of [
      'demo-reader',
      'demo-curator',
      'demo-editor',
      'demo-editor-2',
      'demo-admin',
    ]) {
      expect(html).toContain(login);
    }
  });

  it.each([
    ['demo-reader', 'reader', 'Tomas Reyes'],
    ['demo-curator', 'curator', 'Priya Nandakumar'],
    ['demo-editor', 'editor', 'Helga Brandt'],
    ['demo-editor-2', 'editor', 'Kwame Mensah'],
    ['demo-admin', 'admin', 'Lena Sørensen'],
  ])('signs %s in with the %s role', async (login, role, name) => {
    const agent = request.agent(t.app);
    await signIn(agent, login);
    const me = await agent.get('/api/v1/me').expect(200);
    expect(me.body).toMatchObject({ login, role, name, id: expect.any(Number) });
  });

  it('issues an httpOnly, SameSite=Lax session cookie and a readable XSRF-TOKEN cookie', async () => {
    const { setCookie: cookies } = await signInFlow(request.agent(t.app), 'demo-reader');
    const sessionCookie = cookies.find((c) => c.startsWith('thalpos.sid='));
    const xsrfCookie = cookies.find((c) => c.startsWith('XSRF-TOKEN='));
    expect(sessionCookie).toMatch(/HttpOnly/i);
    expect(sessionCookie).toMatch(/SameSite=Lax/i);
    expect(xsrfCookie).toBeDefined();
    expect(xsrfCookie).not.toMatch(/HttpOnly/i);
  });

  it('re-issues the XSRF-TOKEN cookie to a signed-in client that lacks it', async () => {
    const { setCookie, xsrf: issued } = await signInFlow(request.agent(t.app), 'demo-curator');
    const sessionCookie = setCookie.find((c) => c.startsWith('thalpos.sid='))!.split(';')[0];

    const again = await request(t.app).get('/api/v1/me').set('Cookie', sessionCookie).expect(200);
    expect(cookieValue(again.headers['set-cookie'], 'XSRF-TOKEN')).toBe(issued);
    // A client that still has the cookie is not sent it again.
    const withCookie = await request(t.app)
      .get('/api/v1/me')
      .set('Cookie', `${sessionCookie}; XSRF-TOKEN=${issued}`)
      .expect(200);
    expect(cookieValue(withCookie.headers['set-cookie'], 'XSRF-TOKEN')).toBeUndefined();
  });

  it('marks the cookies Secure behind a TLS-terminating proxy', async () => {
    const behindTls = await createTestApp({ TRUST_PROXY: '1' });
    try {
      const res = await request(behindTls.app)
        .get('/auth/github')
        .set('X-Forwarded-Proto', 'https')
        .expect(302);
      const cookie = ([] as string[])
        .concat(res.headers['set-cookie'] ?? [])
        .find((c) => c.startsWith('thalpos.sid='));
      expect(cookie).toMatch(/;\s*Secure/i);
      const plain = await request(t.app).get('/auth/github').expect(302);
      const plainCookie = ([] as string[])
        .concat(plain.headers['set-cookie'] ?? [])
        .find((c) => c.startsWith('thalpos.sid='));
      expect(plainCookie).not.toMatch(/;\s*Secure/i);
    } finally {
      await behindTls.close();
    }
  });

  it('rejects a callback whose state does not match the session', async () => {
    const res = await request(t.app).get('/auth/github/callback?code=forged&state=forged');
    expect(res.status).toBe(302);
    expect(res.headers.location).toBe('/?signin=failed');
  });

  it('creates a new GitHub user as a reader and audits the creation and the sign-in', async () => {
    // The fake only knows the demo accounts; a brand-new user is simulated by removing one
    // first, on a database of its own where that account has no audit history yet.
    const fresh = await createTestApp();
    try {
      await fresh.db.pool.query(`delete from users where login = 'demo-reader'`);
      const agent = request.agent(fresh.app);
      await signIn(agent, 'demo-reader');
      const me = await agent.get('/api/v1/me').expect(200);
      expect(me.body.role).toBe('reader');
      const audit = await fresh.db.pool.query(
        `select actor_id, action, after from audit_log
          where entity_type = 'user' and entity_id = $1 order by id`,
        [String(me.body.id)],
      );
      expect(audit.rows).toEqual([
        {
          actor_id: me.body.id,
          action: 'user.created',
          after: { login: 'demo-reader', role: 'reader' },
        },
        { actor_id: me.body.id, action: 'user.signed_in', after: null },
      ]);
    } finally {
      await fresh.close();
    }
  });

  it('signs out with POST /auth/logout (CSRF token required)', async () => {
    const agent = request.agent(t.app);
    const xsrf = await signIn(agent, 'demo-editor');
    await agent.post('/auth/logout').expect(403);
    await agent.get('/api/v1/me').expect(200);
    const me = (await agent.get('/api/v1/me').expect(200)).body;
    await agent.post('/auth/logout').set('X-XSRF-TOKEN', xsrf).expect(204);
    await agent.get('/api/v1/me').expect(401);
    const audit = await t.db.pool.query(
      `select actor_id, entity_id from audit_log where action = 'user.signed_out'`,
    );
    expect(audit.rows).toEqual([{ actor_id: me.id, entity_id: String(me.id) }]);
  });

  it('rate-limits the sign-in routes with a JSON 429', async () => {
    const limited = await createTestApp({ AUTH_RATE_LIMIT: '3' });
    try {
      for (let i = 0; i < 3; i++) await request(limited.app).get('/auth/github').expect(302);
      const res = await request(limited.app).get('/auth/github').expect(429);
      expect(res.body.error.code).toBe('rate_limited');
    } finally {
      await limited.close();
    }
  });
});
