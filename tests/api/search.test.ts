import request from 'supertest';
import { SearchAnswer } from '../../server/src/modules/search/search-schemas';
import { createTestApp, type TestApp } from '../support/test-app';

describe('GET /api/v1/search', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const search = async (q: string, extra = '') =>
    SearchAnswer.parse(
      (
        await request(t.app)
          .get(`/api/v1/search?q=${encodeURIComponent(q)}${extra}`)
          .expect(200)
      ).body,
    );
  const keys = (a: SearchAnswer) => a.results.map((r) => r.key);
  const identifiers = async (key: string) =>
    (await t.db.pool.query('select cas_rn, inchi_key from species where key = $1', [key])).rows[0];

  it.each([
    ['watr', 'water'],
    ['Wtaer', 'water'],
    ['metane', 'methane'],
    ['amonia', 'ammonia'],
    ['carbon dioxid', 'carbon-dioxide'],
    ['calcium carbonat', 'calcium-carbonate'],
    ['2-methylpropan', '2-methylpropane'],
  ])('finds a misspelt name: %s → %s first', async (q, key) => {
    expect(keys(await search(q))[0]).toBe(key);
  });

  it.each(['H2O', 'OH2', 'HOH'])('reads %s as the formula H2O and finds water first', async (q) => {
    const a = await search(q);
    expect(a.formula).toBe('H2O');
    expect(a.results[0]).toMatchObject({ key: 'water', match: 'formula', score: 0 });
  });

  it('finds both isomers of one formula', async () => {
    const a = await search('C4H10');
    expect(
      a.results
        .filter((r) => r.match === 'formula')
        .map((r) => r.key)
        .sort(),
    ).toEqual(['2-methylpropane', 'butane']);
  });

  it('finds a species by its CAS RN and by its InChIKey in any letter case', async () => {
    const water = await identifiers('water');
    const byCas = await search(water.cas_rn);
    expect(byCas.results[0]).toMatchObject({ key: 'water', match: 'cas' });
    const ethanol = await identifiers('ethanol');
    const byKey = await search(ethanol.inchi_key.toLowerCase());
    expect(byKey.results[0]).toMatchObject({ key: 'ethanol', match: 'inchikey' });
  });

  it('lists the phases the release holds for each hit', async () => {
    const [water] = (await search('water')).results;
    expect(water!.phases).toEqual(
      expect.arrayContaining([
        { phase: 'g', modification: null },
        { phase: 'l', modification: null },
      ]),
    );
    const [calcite] = (await search('calcium carbonate')).results;
    expect(calcite!.phases).toContainEqual({ phase: 'cr', modification: 'calcite' });
  });

  it('returns nothing for noise and honours the limit', async () => {
    expect((await search('qqxzzv')).results).toEqual([]);
    expect((await search('ox', '&limit=3')).results.length).toBeLessThanOrEqual(3);
  });

  it('answers a named release with an immutable cache and latest with a short one', async () => {
    const named = await request(t.app).get('/api/v1/search?q=water&release=2026.1').expect(200);
    expect(named.headers['cache-control']).toMatch(/immutable/);
    const latest = await request(t.app).get('/api/v1/search?q=water').expect(200);
    expect(latest.headers['cache-control']).toMatch(/max-age=60$/);
    expect(latest.body.results).toEqual(named.body.results);
  });

  it.each([
    ['', 400, 'validation_error'],
    ['?q=', 400, 'validation_error'],
    [`?q=${'a'.repeat(101)}`, 400, 'validation_error'],
    ['?q=water&limit=0', 400, 'validation_error'],
    ['?q=water&release=2099.1', 404, 'unknown_release'],
  ])('refuses %s', async (query, status, code) => {
    const res = await request(t.app).get(`/api/v1/search${query}`).expect(status);
    expect(res.body.error.code).toBe(code);
  });
});
