import { Client } from 'pg';
import request from 'supertest';
import {
  MeAnswer,
  RoleChangeAnswer,
  UsersListAnswer,
} from '../../server/src/modules/users/users-schemas';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

describe('users and roles', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const idOf = async (login: string): Promise<number> =>
    (await t.db.pool.query('select id from users where login = $1', [login])).rows[0].id;

  async function as(login: string): Promise<{ agent: Agent; xsrf: string }> {
    const agent = request.agent(t.app);
    return { agent, xsrf: await signIn(agent, login) };
  }

  describe('role guard', () => {
    it('refuses anonymous callers with 401', async () => {
      await request(t.app).get('/api/v1/users').expect(401);
      await request(t.app).patch('/api/v1/users/1').send({ role: 'admin' }).expect(401);
    });

    it.each(['demo-reader', 'demo-curator', 'demo-editor'])(
      'refuses %s with 403',
      async (login) => {
        const { agent, xsrf } = await as(login);
        const list = await agent.get('/api/v1/users').expect(403);
        expect(list.body.error.code).toBe('forbidden');
        const target = await idOf('demo-reader');
        await agent
          .patch(`/api/v1/users/${target}`)
          .set('X-XSRF-TOKEN', xsrf)
          .send({ role: 'admin' })
          .expect(403);
        const row = await t.db.pool.query('select role from users where id = $1', [target]);
        expect(row.rows[0].role).toBe('reader');
      },
    );

    it('lets an admin list users', async () => {
      const { agent } = await as('demo-admin');
      const res = await agent.get('/api/v1/users').expect(200);
      UsersListAnswer.strict().parse(res.body);
      MeAnswer.strict().parse((await agent.get('/api/v1/me').expect(200)).body);
      const logins = res.body.users.map((u: { login: string }) => u.login);
      expect(logins).toEqual(expect.arrayContaining(['demo-admin', 'demo-curator', 'demo-reader']));
      expect(res.body.users[0]).toEqual(
        expect.objectContaining({
          id: expect.any(Number),
          login: expect.any(String),
          name: expect.any(String),
          role: expect.any(String),
        }),
      );
    });
  });

  it('refuses a cookie-authenticated mutation without the CSRF header (403 csrf) and changes nothing', async () => {
    const { agent } = await as('demo-admin');
    const target = await idOf('demo-curator');
    const res = await agent.patch(`/api/v1/users/${target}`).send({ role: 'editor' }).expect(403);
    expect(res.body.error.code).toBe('csrf');
    const wrong = await agent
      .patch(`/api/v1/users/${target}`)
      .set('X-XSRF-TOKEN', 'not-the-token')
      .send({ role: 'editor' });
    expect(wrong.status).toBe(403);
    const row = await t.db.pool.query('select role from users where id = $1', [target]);
    expect(row.rows[0].role).toBe('curator');
  });

  it('changes a role and writes an audit row in the same transaction', async () => {
    const { agent, xsrf } = await as('demo-admin');
    const admin = await idOf('demo-admin');
    const target = await idOf('demo-editor-2');
    const res = await agent
      .patch(`/api/v1/users/${target}`)
      .set('X-XSRF-TOKEN', xsrf)
      .send({ role: 'curator' })
      .expect(200);
    expect(RoleChangeAnswer.strict().parse(res.body).user).toMatchObject({
      id: target,
      login: 'demo-editor-2',
      role: 'curator',
    });

    const audit = await t.db.pool.query(
      `select actor_id, action, before, after, at from audit_log
        where entity_type = 'user' and entity_id = $1 and action = 'user.role_changed'`,
      [String(target)],
    );
    expect(audit.rows).toHaveLength(1);
    expect(audit.rows[0]).toMatchObject({
      actor_id: admin,
      before: { role: 'editor' },
      after: { role: 'curator' },
    });
    expect(audit.rows[0].at).toBeInstanceOf(Date);

    // The changed user sees the new role at once, without signing in again.
    const { agent: changed } = await as('demo-editor-2');
    expect((await changed.get('/api/v1/me').expect(200)).body.role).toBe('curator');
  });

  it('answers 404 for an unknown user and 400 for a bad id', async () => {
    const { agent, xsrf } = await as('demo-admin');
    expect(
      (
        await agent
          .patch('/api/v1/users/999999')
          .set('X-XSRF-TOKEN', xsrf)
          .send({ role: 'editor' })
          .expect(404)
      ).body.error.code,
    ).toBe('not_found');
    expect(
      (
        await agent
          .patch('/api/v1/users/abc')
          .set('X-XSRF-TOKEN', xsrf)
          .send({ role: 'editor' })
          .expect(400)
      ).body.error.code,
    ).toBe('validation_error');
  });

  it('never demotes the last admin, and audits nothing when refused', async () => {
    const { agent, xsrf } = await as('demo-admin');
    const admin = await idOf('demo-admin');
    const before = (await t.db.pool.query('select count(*)::int as n from audit_log')).rows[0].n;
    const res = await agent
      .patch(`/api/v1/users/${admin}`)
      .set('X-XSRF-TOKEN', xsrf)
      .send({ role: 'editor' })
      .expect(409);
    expect(res.body.error.code).toBe('last_admin');
    expect(
      (await t.db.pool.query('select role from users where id = $1', [admin])).rows[0].role,
    ).toBe('admin');
    expect((await t.db.pool.query('select count(*)::int as n from audit_log')).rows[0].n).toBe(
      before,
    );
  });

  it('allows demoting an admin while another admin remains', async () => {
    const { agent, xsrf } = await as('demo-admin');
    const curator = await idOf('demo-curator');
    await agent
      .patch(`/api/v1/users/${curator}`)
      .set('X-XSRF-TOKEN', xsrf)
      .send({ role: 'admin' })
      .expect(200);
    const admin = await idOf('demo-admin');
    await agent
      .patch(`/api/v1/users/${admin}`)
      .set('X-XSRF-TOKEN', xsrf)
      .send({ role: 'editor' })
      .expect(200);
    // demo-admin is now an editor: the next admin-only call from the same session is refused.
    await agent.get('/api/v1/users').expect(403);
    // and the remaining admin (demo-curator) cannot demote themself.
    const { agent: other, xsrf: otherXsrf } = await as('demo-curator');
    expect(
      (
        await other
          .patch(`/api/v1/users/${curator}`)
          .set('X-XSRF-TOKEN', otherXsrf)
          .send({ role: 'reader' })
          .expect(409)
      ).body.error.code,
    ).toBe('last_admin');
  });

  it('audits a refused role change as its own action, without the change it asked for', async () => {
    const { agent, xsrf } = await as('demo-editor');
    const editor = await idOf('demo-editor');
    const target = await idOf('demo-reader');
    const refusals = async () =>
      (
        await t.db.pool.query(
          `select actor_id, entity_type, entity_id, before, after from audit_log
            where action = 'user.role_change_refused' and actor_id = $1 order by id`,
          [editor],
        )
      ).rows;
    const before = (await refusals()).length;
    await agent
      .patch(`/api/v1/users/${target}`)
      .set('X-XSRF-TOKEN', xsrf)
      .send({ role: 'admin' })
      .expect(403);
    const rows = await refusals();
    expect(rows).toHaveLength(before + 1);
    expect(rows.at(-1)).toEqual({
      actor_id: editor,
      entity_type: 'user',
      entity_id: String(target),
      before: null,
      after: null,
    });
    expect(
      (await t.db.pool.query('select role from users where id = $1', [target])).rows[0].role,
    ).toBe('reader');
  });

  it("re-checks the acting admin's role under lock: a demotion committed meanwhile wins", async () => {
    // Two admins on a database of their own: one is demoted (in a transaction this test holds
    // open) while their request to promote a reader is on its way.
    const race = await createTestApp();
    const other = new Client({ connectionString: race.db.url });
    try {
      const id = async (login: string) =>
        (await race.db.pool.query('select id from users where login = $1', [login])).rows[0].id;
      const [actor, reader] = [await id('demo-admin'), await id('demo-reader')];
      await race.db.pool.query(`update users set role = 'admin' where login = 'demo-editor'`);
      const agent = request.agent(race.app);
      const xsrf = await signIn(agent, 'demo-admin');

      await other.connect();
      await other.query('begin');
      await other.query('select id from users where id = $1 for update', [actor]);
      await other.query(`update users set role = 'editor' where id = $1`, [actor]);

      // The request passes the route's role check (the demotion is not committed yet) and then
      // waits on the row lock inside its own transaction.
      const pending = agent
        .patch(`/api/v1/users/${reader}`)
        .set('X-XSRF-TOKEN', xsrf)
        .send({ role: 'admin' })
        .then((r) => r);
      for (;;) {
        const waiting = await other.query(
          `select count(*)::int as n from pg_stat_activity
            where datname = current_database() and wait_event_type = 'Lock'`,
        );
        if (waiting.rows[0].n > 0) break;
        await new Promise((r) => setImmediate(r));
      }
      await other.query('commit');

      const res = await pending;
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('role_revoked');
      expect(
        (await race.db.pool.query('select role from users where id = $1', [reader])).rows[0].role,
      ).toBe('reader');
      const refused = await race.db.pool.query(
        `select count(*)::int as n from audit_log
          where action = 'user.role_change_refused' and actor_id = $1 and entity_id = $2`,
        [actor, String(reader)],
      );
      expect(refused.rows[0].n).toBe(1);
    } finally {
      await other.end();
      await race.close();
    }
  });
});
