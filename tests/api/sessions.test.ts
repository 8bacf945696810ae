import request from 'supertest';
import { manualClock } from '../../server/src/adapters/clock';
import { cookieValue, createTestApp, signInFlow, type TestApp } from '../support/test-app';

// Session rows: written only when something is in them, renewed at most once a minute, and
// ended by an absolute lifetime however active the user is.
describe('sessions', () => {
  const clock = manualClock(new Date('2026-03-02T08:00:00Z'));
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({}, { adapters: { clock } });
  });
  afterAll(() => t.close());

  const rowCount = async () =>
    (await t.db.pool.query('select count(*)::int as n from session')).rows[0].n as number;
  const sessionCookie = (res: request.Response) =>
    cookieValue(res.headers['set-cookie'], 'thalpos.sid');

  it('stores nothing for anonymous visits', async () => {
    const before = await rowCount();
    await request(t.app).get('/api/v1/me').expect(401);
    await request(t.app).post('/api/v1/equations/parse').send({ equation: 'H2 -> 2 H' });
    await request(t.app).get('/some/page');
    expect(await rowCount()).toBe(before);
  });

  it('keeps the OAuth state of a sign-in that has begun, but only for minutes', async () => {
    const res = await request(t.app).get('/auth/github').expect(302);
    const sid = decodeURIComponent(sessionCookie(res)!).slice(2).split('.')[0];
    const row = await t.db.pool.query(
      `select sess, extract(epoch from expire - now()) as left from session where sid = $1`,
      [sid],
    );
    expect(Object.keys(row.rows[0].sess)).toEqual(
      expect.arrayContaining(['oauth2:' + new URL(process.env.FAKE_GITHUB_URL!).hostname]),
    );
    // Ten minutes, against 8 hours for a signed-in session (a second of slack for clocks).
    expect(Number(row.rows[0].left)).toBeLessThan(10 * 60 + 5);
  });

  it("leaves a signed-in user's session lifetime alone when they start a sign-in again", async () => {
    const agent = request.agent(t.app);
    const { setCookie } = await signInFlow(agent, 'demo-editor');
    const sid = decodeURIComponent(cookieValue(setCookie, 'thalpos.sid')!).slice(2).split('.')[0];
    await agent.get('/auth/github').expect(302);
    const left = await t.db.pool.query(
      `select extract(epoch from expire - now()) as left from session where sid = $1`,
      [sid],
    );
    expect(Number(left.rows[0].left)).toBeGreaterThan(7 * 3600);
  });

  it('writes an active session at most once a minute', async () => {
    const agent = request.agent(t.app);
    const { setCookie } = await signInFlow(agent, 'demo-reader');
    const sid = decodeURIComponent(cookieValue(setCookie, 'thalpos.sid')!).slice(2).split('.')[0];
    const seenAt = async () =>
      (await t.db.pool.query('select sess from session where sid = $1', [sid])).rows[0].sess
        .seenAt as number;
    const first = await seenAt();

    for (let i = 0; i < 3; i++) {
      clock.advance(10_000);
      const res = await agent.get('/api/v1/me').expect(200);
      expect(sessionCookie(res)).toBeUndefined();
    }
    expect(await seenAt()).toBe(first);

    clock.advance(31_000);
    const renewed = await agent.get('/api/v1/me').expect(200);
    expect(sessionCookie(renewed)).toBeDefined();
    expect(await seenAt()).toBe(first + 61_000);
  });

  it('ends a session at its absolute lifetime, however active', async () => {
    const agent = request.agent(t.app);
    await signInFlow(agent, 'demo-curator');
    for (let day = 0; day < 6; day++) {
      clock.advance(24 * 3600_000);
      await agent.get('/api/v1/me').expect(200);
    }
    clock.advance(24 * 3600_000 + 1000);
    await agent.get('/api/v1/me').expect(401);
    // and the row is gone, not merely ignored
    await agent.get('/api/v1/me').expect(401);
  });
});
