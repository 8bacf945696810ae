import request from 'supertest';
import { HessAnswer, ParseAnswer } from '../../server/src/modules/calculate/calculate-schemas';
import { createTestApp, signIn, type TestApp } from '../support/test-app';

describe('public calculation routes', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const parse = (equation: string) =>
    request(t.app).post('/api/v1/equations/parse').send({ equation });
  const solve = (body: object) => request(t.app).post('/api/v1/hess/solve').send(body);

  describe('response contracts', () => {
    it.each([
      'CH4(g) + 2O2(g) → CO2(g) + 2 H2O(l)',
      'C3H8(g) + O2(g) -> CO2(g) + H2O(l)',
      'Fe^3+(aq) -> Fe^2+(aq)',
      '[2-methylpropane](g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)',
      'C(cr,graphite) -> C(cr,diamond)',
    ])('the parse answer for %s satisfies its schema exactly', async (equation) => {
      const res = await parse(equation).expect(200);
      // strict(): a field the route sends but the contract lacks fails too.
      expect(() => ParseAnswer.strict().parse(res.body)).not.toThrow();
      for (const species of res.body.species)
        expect(() => ParseAnswer.shape.species.element.strict().parse(species)).not.toThrow();
    });

    it('the Hess answer satisfies its schema exactly, unused steps included', async () => {
      const res = await solve({
        target: 'CO(g) + H2O(g) -> CO2(g) + H2(g)',
        steps: [
          { equation: 'C(cr,graphite) + O2(g) -> CO2(g)', deltaH: -393.51, uncertainty: 0.13 },
          { equation: 'C(cr,graphite) + 1/2 O2(g) -> CO(g)', deltaH: -110.53 },
          { equation: 'H2(g) + 1/2 O2(g) -> H2O(g)', deltaH: -241.826 },
          { equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', deltaH: -285.83 },
        ],
      }).expect(200);
      const body = HessAnswer.strict().parse(res.body);
      for (const step of res.body.steps)
        expect(() => HessAnswer.shape.steps.element.strict().parse(step)).not.toThrow();
      expect(body.unused).toEqual([3]);
    });
  });

  describe('POST /api/v1/equations/parse', () => {
    it('normalises a balanced equation and lists its species, reactants negative', async () => {
      const res = await parse('CH4(g) + 2O2(g) → CO2(g) + 2 H2O(l)').expect(200);
      expect(res.body).toMatchObject({
        balanced: true,
        imbalance: {},
        charge: '0',
        suggestion: null,
      });
      expect(res.body.normalized).toBe('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)');
      expect(res.body.species).toEqual([
        expect.objectContaining({ formula: 'CH4', phase: 'g', coefficient: '-1' }),
        expect.objectContaining({ formula: 'O2', phase: 'g', coefficient: '-2' }),
        expect.objectContaining({ formula: 'CO2', phase: 'g', coefficient: '1' }),
        expect.objectContaining({ formula: 'H2O', phase: 'l', coefficient: '2' }),
      ]);
    });

    it('reports the imbalance per element and suggests balanced coefficients', async () => {
      const res = await parse('C3H8(g) + O2(g) -> CO2(g) + H2O(l)').expect(200);
      expect(res.body.balanced).toBe(false);
      // products minus reactants: C 1−3, H 2−8, O (2+1)−2
      // Exact numbers travel as text in lowest terms (the one wire format).
      expect(res.body.imbalance).toEqual({ C: '-2', H: '-6', O: '1' });
      expect(res.body.suggestion).toBe('C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)');
    });

    it('reports charge imbalance of ionic equations', async () => {
      const res = await parse('Na+(aq) + Cl-(aq) -> NaCl(cr)').expect(200);
      expect(res.body).toMatchObject({ balanced: true, charge: '0' });
      const off = await parse('Fe^3+(aq) -> Fe^2+(aq)').expect(200);
      expect(off.body.balanced).toBe(false);
      expect(off.body.charge).toBe('-1');
    });

    it('cannot judge the balance of a registry-key term and says which key', async () => {
      const equation = '[2-methylpropane](g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)';
      const res = await parse(equation).expect(200);
      expect(res.body).toMatchObject({
        balanced: null,
        suggestion: null,
        unknownComposition: ['2-methylpropane'],
      });
      expect(res.body.species[0]).toMatchObject({
        formula: '[2-methylpropane]',
        phase: 'g',
        coefficient: '-1',
      });
    });

    it('answers a syntax error with 400 parse_error and the position', async () => {
      const res = await parse('CH4(g) + 2 O2(g) CO2(g)').expect(400);
      expect(res.body.error).toMatchObject({
        code: 'parse_error',
        position: expect.any(Number),
        message: expect.any(String),
      });
    });

    it('refuses an unknown element with a clear error', async () => {
      const res = await parse('Xx2(g) -> Xx2(l)').expect(400);
      expect(['parse_error', 'unknown_element']).toContain(res.body.error.code);
      expect(res.body.error.message).toMatch(/Xx/);
    });

    it('validates the body and limits it to 10 kB', async () => {
      expect(
        (await request(t.app).post('/api/v1/equations/parse').send({ eq: 'x' }).expect(400)).body
          .error.code,
      ).toBe('validation_error');
      const big = await request(t.app)
        .post('/api/v1/equations/parse')
        .send({ equation: 'H2(g) -> H2(g)', pad: 'x'.repeat(11_000) })
        .expect(413);
      expect(big.body.error.code).toBe('payload_too_large');
    });
  });

  describe('POST /api/v1/hess/solve', () => {
    // OpenStax Chemistry 2e (CC BY 4.0), §5.3: ClF(g) + F2(g) → ClF3(g) from three steps, −104.5 kJ.
    const clf3 = {
      target: 'ClF(g) + F2(g) -> ClF3(g)',
      steps: [
        { equation: '2 OF2(g) -> O2(g) + 2 F2(g)', deltaH: -49.4 },
        { equation: '2 ClF(g) + O2(g) -> Cl2O(g) + OF2(g)', deltaH: 214.0 },
        { equation: 'ClF3(g) + O2(g) -> 1/2 Cl2O(g) + 3/2 OF2(g)', deltaH: 236.2 },
      ],
    };

    it('combines the steps with exact multipliers (open-textbook example)', async () => {
      const res = await solve(clf3).expect(200);
      expect(res.body.unit).toBe('kJ/mol');
      expect(res.body.deltaH).toBeCloseTo(-104.5, 9);
      expect(res.body.multipliers).toEqual(['-1/2', '1/2', '-1']);
      expect(res.body.unused).toEqual([]);
      expect(res.body.uncertainty).toBeNull();
      expect(res.body.steps).toEqual([
        expect.objectContaining({
          index: 0,
          multiplier: '-1/2',
          flipped: true,
          scale: '1/2',
          deltaH: expect.closeTo(24.7, 9),
        }),
        expect.objectContaining({
          index: 1,
          multiplier: '1/2',
          flipped: false,
          scale: '1/2',
          deltaH: expect.closeTo(107.0, 9),
        }),
        expect.objectContaining({
          index: 2,
          multiplier: '-1',
          flipped: true,
          scale: '1',
          deltaH: expect.closeTo(-236.2, 9),
        }),
      ]);
    });

    it('reports results in kcal/mol when the steps are given in kcal/mol', async () => {
      const kcal = {
        ...clf3,
        unit: 'kcal/mol',
        steps: clf3.steps.map((s) => ({ ...s, deltaH: s.deltaH / 4.184 })),
      };
      const res = await solve(kcal).expect(200);
      expect(res.body.unit).toBe('kcal/mol');
      expect(res.body.deltaH).toBeCloseTo(-104.5 / 4.184, 9);
    });

    // Scenario: the Kestrel data team checks a CO shift step from CODATA Key Values (1989):
    // ΔfH° CO(g) −110.53 ± 0.17, CO2(g) −393.51 ± 0.13, H2O(g) −241.826 ± 0.040 kJ/mol.
    it('propagates step uncertainties in quadrature and lists unused steps', async () => {
      const res = await solve({
        target: 'CO(g) + H2O(g) -> CO2(g) + H2(g)',
        steps: [
          { equation: 'C(cr,graphite) + O2(g) -> CO2(g)', deltaH: -393.51, uncertainty: 0.13 },
          { equation: 'C(cr,graphite) + 1/2 O2(g) -> CO(g)', deltaH: -110.53, uncertainty: 0.17 },
          { equation: 'H2(g) + 1/2 O2(g) -> H2O(g)', deltaH: -241.826, uncertainty: 0.04 },
          { equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', deltaH: -285.83, uncertainty: 0.04 },
        ],
      }).expect(200);
      // −393.51 − (−110.53) − (−241.826) = −41.154 kJ/mol
      expect(res.body.deltaH).toBeCloseTo(-41.154, 9);
      expect(res.body.uncertainty).toBeCloseTo(Math.sqrt(0.13 ** 2 + 0.17 ** 2 + 0.04 ** 2), 12);
      expect(res.body.unused).toEqual([3]);
    });

    it('answers 422 no_combination naming what cannot be matched', async () => {
      const res = await solve({
        target: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
        steps: [{ equation: 'C(cr,graphite) + O2(g) -> CO2(g)', deltaH: -393.51 }],
      }).expect(422);
      expect(res.body.error.code).toBe('no_combination');
      expect(res.body.error.message).toMatch(/CH4|H2O/);
    });

    it('answers 422 not_unique when two routes to the target disagree', async () => {
      const res = await solve({
        target: 'C(cr,graphite) + O2(g) -> CO2(g)',
        steps: [
          { equation: 'C(cr,graphite) + O2(g) -> CO2(g)', deltaH: -393.51 },
          { equation: 'C(cr,graphite) + 1/2 O2(g) -> CO(g)', deltaH: -110.53 },
          { equation: 'CO(g) + 1/2 O2(g) -> CO2(g)', deltaH: -290.0 },
        ],
      }).expect(422);
      expect(res.body.error.code).toBe('not_unique');
    });

    it('refuses an unbalanced step with 422 unbalanced and its imbalance', async () => {
      const res = await solve({
        target: 'H2(g) + 1/2 O2(g) -> H2O(l)',
        steps: [{ equation: 'H2(g) + O2(g) -> H2O(l)', deltaH: -285.83 }],
      }).expect(422);
      expect(res.body.error.code).toBe('unbalanced');
      // products minus reactants: O 1 − 2
      expect(res.body.error.imbalance).toEqual({ O: '-1' });
    });

    it('names the step whose equation does not parse', async () => {
      const res = await solve({
        target: 'H2(g) + 1/2 O2(g) -> H2O(l)',
        steps: [
          { equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', deltaH: -285.83 },
          { equation: 'H2O(l) ->', deltaH: 44 },
        ],
      }).expect(400);
      expect(res.body.error).toMatchObject({
        code: 'parse_error',
        field: 'steps[1].equation',
        position: expect.any(Number),
      });
    });

    it('validates the body', async () => {
      const res = await solve({ target: 'H2(g) -> H2(g)', steps: [], unit: 'eV' }).expect(400);
      expect(res.body.error.code).toBe('validation_error');
      expect(res.body.error.message).toMatch(/steps/);
      expect(res.body.error.message).toMatch(/unit/);
    });

    it('works for a signed-in user too (CSRF header sent as the client does)', async () => {
      const agent = request.agent(t.app);
      const xsrf = await signIn(agent, 'demo-reader');
      await agent.post('/api/v1/hess/solve').send(clf3).expect(403);
      await agent.post('/api/v1/hess/solve').set('X-XSRF-TOKEN', xsrf).send(clf3).expect(200);
    });
  });

  it('rate-limits the public routes with a JSON 429', async () => {
    const limited = await createTestApp({ API_RATE_LIMIT: '2' });
    try {
      const call = () =>
        request(limited.app)
          .post('/api/v1/equations/parse')
          .send({ equation: 'H2(g) + 1/2 O2(g) -> H2O(l)' });
      expect((await call()).status).toBe(200);
      expect((await call()).status).toBe(200);
      const res = await call();
      expect(res.status).toBe(429);
      expect(res.body.error.code).toBe('rate_limited');
    } finally {
      await limited.close();
    }
  });
});
