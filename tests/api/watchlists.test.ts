import request from 'supertest';
import { watchlistImpactsForRelease } from '../../server/src/modules/watchlists/watchlist-impacts';
import {
  ImpactAnswer,
  WatchlistAnswer,
  WatchlistListAnswer,
} from '../../server/src/modules/watchlists/watchlists-schemas';
import { publishRevisedWater } from '../support/releases';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

/** ΔfH° of liquid water moves by this much (J/mol) from 2026.1 to the test's 2026.2. */
const WATER_CHANGE = 500;

describe('impact reports and watchlists', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
    // A second published release in which one value changed: liquid water's ΔfH°.
    await publishRevisedWater(t, WATER_CHANGE, 'Water revised (test)');
  });
  afterAll(() => t.close());

  async function as(login: string): Promise<{ agent: Agent; xsrf: string }> {
    const agent = request.agent(t.app);
    return { agent, xsrf: await signIn(agent, login) };
  }

  const impact = (body: object, a = '2026.1', b = '2026.2') =>
    request(t.app).post(`/api/v1/releases/${a}/impact/${b}`).send(body);

  describe('POST /api/v1/releases/:a/impact/:b', () => {
    it('gives ΔrH in both releases and a change of exactly coefficient × the value change', async () => {
      const res = await impact({
        unit: 'J/mol',
        equations: [
          'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
          'H2(g) + 1/2 O2(g) -> H2O(l)',
          'C(graphite) + O2(g) -> CO2(g)',
        ],
      }).expect(200);
      const answer = ImpactAnswer.parse(res.body);
      expect(answer).toMatchObject({ from: '2026.1', to: '2026.2', count: 3, errors: 0 });
      const [combustion, water, co2] = answer.results;
      expect(combustion!.change).toBe(2 * WATER_CHANGE);
      expect(water!.change).toBe(WATER_CHANGE);
      expect(co2!.change).toBe(0);
      expect(co2!.exceedsUncertainty).toBe(false);
      // Each side is what the reaction-enthalpy route answers for that release.
      for (const [version, side] of [
        ['2026.1', water!.from],
        ['2026.2', water!.to],
      ] as const) {
        const single = await request(t.app)
          .post('/api/v1/reaction-enthalpy')
          .send({ equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', release: version, unit: 'J/mol' })
          .expect(200);
        expect(side).toMatchObject({
          deltaH: single.body.deltaH,
          uncertainty: single.body.uncertainty,
        });
      }
      // ±40 J/mol in each release: the combined uncertainty is their root sum of squares.
      expect(water!.combinedUncertainty).toBeCloseTo(Math.hypot(40, 40), 9);
      expect(water!.exceedsUncertainty).toBe(true);
      // Methane states no uncertainty in the starter data: no flag either way.
      expect(combustion!.combinedUncertainty).toBeNull();
      expect(combustion!.exceedsUncertainty).toBeNull();
      expect(answer.exceeding).toBe(1);
    });

    it('answers in the requested unit, kJ/mol by default', async () => {
      const res = await impact({ equations: ['2 H2(g) + O2(g) -> 2 H2O(l)'] }).expect(200);
      const answer = ImpactAnswer.parse(res.body);
      expect(answer.unit).toBe('kJ/mol');
      expect(answer.results[0]!.change).toBe((2 * WATER_CHANGE) / 1000);
    });

    it('reports per-item errors like the batch, keeping the other items', async () => {
      const res = await impact({
        equations: ['H2(g) + 1/2 O2(g) -> H2O(l)', 'H2 + -> ', 'Xx2(g) -> Xx2(l)', 'H2(g) -> H(g)'],
      }).expect(200);
      const answer = ImpactAnswer.parse(res.body);
      expect(answer.errors).toBe(3);
      expect(answer.results[0]!.change).not.toBeNull();
      for (const item of answer.results.slice(1)) {
        expect(item.change).toBeNull();
        expect('error' in item.from && item.from.error.code).toBeTruthy();
      }
      const parse = answer.results[1]!.from;
      expect('error' in parse && parse.error).toMatchObject({ code: 'parse_error', status: 400 });
    });

    it('computes at a temperature given for every equation', async () => {
      const res = await impact({
        equations: ['CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)'],
        temperatureK: 800,
        unit: 'J/mol',
      }).expect(200);
      const item = ImpactAnswer.parse(res.body).results[0]!;
      expect(item.temperatureK).toBe(800);
      expect(item.change).toBe(0);
    });

    it('refuses bad input with 400 and unknown releases with 404', async () => {
      await impact({}).expect(400);
      await impact({ equations: [] }).expect(400);
      await impact({ equations: ['H2(g) -> H2(g)'], watchlistId: 1 }).expect(400);
      await impact({ equations: Array(1001).fill('H2(g) -> H2(g)') }).expect(400);
      const res = await impact({ equations: ['H2(g) -> H2(g)'] }, '2026.1', '2031.9').expect(404);
      expect(res.body.error.code).toBe('unknown_release');
    });

    it('takes up to 1,000 equations', async () => {
      const res = await impact({ equations: Array(1000).fill('H2(g) + 1/2 O2(g) -> H2O(l)') });
      expect(res.status).toBe(200);
      expect(res.body.count).toBe(1000);
    });
  });

  describe('watchlists', () => {
    const body = {
      name: 'Reformer duties',
      reactions: [
        { equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)', label: 'methane combustion' },
        { equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', temperatureK: 298.15 },
      ],
    };

    it('creates, lists, reads, replaces and deletes a watchlist, each write audited', async () => {
      const { agent, xsrf } = await as('demo-reader');
      const created = WatchlistAnswer.parse(
        (await agent.post('/api/v1/me/watchlists').set('X-XSRF-TOKEN', xsrf).send(body).expect(201))
          .body,
      ).watchlist;
      expect(created.reactions).toEqual(body.reactions);

      const list = WatchlistListAnswer.parse((await agent.get('/api/v1/me/watchlists')).body);
      expect(list.watchlists).toEqual([
        expect.objectContaining({ id: created.id, name: 'Reformer duties', count: 2 }),
      ]);
      await agent.get(`/api/v1/me/watchlists/${created.id}`).expect(200);

      const replaced = WatchlistAnswer.parse(
        (
          await agent
            .put(`/api/v1/me/watchlists/${created.id}`)
            .set('X-XSRF-TOKEN', xsrf)
            .send({ name: 'Reformer', reactions: [body.reactions[1]] })
            .expect(200)
        ).body,
      ).watchlist;
      expect(replaced).toMatchObject({ name: 'Reformer', reactions: [body.reactions[1]] });

      await agent
        .delete(`/api/v1/me/watchlists/${created.id}`)
        .set('X-XSRF-TOKEN', xsrf)
        .expect(204);
      await agent.get(`/api/v1/me/watchlists/${created.id}`).expect(404);
      const audit = await t.db.pool.query(
        `select action from audit_log where entity_type = 'watchlist' and entity_id = $1 order by id`,
        [String(created.id)],
      );
      expect(audit.rows.map((r) => r.action)).toEqual([
        'watchlist.created',
        'watchlist.updated',
        'watchlist.deleted',
      ]);
    });

    it('runs the impact report of a watchlist, for its owner only', async () => {
      const owner = await as('demo-curator');
      const other = await as('demo-editor');
      const { watchlist } = WatchlistAnswer.parse(
        (
          await owner.agent
            .post('/api/v1/me/watchlists')
            .set('X-XSRF-TOKEN', owner.xsrf)
            .send(body)
            .expect(201)
        ).body,
      );
      const res = await owner.agent
        .post('/api/v1/releases/2026.1/impact/2026.2')
        .set('X-XSRF-TOKEN', owner.xsrf)
        .send({ watchlistId: watchlist.id, unit: 'J/mol' })
        .expect(200);
      const answer = ImpactAnswer.parse(res.body);
      expect(answer.watchlistId).toBe(watchlist.id);
      expect(answer.results.map((r) => [r.label, r.change])).toEqual([
        ['methane combustion', 2 * WATER_CHANGE],
        [null, WATER_CHANGE],
      ]);

      // Someone else: not found, whatever the route.
      await other.agent.get(`/api/v1/me/watchlists/${watchlist.id}`).expect(404);
      await other.agent
        .put(`/api/v1/me/watchlists/${watchlist.id}`)
        .set('X-XSRF-TOKEN', other.xsrf)
        .send(body)
        .expect(404);
      await other.agent
        .delete(`/api/v1/me/watchlists/${watchlist.id}`)
        .set('X-XSRF-TOKEN', other.xsrf)
        .expect(404);
      await other.agent
        .post('/api/v1/releases/2026.1/impact/2026.2')
        .set('X-XSRF-TOKEN', other.xsrf)
        .send({ watchlistId: watchlist.id })
        .expect(404);
      await impact({ watchlistId: watchlist.id }).expect(401);
      await request(t.app).get('/api/v1/me/watchlists').expect(401);

      // The reports a publish e-mail will carry, per watcher.
      const reports = await watchlistImpactsForRelease(t.db.db, '2026.1', '2026.2');
      const mine = reports.find((r) => r.watchlist.id === watchlist.id);
      expect(mine?.owner.login).toBe('demo-curator');
      expect(mine?.report.results.map((r) => r.change)).toEqual([
        (2 * WATER_CHANGE) / 1000,
        WATER_CHANGE / 1000,
      ]);
    });

    it('works with an API token, and refuses duplicate names and bad input', async () => {
      const { agent, xsrf } = await as('demo-admin');
      const { token } = (
        await agent.post('/api/v1/me/tokens').set('X-XSRF-TOKEN', xsrf).send({ name: 'w' })
      ).body as { token: string };
      const auth = { Authorization: `Bearer ${token}` };
      await request(t.app).post('/api/v1/me/watchlists').set(auth).send(body).expect(201);
      const dup = await request(t.app).post('/api/v1/me/watchlists').set(auth).send(body);
      expect(dup.status).toBe(409);
      expect(dup.body.error.code).toBe('name_taken');
      for (const bad of [
        { name: '', reactions: [] },
        { name: 'x', reactions: [{ equation: '' }] },
        { name: 'x', reactions: [{ equation: 'H2(g) -> H2(g)', temperatureK: -1 }] },
        { name: 'x', reactions: Array(1001).fill({ equation: 'H2(g) -> H2(g)' }) },
        { name: 'x', reactions: [], owner: 1 },
      ]) {
        await request(t.app).post('/api/v1/me/watchlists').set(auth).send(bad).expect(400);
      }
      await request(t.app).get('/api/v1/me/watchlists/2147483648').set(auth).expect(400);
    });
  });
});
