import request from 'supertest';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * Answers of the calculation routes a person or a program must be able to act on: numbers in the
 * unit asked for, fields named by path, steps counted from 1 in messages, no silent reading.
 * Scenario values: the Kestrel Process Works data team's CO and CO2 formation steps (CODATA Key
 * Values, Cox, Wagman & Medvedev 1989: CO2(g) −393.51, CO(g) −110.53 kJ/mol) with one deliberately
 * inconsistent third step.
 */
describe('calculation answers and their messages', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const solve = (body: unknown) =>
    request(t.app)
      .post('/api/v1/hess/solve')
      .send(body as object);
  const parse = (equation: string) =>
    request(t.app).post('/api/v1/equations/parse').send({ equation });

  describe('units', () => {
    it("states a not_unique error's energies in the requested unit and names it", async () => {
      const res = await solve({
        unit: 'kJ/mol',
        target: 'C(cr) + O2(g) -> CO2(g)',
        steps: [
          { equation: 'C(cr) + O2(g) -> CO2(g)', deltaH: -393.51 },
          { equation: 'C(cr) + 1/2 O2(g) -> CO(g)', deltaH: -110.53 },
          { equation: 'CO(g) + 1/2 O2(g) -> CO2(g)', deltaH: -290.0 },
        ],
      }).expect(422);
      const e = res.body.error;
      expect(e.code).toBe('not_unique');
      expect(e.unit).toBe('kJ/mol');
      // The cycle −1×step 1 + step 2 + step 3 closes at 393.51 − 110.53 − 290 = −7.02 kJ/mol.
      expect(e.cycleDeltaH).toBeCloseTo(-7.02, 9);
      expect(e.deltaHs[0] - e.deltaHs[1]).toBeCloseTo(-7.02, 9);
      expect(e.message).toContain('-7.02 kJ/mol');
      expect(e.message).not.toMatch(/\d J\/mol/);
      expect(e.combination).toContain('(step 1)');
    });
  });

  describe('uncertainty combination', () => {
    it('combines ±1e-200 twice to ±1.414e-200 (no underflow)', async () => {
      const res = await solve({
        unit: 'J/mol',
        target: 'H2O(l) -> H2O(g)',
        steps: [
          { equation: 'H2O(l) -> H2O(cr)', deltaH: -6010, uncertainty: 1e-200 },
          { equation: 'H2O(cr) -> H2O(g)', deltaH: 50900, uncertainty: 1e-200 },
        ],
      }).expect(200);
      expect(res.body.uncertainty / 1e-200).toBeCloseTo(Math.SQRT2, 12);
    });

    it('carries ±1.7e308 J/mol through, and refuses it in kJ/mol naming the field', async () => {
      const step = { equation: 'H2O(l) -> H2O(g)', deltaH: 44, uncertainty: 1.7e308 };
      const ok = await solve({ unit: 'J/mol', target: 'H2O(l) -> H2O(g)', steps: [step] });
      expect(ok.status).toBe(200);
      expect(ok.body.uncertainty).toBe(1.7e308);
      const res = await solve({ unit: 'kJ/mol', target: 'H2O(l) -> H2O(g)', steps: [step] });
      expect(res.status).toBe(400);
      expect(res.body.error).toMatchObject({ field: 'steps[0].uncertainty', index: 0 });
      expect(res.body.error.message).toMatch(/^step 1 uncertainty: .*too large/);
    });

    it('refuses a combination whose total overflows instead of answering null', async () => {
      const res = await solve({
        unit: 'J/mol',
        target: 'H2O(l) -> H2O(g)',
        steps: [
          { equation: 'H2O(l) -> H2O(cr)', deltaH: 1, uncertainty: 1.7e308 },
          { equation: 'H2O(cr) -> H2O(g)', deltaH: 1, uncertainty: 1.7e308 },
        ],
      }).expect(422);
      expect(res.body.error).toMatchObject({ code: 'out_of_range', unit: 'J/mol' });
    });
  });

  describe('numbers in requests', () => {
    const target = 'H2O(l) -> H2O(g)';

    it.each(['−283,5', '-283,5', '−283', '44'])(
      'refuses the text %p as ΔH with a message naming the field',
      async (text) => {
        const res = await solve({ target, steps: [{ equation: target, deltaH: text }] }).expect(
          400,
        );
        expect(res.body.error).toMatchObject({
          code: 'validation_error',
          field: 'steps[0].deltaH',
        });
        expect(res.body.error.message).toContain('steps[0].deltaH');
        expect(res.body.error.message).toContain('step 1');
        expect(res.body.error.message).toMatch(/JSON number .*not text/);
      },
    );

    it('says that 1e309 is too large, not "expected number, received number"', async () => {
      const res = await request(t.app)
        .post('/api/v1/hess/solve')
        .set('Content-Type', 'application/json')
        .send(`{"target":"${target}","steps":[{"equation":"${target}","deltaH":1e309}]}`)
        .expect(400);
      expect(res.body.error.field).toBe('steps[0].deltaH');
      expect(res.body.error.message).toMatch(/too large/);
      expect(res.body.error.message).not.toMatch(/received number/);
    });

    it('answers a latin-1 body with 415 and a code of its own', async () => {
      const res = await request(t.app)
        .post('/api/v1/equations/parse')
        .set('Content-Type', 'application/json; charset=latin1')
        .send(Buffer.from('{"equation":"H2(g) -> H2(g)"}', 'latin1'))
        .expect(415);
      expect(res.body.error.code).toBe('unsupported_charset');
      expect(res.body.error.message).toMatch(/UTF-8/);
    });
  });

  describe('steps and positions', () => {
    it('needs a phase on every term and names the step (from 1), the field and the term', async () => {
      const res = await solve({
        target: 'H2(g) + 1/2 O2(g) -> H2O(l)',
        steps: [
          { equation: 'H2(g) + 1/2 O2(g) -> H2O(g)', deltaH: -241.826 },
          { equation: 'H2O(l) -> H2O', deltaH: 44.0 },
        ],
      }).expect(422);
      expect(res.body.error).toMatchObject({
        code: 'missing_phase',
        field: 'steps[1].equation',
        index: 1,
        term: 'H2O',
      });
      expect(res.body.error.message).toMatch(/^step 2 equation: H2O has no phase/);
      const target = await solve({
        target: 'H2 + 1/2 O2(g) -> H2O(l)',
        steps: [{ equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', deltaH: -285.83 }],
      }).expect(422);
      expect(target.body.error).toMatchObject({ field: 'target', term: 'H2' });
    });

    it('states a parse error position once, from 1, and keeps the 0-based position', async () => {
      const res = await solve({
        target: 'H2O(l) -> H2O(g)',
        steps: [
          { equation: 'H2O(l) -> H2O(g)', deltaH: 44 },
          { equation: 'H2O(l) H2O(g)', deltaH: 44 },
        ],
      }).expect(400);
      const e = res.body.error;
      expect(e).toMatchObject({ code: 'parse_error', field: 'steps[1].equation', index: 1 });
      expect(e.position).toBe(7); // 0-based index of the second "H"
      expect(e.message).toMatch(/^step 2 equation: .* at character 8$/);
      expect(e.message.match(/character|position/g)).toHaveLength(1);
    });

    it('numbers an unbalanced step from 1 in its message', async () => {
      const res = await solve({
        target: 'H2(g) + 1/2 O2(g) -> H2O(l)',
        steps: [{ equation: 'H2(g) + O2(g) -> H2O(l)', deltaH: -285.83 }],
      }).expect(422);
      expect(res.body.error).toMatchObject({ code: 'unbalanced', step: 0, index: 0 });
      expect(res.body.error.field).toBe('steps[0].equation');
      expect(res.body.error.message).toMatch(/^step 1: /);
    });

    it('says "unknown element symbol Xy" with a 4xx unknown_element', async () => {
      const res = await parse('Xy2(g) -> Xy2(l)');
      expect(res.status).toBeGreaterThanOrEqual(400);
      expect(res.status).toBeLessThan(500);
      expect(res.body.error.code).toBe('unknown_element');
      expect(res.body.error.message).toContain('unknown element symbol Xy');
      expect(res.body.error).toMatchObject({ field: 'equation', position: 0, symbol: 'Xy' });
    });
  });

  describe('notation', () => {
    it('prints our canonical notation and spells each phase out', async () => {
      const res = await parse(
        'C(cr,graphite) + CaCO3(cr,calcite) -> C(diamond) + CaCO3(cr)',
      ).expect(200);
      expect(res.body.normalized).toBe('C(graphite) + CaCO3(calcite) -> C(diamond) + CaCO3(cr)');
      expect(res.body.normalized).not.toContain('(cr,');
      expect(res.body.species.map((s: { phaseName: string }) => s.phaseName)).toEqual([
        'crystal, graphite',
        'crystal, calcite',
        'crystal, diamond',
        'crystal',
      ]);
      const more = await parse('H2O(l) + NH3(g) + SiO2(am) -> OH-(aq) + NH4+(aq) + SiO2(am)');
      expect(more.body.species.map((s: { phaseName: string }) => s.phaseName)).toEqual([
        'liquid',
        'gas',
        'aqueous',
        'aqueous',
      ]);
    });

    it('uses the canonical notation in the Hess answer too', async () => {
      // CODATA Key Values (Cox, Wagman & Medvedev 1989): CO2(g) −393.51 kJ/mol; diamond +1.895
      // kJ/mol above graphite (NBS tables, Wagman et al. 1982) — Kestrel's abrasive-feed check.
      const res = await solve({
        target: 'C(diamond) + O2(g) -> CO2(g)',
        steps: [
          { equation: 'C(cr,graphite) + O2(g) -> CO2(g)', deltaH: -393.51 },
          { equation: 'C(graphite) -> C(cr,diamond)', deltaH: 1.895 },
        ],
      }).expect(200);
      expect(res.body.target).toBe('C(diamond) + O2(g) -> CO2(g)');
      expect(res.body.steps.map((s: { equation: string }) => s.equation)).toEqual([
        'C(graphite) + O2(g) -> CO2(g)',
        'C(graphite) -> C(diamond)',
      ]);
      expect(res.body.deltaH).toBeCloseTo(-395.405, 9);
    });

    it('reads fractional hydrates and non-integer subscripts exactly', async () => {
      const gypsum = await parse('CaSO4·2H2O(cr) -> CaSO4·0.5H2O(cr) + 3/2 H2O(g)').expect(200);
      expect(gypsum.body).toMatchObject({ balanced: true, imbalance: {} });
      expect(gypsum.body.normalized).toBe('CaSO4·2H2O(cr) -> CaSO4·1/2H2O(cr) + 3/2 H2O(g)');
      const unbalanced = await parse('CaSO4·2H2O(cr) -> CaSO4·1/2H2O(cr) + H2O(g)').expect(200);
      expect(unbalanced.body.suggestion).toBe('2 CaSO4·2H2O(cr) -> 2 CaSO4·1/2H2O(cr) + 3 H2O(g)');
      const wustite = await parse('0.947 Fe(cr) + 1/2 O2(g) -> Fe0.947O(cr)').expect(200);
      expect(wustite.body).toMatchObject({ balanced: true });
      expect(wustite.body.species[0].coefficient).toBe('-947/1000');
    });

    it('keeps the documented reading of Fe2+ and adds a hint', async () => {
      const res = await parse('Fe2+(aq) -> Fe(cr)').expect(200);
      expect(res.body.species[0]).toMatchObject({ formula: 'Fe2+', coefficient: '-1' });
      expect(res.body.charge).toBe('-1');
      expect(res.body.hints).toEqual(['did you mean Fe^2+? Fe2+ reads as Fe2 with charge +1']);
      const plain = await parse('Fe^2+(aq) -> Fe(cr)').expect(200);
      expect(plain.body.hints).toEqual([]);
    });

    it('says that phases are written in lower case instead of "unknown element G"', async () => {
      const res = await parse('H2O(G) -> H2O(l)').expect(400);
      expect(res.body.error).toMatchObject({ code: 'parse_error', position: 3 });
      expect(res.body.error.message).toContain('phases are written in lower case');
      expect(res.body.error.message).not.toMatch(/unknown element/);
    });

    it('treats leading zeros alike in coefficients (01 H2) and counts (H01)', async () => {
      const coefficient = await parse('01 H2(g) -> H2(g)').expect(400);
      const count = await parse('H01(g) -> H(g)').expect(400);
      expect(coefficient.body.error.message).toMatch(/without leading zeros/);
      expect(count.body.error.message).toMatch(/without leading zeros/);
    });
  });
});
