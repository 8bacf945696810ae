import { createHmac } from 'node:crypto';
import request from 'supertest';
import { manualClock } from '../../server/src/adapters/clock';
import { TOKEN_PATTERN } from '../../server/src/modules/tokens/token-format';
import {
  CreatedTokenAnswer,
  TokenListAnswer,
} from '../../server/src/modules/tokens/tokens-schemas';
import { sourceId, submitted, valueItem, as as asCurator } from '../support/proposals';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

describe('API tokens', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  async function as(login: string): Promise<{ agent: Agent; xsrf: string }> {
    const agent = request.agent(t.app);
    return { agent, xsrf: await signIn(agent, login) };
  }

  async function newToken(login: string, name = 'simulator sync') {
    const { agent, xsrf } = await as(login);
    const res = await agent
      .post('/api/v1/me/tokens')
      .set('X-XSRF-TOKEN', xsrf)
      .send({ name })
      .expect(201);
    return { agent, xsrf, ...CreatedTokenAnswer.parse(res.body) };
  }

  const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });
  const sql = async (text: string, params: unknown[] = []) =>
    (await t.db.pool.query(text, params)).rows;

  it('creates a named token, shown once, with a recognisable prefix', async () => {
    const { token, apiToken } = await newToken('demo-reader', '  nightly export  ');
    expect(token).toMatch(TOKEN_PATTERN);
    expect(apiToken).toMatchObject({ name: 'nightly export', lastUsedAt: null });
    expect(token.startsWith(`${apiToken.prefix}_`)).toBe(true);
  });

  it('stores only the prefix and a keyed hash: no plaintext at rest', async () => {
    const { token, apiToken } = await newToken('demo-reader');
    const [row] = await sql(`select * from api_tokens where id = $1`, [apiToken.id]);
    expect(row.prefix).toBe(apiToken.prefix);
    expect(row.hash).toBe(createHmac('sha256', t.config.tokenHashKey).update(token).digest('hex'));
    const secret = token.slice(apiToken.prefix.length + 1);
    const [leak] = await sql(
      `select count(*)::int as n from api_tokens
        where row_to_json(api_tokens)::text like '%' || $1 || '%'`,
      [secret],
    );
    expect(leak.n).toBe(0);
    // Nor in the audit log.
    const [audit] = await sql(
      `select count(*)::int as n from audit_log where coalesce(after::text, '') like '%' || $1 || '%'`,
      [secret],
    );
    expect(audit.n).toBe(0);
  });

  it('authenticates read routes with Authorization: Bearer, without any cookie', async () => {
    const { token } = await newToken('demo-curator');
    const me = await request(t.app).get('/api/v1/me').set(bearer(token)).expect(200);
    expect(me.body.login).toBe('demo-curator');
    expect(me.headers['set-cookie']).toBeUndefined();
    await request(t.app).get('/api/v1/releases').set(bearer(token)).expect(200);
    await request(t.app)
      .post('/api/v1/reaction-enthalpy')
      .set(bearer(token))
      .send({ equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', release: '2026.1' })
      .expect(200);
  });

  it('lists active tokens with their last use, recorded on first use', async () => {
    const { agent, token, apiToken } = await newToken('demo-editor', 'plant model');
    await request(t.app).get('/api/v1/me').set(bearer(token)).expect(200);
    const list = TokenListAnswer.parse((await agent.get('/api/v1/me/tokens').expect(200)).body);
    const mine = list.tokens.find((x) => x.id === apiToken.id);
    expect(mine).toMatchObject({ name: 'plant model', prefix: apiToken.prefix });
    expect(mine!.lastUsedAt).not.toBeNull();
    expect(JSON.stringify(list)).not.toContain(token);
  });

  it('answers 401 invalid_token to an unknown or revoked token, never falling back', async () => {
    const { agent, xsrf, token, apiToken } = await newToken('demo-reader');
    const unknown = token.replace(/.$/, (c) => (c === 'A' ? 'B' : 'A'));
    const res = await agent.get('/api/v1/me').set(bearer(unknown)).expect(401);
    expect(res.body.error.code).toBe('invalid_token');

    await agent.delete(`/api/v1/me/tokens/${apiToken.id}`).set('X-XSRF-TOKEN', xsrf).expect(204);
    // The session cookie rides along, but the revoked token decides: 401.
    const revoked = await agent.get('/api/v1/me').set(bearer(token)).expect(401);
    expect(revoked.body.error.code).toBe('invalid_token');
    await request(t.app).get('/api/v1/releases').set(bearer(token)).expect(401);
    const list = TokenListAnswer.parse((await agent.get('/api/v1/me/tokens')).body);
    expect(list.tokens.map((x) => x.id)).not.toContain(apiToken.id);
    // Revoking again changes nothing.
    await agent.delete(`/api/v1/me/tokens/${apiToken.id}`).set('X-XSRF-TOKEN', xsrf).expect(204);
  });

  it('audits creation and revocation', async () => {
    const { agent, xsrf, apiToken } = await newToken('demo-reader', 'audited');
    await agent.delete(`/api/v1/me/tokens/${apiToken.id}`).set('X-XSRF-TOKEN', xsrf).expect(204);
    const rows = await sql(
      `select action, before, after from audit_log where entity_type = 'api_token' and entity_id = $1
        order by id`,
      [String(apiToken.id)],
    );
    expect(rows.map((r) => r.action)).toEqual(['token.created', 'token.revoked']);
    expect(rows[0].after).toEqual({ name: 'audited', prefix: apiToken.prefix });
  });

  it('does not let a token create, list or revoke tokens', async () => {
    const { agent, token, apiToken } = await newToken('demo-reader');
    const create = await request(t.app)
      .post('/api/v1/me/tokens')
      .set(bearer(token))
      .send({ name: 'offspring' })
      .expect(403);
    expect(create.body.error.code).toBe('session_required');
    await request(t.app).get('/api/v1/me/tokens').set(bearer(token)).expect(403);
    await request(t.app).delete(`/api/v1/me/tokens/${apiToken.id}`).set(bearer(token)).expect(403);
    // Not even with the owner's session cookie alongside.
    await agent.post('/api/v1/me/tokens').set(bearer(token)).send({ name: 'x' }).expect(403);
    const [n] = await sql(`select count(*)::int as n from api_tokens where name = 'offspring'`);
    expect(n.n).toBe(0);
  });

  it("does not stand in for privileged actions, even an admin's token", async () => {
    const { token } = await newToken('demo-admin');
    const [reader] = await sql(`select id from users where login = 'demo-reader'`);
    const res = await request(t.app)
      .patch(`/api/v1/users/${reader.id}`)
      .set(bearer(token))
      .send({ role: 'editor' })
      .expect(403);
    expect(res.body.error.code).toBe('session_required');
    const [after] = await sql(`select role from users where id = $1`, [reader.id]);
    expect(after.role).toBe('reader');
  });

  it("lets a curator's script propose with a token, but not an editor's token decide", async () => {
    const source = await sourceId(t);
    const { token } = await newToken('demo-curator', 'nightly proposals');
    // No session cookie and no CSRF header: the token alone authenticates the write.
    const created = await request(t.app)
      .post('/api/v1/proposals')
      .set(bearer(token))
      .send({ rationale: 'From the lab script', items: [valueItem(source)] })
      .expect(201);
    const [p] = await sql(
      `select p.status, u.login from proposals p join users u on u.id = p.author_id where p.id = $1`,
      [created.body.id],
    );
    expect(p).toEqual({ status: 'draft', login: 'demo-curator' });

    const id = await submitted(await asCurator(t, 'demo-curator'), [valueItem(source)]);
    const { token: editorToken } = await newToken('demo-editor', 'review bot');
    const decision = await request(t.app)
      .post(`/api/v1/proposals/${id}/decision`)
      .set(bearer(editorToken))
      .send({ decision: 'approve', comment: 'looks fine' })
      .expect(403);
    expect(decision.body.error.code).toBe('session_required');
    const [after] = await sql(`select status from proposals where id = $1`, [id]);
    expect(after.status).toBe('submitted');
  });

  it('keeps CSRF protection for cookie sessions', async () => {
    const { agent } = await as('demo-reader');
    const res = await agent.post('/api/v1/me/tokens').send({ name: 'no header' }).expect(403);
    expect(res.body.error.code).toBe('csrf');
    await agent.post('/api/v1/me/tokens').set(bearer('x')).send({ name: 'x' }).expect(401);
  });

  it("cannot revoke someone else's token (404) and needs a sign-in", async () => {
    const { apiToken } = await newToken('demo-editor');
    const { agent, xsrf } = await as('demo-reader');
    await agent.delete(`/api/v1/me/tokens/${apiToken.id}`).set('X-XSRF-TOKEN', xsrf).expect(404);
    const [row] = await sql(`select revoked_at from api_tokens where id = $1`, [apiToken.id]);
    expect(row.revoked_at).toBeNull();
    await request(t.app).get('/api/v1/me/tokens').expect(401);
    await request(t.app).post('/api/v1/me/tokens').send({ name: 'x' }).expect(401);
  });

  it('validates the name and the id', async () => {
    const { agent, xsrf } = await as('demo-reader');
    for (const body of [{}, { name: '' }, { name: 'x'.repeat(101) }, { name: 'a', extra: 1 }]) {
      const res = await agent.post('/api/v1/me/tokens').set('X-XSRF-TOKEN', xsrf).send(body);
      expect(res.status).toBe(400);
    }
    await agent.delete('/api/v1/me/tokens/2147483648').set('X-XSRF-TOKEN', xsrf).expect(400);
  });
});

describe('API rate limits per token', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({
      API_RATE_LIMIT: '2',
      API_RATE_LIMIT_SIGNED_IN: '4',
      API_RATE_LIMIT_TOKEN: '6',
    });
  });
  afterAll(() => t.close());

  it('gives each token its own bucket with the higher limit, and 429 with the standard headers', async () => {
    const agent = request.agent(t.app);
    const xsrf = await signIn(agent, 'demo-reader');
    const created = async () =>
      CreatedTokenAnswer.parse(
        (
          await agent
            .post('/api/v1/me/tokens')
            .set('X-XSRF-TOKEN', xsrf)
            .send({ name: 'limits' })
            .expect(201)
        ).body,
      ).token;
    const first = await created();
    const second = await created();

    // Anonymous callers from this address are limited at 2.
    await request(t.app).get('/api/v1/releases').expect(200);
    await request(t.app).get('/api/v1/releases').expect(200);
    await request(t.app).get('/api/v1/releases').expect(429);

    for (let i = 0; i < 6; i++) {
      const ok = await request(t.app)
        .get('/api/v1/releases')
        .set('Authorization', `Bearer ${first}`)
        .expect(200);
      expect(ok.headers['ratelimit-policy']).toMatch(/q=6; w=60/);
    }
    const limited = await request(t.app)
      .get('/api/v1/releases')
      .set('Authorization', `Bearer ${first}`)
      .expect(429);
    expect(limited.body.error.code).toBe('rate_limited');
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0);
    expect(limited.headers['ratelimit']).toMatch(/r=0; t=\d+/);
    expect(limited.headers['ratelimit-policy']).toMatch(/q=6; w=60/);

    // Another token of the same user has a bucket of its own.
    await request(t.app)
      .get('/api/v1/releases')
      .set('Authorization', `Bearer ${second}`)
      .expect(200);
  });
});

describe('the last-use stamp of a token', () => {
  const clock = manualClock(new Date('2026-03-01T08:00:00Z'));
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({}, { adapters: { clock } });
  });
  afterAll(() => t.close());

  it('is written at most once a minute', async () => {
    const agent = request.agent(t.app);
    const xsrf = await signIn(agent, 'demo-reader');
    const { token, apiToken } = CreatedTokenAnswer.parse(
      (await agent.post('/api/v1/me/tokens').set('X-XSRF-TOKEN', xsrf).send({ name: 'stamp' }))
        .body,
    );
    const lastUsed = async () =>
      (await t.db.pool.query(`select last_used_at from api_tokens where id = $1`, [apiToken.id]))
        .rows[0].last_used_at as Date | null;
    const use = () =>
      request(t.app).get('/api/v1/me').set('Authorization', `Bearer ${token}`).expect(200);

    await use();
    expect((await lastUsed())?.toISOString()).toBe('2026-03-01T08:00:00.000Z');
    clock.advance(59_000);
    await use();
    expect((await lastUsed())?.toISOString()).toBe('2026-03-01T08:00:00.000Z');
    clock.advance(2_000);
    await use();
    expect((await lastUsed())?.toISOString()).toBe('2026-03-01T08:01:01.000Z');
  });
});
