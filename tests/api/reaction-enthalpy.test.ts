import request from 'supertest';
import {
  BatchAnswer,
  ReactionAnswer,
  ReactionTerm,
} from '../../server/src/modules/reactions/reactions-schemas';
import { computeReaction } from '../../server/src/modules/reactions/reaction-answer';
import { starterSnapshot } from '../../server/src/modules/reactions/testing/starter-snapshot';
import { createTestApp, type TestApp } from '../support/test-app';

const URL = '/api/v1/reaction-enthalpy';
const COMBUSTION = 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)';

describe('reaction-enthalpy API on the starter release', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const post = (body: object) => request(t.app).post(URL).send(body);
  const get = (query: Record<string, string>) => request(t.app).get(URL).query(query);

  describe('the answer', () => {
    it('satisfies its schema exactly, every term included', async () => {
      const res = await post({ equation: COMBUSTION }).expect(200);
      // strict(): a field the route sends but the contract lacks fails too.
      const body = ReactionAnswer.strict().parse(res.body);
      for (const term of res.body.terms)
        expect(() => ReactionTerm.strict().parse(term)).not.toThrow();
      expect(body).toMatchObject({
        release: '2026.1',
        equation: COMBUSTION,
        temperatureK: 298.15,
        unit: 'kJ/mol',
        // CH4(g) states no uncertainty: the answer has none and says why.
        assumptions: ['no combined uncertainty: the release states none for ΔfH° of CH4(g)'],
      });
      expect(body.caution).toMatch(/estimates from tabulated data.*measured data/);
      expect(body.uncertaintyBasis).toEqual(expect.any(String));
    });

    it('gives each term its key, formula, phase, signed coefficient, value and provenance', async () => {
      const { body } = await post({ equation: COMBUSTION }).expect(200);
      const methane = body.terms.find((x: { species: string }) => x.species === 'methane');
      expect(methane).toMatchObject({
        formula: 'CH4',
        phase: 'g',
        coefficient: -1,
        referenceState: false,
      });
      expect(methane.revisionId).toEqual(expect.any(String));
      expect(methane.source.citation).toEqual(expect.any(String));
      const water = body.terms.find((x: { species: string }) => x.species === 'water');
      expect(water).toMatchObject({ phase: 'l', coefficient: 2 });
      const oxygen = body.terms.find((x: { species: string }) => x.species === 'oxygen');
      expect(oxygen).toMatchObject({ deltaFH: 0, referenceState: true, coefficient: -2 });
      expect(oxygen.note).toMatch(/reference state.*0 by definition/);
      const sum = body.terms.reduce(
        (s: number, x: { coefficient: number; deltaFH: number }) => s + x.coefficient * x.deltaFH,
        0,
      );
      expect(body.deltaH).toBeCloseTo(sum, 9);
      expect(body.uncertainty).toBeNull(); // the CH4 value has no stated uncertainty
      expect(body.uncertaintyBasis).toBe('unavailable');
    });

    it('combines stated uncertainties and names their basis', async () => {
      const { body } = await post({ equation: 'H2O(l) -> H2O(g)' }).expect(200);
      const [liquid, gas] = body.terms;
      expect(body.uncertainty).toBeCloseTo(Math.hypot(liquid.uncertainty, gas.uncertainty), 12);
      expect(body.uncertaintyBasis).toBe(liquid.uncertaintyBasis);
    });

    it('accepts latest and the version label alike', async () => {
      const a = await post({ equation: COMBUSTION, release: 'latest' }).expect(200);
      const b = await post({ equation: COMBUSTION, release: '2026.1' }).expect(200);
      expect(a.body).toEqual(b.body);
    });

    it('answers in kcal/mol and J/mol, every energy converted', async () => {
      const kj = (await post({ equation: 'H2O(l) -> H2O(g)' })).body;
      const kcal = (await post({ equation: 'H2O(l) -> H2O(g)', unit: 'kcal/mol' })).body;
      const j = (await post({ equation: 'H2O(l) -> H2O(g)', unit: 'J/mol' })).body;
      expect(kcal.unit).toBe('kcal/mol');
      expect(kcal.deltaH).toBeCloseTo(kj.deltaH / 4.184, 12);
      expect(kcal.uncertainty).toBeCloseTo(kj.uncertainty / 4.184, 12);
      expect(kcal.terms[1].deltaFH).toBeCloseTo(kj.terms[1].deltaFH / 4.184, 12);
      expect(j.deltaH).toBeCloseTo(kj.deltaH * 1000, 6);
    });

    it('GET with query parameters answers exactly as POST', async () => {
      for (const [equation, extra] of [
        [COMBUSTION, {}],
        ['CaCO3(s) -> CaO(s) + CO2(g)', { unit: 'kcal/mol', release: '2026.1' }],
        ['CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)', { temperatureK: 1000 }],
      ] as const) {
        const p = await post({ equation, ...extra }).expect(200);
        const g = await get({
          equation,
          ...Object.fromEntries(Object.entries(extra).map(([k, v]) => [k, String(v)])),
        }).expect(200);
        expect(g.body).toEqual(p.body);
      }
    });
  });

  it('answers from the database exactly as from the starter data files', async () => {
    // The published-value checks (tests/reference/reactions-published.test.ts) run on the files;
    // this proves release 2026.1 as stored gives the very same numbers.
    const files = starterSnapshot();
    for (const [equation, temperatureK] of [
      ['CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)', 298.15],
      ['C8H18(l) + 25/2 O2(g) -> 8 CO2(g) + 9 H2O(l)', 298.15],
      ['CaCO3(cr,calcite) -> CaO(cr) + CO2(g)', 298.15],
      ['4 NH3(g) + 5 O2(g) -> 4 NO(g) + 6 H2O(g)', 298.15],
      ['C(cr,graphite) -> C(cr,diamond)', 298.15],
      ['Na+(aq) + Cl-(aq) -> NaCl(cr)', 298.15],
      ['CO2(g) + 4 H2(g) -> CH4(g) + 2 H2O(g)', 1000],
      ['H2O(l) -> H2O(g)', 373.15],
    ] as const) {
      const { body } = await post({ equation, temperatureK }).expect(200);
      const expected = computeReaction(files, { equation, temperatureK, unit: 'kJ/mol' });
      expect([equation, body.deltaH, body.uncertainty]).toEqual([
        equation,
        expected.deltaH,
        expected.uncertainty,
      ]);
    }
  });

  describe("Hess's law through the API", () => {
    it('reversed equation → exactly −ΔH; doubled → exactly 2ΔH', async () => {
      const forward = (await post({ equation: 'N2(g) + 3 H2(g) -> 2 NH3(g)' })).body.deltaH;
      const reversed = (await post({ equation: '2 NH3(g) -> N2(g) + 3 H2(g)' })).body.deltaH;
      const doubled = (await post({ equation: '2 N2(g) + 6 H2(g) -> 4 NH3(g)' })).body.deltaH;
      expect(reversed).toBe(-forward);
      expect(doubled).toBe(2 * forward);
    });

    it('holds the laws at 1000 K and in kcal/mol too', async () => {
      const q = { temperatureK: 1000, unit: 'kcal/mol' };
      const f = (await post({ equation: COMBUSTION.replace('H2O(l)', 'H2O(g)'), ...q })).body;
      const r = (await post({ equation: 'CO2(g) + 2 H2O(g) -> CH4(g) + 2 O2(g)', ...q })).body;
      expect(r.deltaH).toBe(-f.deltaH);
    });
  });

  describe('species resolution', () => {
    it('refuses C4H10(g) while the release holds two isomers, naming both', async () => {
      const res = await post({ equation: 'C4H10(g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)' }).expect(
        422,
      );
      expect(res.body.error.code).toBe('ambiguous_species');
      expect(res.body.error.candidates.map((c: { write: string }) => c.write).sort()).toEqual([
        '[2-methylpropane](g)',
        '[butane](g)',
      ]);
    });

    it('takes an isomer by its registry key', async () => {
      const { body } = await post({
        equation: '[2-methylpropane](g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)',
      }).expect(200);
      expect(body.equation).toMatch(/^\[2-methylpropane\]\(g\)/);
      expect(body.terms[0]).toMatchObject({ species: '2-methylpropane', formula: 'C4H10' });
    });

    it('lists every assumption: s as cr, an unwritten modification and phase', async () => {
      const { body } = await post({ equation: 'CaCO3(s) -> CaO + CO2(g)' }).expect(200);
      expect(
        body.terms.map((x: { phase: string; modification: string | null }) => [
          x.phase,
          x.modification,
        ]),
      ).toEqual([
        ['cr', 'calcite'],
        ['cr', null],
        ['g', null],
      ]);
      expect(body.assumptions.filter((a: string) => !a.startsWith('no combined'))).toEqual([
        expect.stringMatching(/CaCO3\(s\).*read as cr/),
        expect.stringMatching(/modification calcite assumed/),
        expect.stringMatching(/^CaO: phase cr assumed/),
      ]);
    });
  });

  describe('away from 298.15 K', () => {
    it('adds each term’s enthalpy increment by Kirchhoff’s law', async () => {
      const { body } = await post({
        equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)',
        temperatureK: 1000,
      }).expect(200);
      expect(ReactionAnswer.strict().parse(body).temperatureK).toBe(1000);
      const sum = body.terms.reduce(
        (s: number, x: { coefficient: number; enthalpyIncrement: number }) =>
          s + x.coefficient * x.enthalpyIncrement,
        0,
      );
      expect(body.deltaH).toBeCloseTo(body.deltaH298 + sum, 9);
      for (const term of body.terms)
        expect(term.heatCapacity.revisionId).toEqual(expect.any(String));
    });

    it('adds ΔtrsH where a species crosses a transition', async () => {
      const { body } = await post({ equation: 'H2O(l) -> H2O(g)', temperatureK: 400 }).expect(200);
      expect(body.terms[0].transitions).toEqual([
        expect.objectContaining({ temperature: 373.15, phase: 'g' }),
      ]);
      expect(body.terms[1].transitions).toEqual([]);
    });
  });

  describe('errors', () => {
    const error = (res: request.Response, status: number, code: string) => {
      expect(res.status).toBe(status);
      expect(res.body.error).toMatchObject({ code, message: expect.any(String) });
      expect(res.headers['cache-control']).toBe('no-store');
      return res.body.error;
    };

    it('400 parse_error with the position', async () => {
      const e = error(
        await post({ equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(x)' }),
        400,
        'parse_error',
      );
      expect(e.position).toEqual(expect.any(Number));
    });

    it('422 unbalanced with the imbalance and a balanced suggestion', async () => {
      const e = error(
        await post({ equation: 'CH4(g) + O2(g) -> CO2(g) + H2O(l)' }),
        422,
        'unbalanced',
      );
      expect(e.imbalance).toEqual({ H: -2, O: 1 });
      expect(e.suggestion).toBe(COMBUSTION);
    });

    it('422 unknown_species with what is missing and near matches', async () => {
      const e = error(
        await post({ equation: '[methan](g) + 2 O2(g) -> CO2(g) + 2 H2O(l)' }),
        422,
        'unknown_species',
      );
      expect(e.missing).toEqual(['[methan](g)']);
      expect(e.suggestions.map((s: { species: string }) => s.species)).toContain('methane');
    });

    it('422 missing_data naming the species', async () => {
      const e = error(
        await post({ equation: 'C2H2(g) + 2 H2(g) -> C2H6(g)', temperatureK: 500 }),
        422,
        'missing_data',
      );
      expect(e.missing).toEqual(['C2H2(g)']);
      expect(e.message).toMatch(/C2H2\(g\).*heat-capacity/);
    });

    it('422 out_of_range past the data', async () => {
      const e = error(
        await post({ equation: COMBUSTION.replace('H2O(l)', 'H2O(g)'), temperatureK: 8000 }),
        422,
        'out_of_range',
      );
      expect(e.message).toMatch(/K/);
    });

    it('404 unknown_release', async () => {
      const e = error(
        await post({ equation: COMBUSTION, release: '1999.1' }),
        404,
        'unknown_release',
      );
      expect(e.release).toBe('1999.1');
      error(await get({ equation: COMBUSTION, release: '1999.1' }), 404, 'unknown_release');
    });

    it('413 over 10 kB, by body or by URL', async () => {
      const long = `${'H2(g) + '.repeat(1400)}O2(g) -> H2O(l)`;
      error(await post({ equation: long }), 413, 'payload_too_large');
      // Plain letters keep the URL between 10 kB and the server's header limit.
      error(await get({ equation: 'x'.repeat(10_500) }), 413, 'payload_too_large');
    });

    it('400 validation_error for a bad unit, temperature or unknown field', async () => {
      error(await post({ equation: COMBUSTION, unit: 'BTU' }), 400, 'validation_error');
      error(await post({ equation: COMBUSTION, temperatureK: -5 }), 400, 'validation_error');
      error(await post({ equation: COMBUSTION, extra: 1 }), 400, 'validation_error');
      error(await get({ equation: COMBUSTION, temperatureK: 'hot' }), 400, 'validation_error');
      error(await post({}), 400, 'validation_error');
    });
  });

  describe('caching', () => {
    it('answers a named release with an ETag and a long Cache-Control; 304 when unchanged', async () => {
      const first = await get({ equation: COMBUSTION, release: '2026.1' }).expect(200);
      expect(first.headers['cache-control']).toMatch(/max-age=31536000/);
      const etag = first.headers['etag'];
      expect(etag).toEqual(expect.any(String));
      await request(t.app)
        .get(URL)
        .query({ equation: COMBUSTION, release: '2026.1' })
        .set('If-None-Match', etag)
        .expect(304);
      const other = await get({ equation: COMBUSTION, release: '2026.1', unit: 'J/mol' });
      expect(other.headers['etag']).not.toBe(etag);
    });

    it('keeps answers for latest briefly', async () => {
      const res = await get({ equation: COMBUSTION }).expect(200);
      expect(res.headers['cache-control']).toMatch(/max-age=60\b/);
    });
  });

  describe('POST /api/v1/reaction-enthalpy/batch', () => {
    it('answers every item in order, an error for each failing one', async () => {
      const res = await request(t.app)
        .post(`${URL}/batch`)
        .send({
          unit: 'kcal/mol',
          reactions: [
            { id: 'combustion', equation: COMBUSTION },
            { id: 'typo', equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(x)' },
            { equation: 'C4H10(g) -> 2 C2H4(g) + H2(g)' },
            { id: 42, equation: 'H2O(l) -> H2O(g)', temperatureK: 350 },
          ],
        })
        .expect(200);
      const body = BatchAnswer.parse(res.body);
      expect(body).toMatchObject({ release: '2026.1', unit: 'kcal/mol', count: 4, errors: 2 });
      expect(body.results.map((r) => [r.index, r.id, 'error' in r ? r.error.code : 'ok'])).toEqual([
        [0, 'combustion', 'ok'],
        [1, 'typo', 'parse_error'],
        [2, null, 'ambiguous_species'],
        [3, 42, 'ok'],
      ]);
      expect(body.results[1]).toMatchObject({ error: { status: 400 } });
      const single = await post({
        equation: 'H2O(l) -> H2O(g)',
        temperatureK: 350,
        unit: 'kcal/mol',
      });
      expect(body.results[3]).toMatchObject({
        deltaH: single.body.deltaH,
        terms: single.body.terms,
      });
    });

    it('takes 10,000 reactions and refuses more', async () => {
      const reactions = Array.from({ length: 10_000 }, (_, i) => ({
        id: i,
        equation: i % 2 ? 'H2(g) + 1/2 O2(g) -> H2O(l)' : 'N2(g) + 3 H2(g) -> 2 NH3(g)',
      }));
      const ok = await request(t.app).post(`${URL}/batch`).send({ reactions }).expect(200);
      expect(ok.body.count).toBe(10_000);
      expect(ok.body.results[9_999].id).toBe(9_999);
      const more = [...reactions, { id: 10_000, equation: COMBUSTION }];
      const res = await request(t.app).post(`${URL}/batch`).send({ reactions: more }).expect(400);
      expect(res.body.error.code).toBe('validation_error');
    }, 60_000);

    it('404 for an unknown release', async () => {
      const res = await request(t.app)
        .post(`${URL}/batch`)
        .send({ release: '1999.1', reactions: [{ equation: COMBUSTION }] })
        .expect(404);
      expect(res.body.error.code).toBe('unknown_release');
    });
  });
});

describe('anonymous use is rate-limited', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ API_RATE_LIMIT: '3' });
  });
  afterAll(() => t.close());

  it('answers 429 with Retry-After past the limit', async () => {
    for (let i = 0; i < 3; i++)
      await request(t.app).get(URL).query({ equation: COMBUSTION }).expect(200);
    const res = await request(t.app).get(URL).query({ equation: COMBUSTION }).expect(429);
    expect(res.body.error.code).toBe('rate_limited');
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
  });
});
