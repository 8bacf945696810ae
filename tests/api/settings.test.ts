import request from 'supertest';
import { SettingsAnswer } from '../../server/src/modules/users/users-schemas';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

describe('own settings', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  async function as(login: string): Promise<{ agent: Agent; xsrf: string }> {
    const agent = request.agent(t.app);
    return { agent, xsrf: await signIn(agent, login) };
  }

  it('needs a signed-in user', async () => {
    await request(t.app).get('/api/v1/me/settings').expect(401);
    await request(t.app)
      .patch('/api/v1/me/settings')
      .send({ emailNotifications: false })
      .expect(401);
  });

  it('reads notifications on by default, with the address they go to', async () => {
    const { agent } = await as('demo-reader');
    const res = await agent.get('/api/v1/me/settings').expect(200);
    expect(SettingsAnswer.strict().parse(res.body)).toEqual({
      emailNotifications: true,
      email: 'tomas.reyes@kestrel.example',
    });
  });

  it('turns notifications off and on, each change audited with before and after', async () => {
    const { agent, xsrf } = await as('demo-curator');
    const off = await agent
      .patch('/api/v1/me/settings')
      .set('X-XSRF-TOKEN', xsrf)
      .send({ emailNotifications: false })
      .expect(200);
    expect(off.body.emailNotifications).toBe(false);
    expect((await agent.get('/api/v1/me/settings').expect(200)).body.emailNotifications).toBe(
      false,
    );
    // The same value again changes nothing and writes nothing.
    await agent
      .patch('/api/v1/me/settings')
      .set('X-XSRF-TOKEN', xsrf)
      .send({ emailNotifications: false })
      .expect(200);
    await agent
      .patch('/api/v1/me/settings')
      .set('X-XSRF-TOKEN', xsrf)
      .send({ emailNotifications: true })
      .expect(200);
    const audit = await t.db.pool.query(
      `select a.before, a.after from audit_log a join users u on u.id = a.actor_id
        where u.login = 'demo-curator' and a.action = 'user.settings_changed' order by a.id`,
    );
    expect(audit.rows).toEqual([
      { before: { emailNotifications: true }, after: { emailNotifications: false } },
      { before: { emailNotifications: false }, after: { emailNotifications: true } },
    ]);
  });

  it('changes only the caller’s own setting', async () => {
    const { agent, xsrf } = await as('demo-editor');
    await agent
      .patch('/api/v1/me/settings')
      .set('X-XSRF-TOKEN', xsrf)
      .send({ emailNotifications: false })
      .expect(200);
    const rows = await t.db.pool.query(
      "select login from users where email_notifications = false and login like 'demo-%'",
    );
    expect(rows.rows.map((r) => r.login)).toEqual(['demo-editor']);
  });

  it('refuses a change without the CSRF header, and bad bodies with 400', async () => {
    const { agent, xsrf } = await as('demo-admin');
    const csrf = await agent.patch('/api/v1/me/settings').send({ emailNotifications: false });
    expect(csrf.status).toBe(403);
    for (const body of [
      { emailNotifications: 'no' },
      {},
      { emailNotifications: true, role: 'x' },
    ]) {
      const res = await agent
        .patch('/api/v1/me/settings')
        .set('X-XSRF-TOKEN', xsrf)
        .send(body)
        .expect(400);
      expect(res.body.error.code).toBe('validation_error');
    }
    expect((await agent.get('/api/v1/me/settings')).body.emailNotifications).toBe(true);
  });
});
