import fc from 'fast-check';
import { reverseEquation, scaleEquation } from '../equation/equation-builder';
import { parseEquation } from '../equation/equation-parser';
import { solveHess, type HessStep } from './hess';
import { frac } from '../rational/rational';
import { thermoFailure } from '../testing/expect-thermo-error';

const kJ = 1000;
// Formation reactions with CODATA Key Values (Cox, Wagman, Medvedev 1989), kJ/mol.
const CO2_FORMATION: HessStep = {
  equation: 'C(cr,graphite) + O2(g) -> CO2(g)',
  deltaH: -393.51 * kJ,
  uncertainty: 0.13 * kJ,
};
const CO_FORMATION: HessStep = {
  equation: 'C(cr,graphite) + 1/2 O2(g) -> CO(g)',
  deltaH: -110.53 * kJ,
  uncertainty: 0.17 * kJ,
};
const WATER_L: HessStep = {
  equation: 'H2(g) + 1/2 O2(g) -> H2O(l)',
  deltaH: -285.83 * kJ,
  uncertainty: 0.04 * kJ,
};
const WATER_G: HessStep = {
  equation: 'H2(g) + 1/2 O2(g) -> H2O(g)',
  deltaH: -241.826 * kJ,
  uncertainty: 0.04 * kJ,
};

const failure = thermoFailure;

describe('solveHess', () => {
  it('combines steps with exact multipliers and reports each step', () => {
    const r = solveHess('CO(g) + 1/2 O2(g) -> CO2(g)', [CO2_FORMATION, CO_FORMATION]);
    expect(r.multipliers.map((m) => m.toFraction())).toEqual(['1', '-1']);
    expect(r.deltaH).toBeCloseTo((-393.51 + 110.53) * kJ, 6);
    expect(r.steps[1]).toMatchObject({ index: 1, flipped: true, deltaH: 110.53 * kJ });
    expect(r.steps[1]?.scale.toFraction()).toBe('1');
    expect(r.steps[0]?.flipped).toBe(false);
    expect(r.unused).toEqual([]);
    expect(r.alternativeSolutions).toBe(false);
    expect(r.uncertainty).toBeCloseTo(Math.sqrt(0.13 ** 2 + 0.17 ** 2) * kJ, 9);
  });

  it('scales steps by fractions', () => {
    const r = solveHess('2 H2O(l) -> 2 H2(g) + O2(g)', [WATER_L]);
    expect(r.multipliers[0]?.toFraction()).toBe('-2');
    expect(r.steps[0]).toMatchObject({ flipped: true, deltaH: 2 * 285.83 * kJ });
    expect(r.steps[0]?.scale.toFraction()).toBe('2');
    expect(r.uncertainty).toBeCloseTo(0.08 * kJ, 9);
  });

  it('treats phases as different columns: H2O(l) and H2O(g)', () => {
    const vaporization = solveHess('H2O(l) -> H2O(g)', [WATER_L, WATER_G]);
    expect(vaporization.deltaH).toBeCloseTo(44.004 * kJ, 6);
    const err = failure(() => solveHess('H2(g) + 1/2 O2(g) -> H2O(g)', [WATER_L]));
    expect(err.code).toBe('no_combination');
    expect(err.details['unmatched']).toEqual(['H2O(g)']);
    expect(err.message).toContain('no step contains H2O(g)');
  });

  it('treats modifications as different columns', () => {
    const err = failure(() => solveHess('C(cr,diamond) + O2(g) -> CO2(g)', [CO2_FORMATION]));
    expect(err.details['unmatched']).toEqual(['C(diamond)']);
  });

  it('lists unused steps', () => {
    const r = solveHess('CO(g) + 1/2 O2(g) -> CO2(g)', [
      WATER_L,
      CO2_FORMATION,
      WATER_G,
      CO_FORMATION,
    ]);
    expect(r.unused).toEqual([0, 2]);
    expect(r.steps[0]?.multiplier.toFraction()).toBe('0');
    expect(r.steps[0]?.deltaH).toBe(0);
  });

  it('names the species the steps cannot match together', () => {
    // Every species of the target appears in some step, but the steps lack C + O2 -> CO2, so
    // the water-gas shift cannot be assembled. ΔH values: arithmetic on CODATA 1989.
    const steps: HessStep[] = [
      { equation: 'CO(g) + 1/2 O2(g) -> CO2(g)', deltaH: (-393.51 + 110.53) * kJ },
      WATER_L,
      { equation: 'C(cr,graphite) + H2O(g) -> CO(g) + H2(g)', deltaH: (-110.53 + 241.826) * kJ },
    ];
    const err = failure(() => solveHess('CO(g) + H2O(g) -> CO2(g) + H2(g)', steps));
    expect(err.code).toBe('no_combination');
    expect(err.details['unmatched']).toEqual([]);
    const conflicting = err.details['conflicting'] as string[];
    expect(conflicting.length).toBeGreaterThan(0);
    expect(err.message).toContain(`no combination of the steps matches ${conflicting.join(', ')}`);
  });

  it('refuses unbalanced steps and targets, naming the step', () => {
    const err = failure(() =>
      solveHess('CO(g) + 1/2 O2(g) -> CO2(g)', [
        CO2_FORMATION,
        { equation: 'C(cr,graphite) + O2(g) -> CO(g)', deltaH: 1 },
      ]),
    );
    expect(err.code).toBe('unbalanced');
    expect(err.details).toMatchObject({ step: 1, imbalance: { O: '-1' } });
    expect(
      failure(() => solveHess('CO(g) + O2(g) -> CO2(g)', [CO2_FORMATION])).details,
    ).toMatchObject({ target: true });
    const lenient = solveHess(
      'CO(g) + O2(g) -> CO2(g) + O(g)',
      [
        CO2_FORMATION,
        CO_FORMATION,
        {
          equation: 'O2(g) -> 2 O(g)',
          deltaH: 1 * kJ /* fictional: only the multipliers matter */,
        },
      ],
      {
        requireBalanced: false,
      },
    );
    expect(lenient.multipliers.map((m) => m.toFraction())).toEqual(['1', '-1', '1/2']);
  });

  describe('when several multiplier sets reach the target', () => {
    // CO(g) + 1/2 O2(g) -> CO2(g) closes a cycle with the two formation steps.
    const consistent: HessStep = {
      equation: 'CO(g) + 1/2 O2(g) -> CO2(g)',
      deltaH: (-393.51 + 110.53) * kJ,
      uncertainty: null,
    };
    // Fictional value (not a measurement): 3 kJ/mol off, to make the cycle fail to close.
    const fictional: HessStep = { equation: 'CO(g) + 1/2 O2(g) -> CO2(g)', deltaH: -280 * kJ };

    it('returns the solution on the earliest steps when ΔH is the same for all', () => {
      const r = solveHess('C(cr,graphite) + O2(g) -> CO2(g)', [
        CO2_FORMATION,
        CO_FORMATION,
        consistent,
      ]);
      expect(r.alternativeSolutions).toBe(true);
      expect(r.multipliers.map((m) => m.toFraction())).toEqual(['1', '0', '0']);
      expect(r.deltaH).toBe(-393.51 * kJ);
      expect(r.uncertainty).toBeCloseTo(0.13 * kJ, 9);
    });

    it('fails with not_unique when the steps disagree, showing the cycle and its ΔH', () => {
      const err = failure(() =>
        solveHess('C(cr,graphite) + O2(g) -> CO2(g)', [CO2_FORMATION, CO_FORMATION, fictional]),
      );
      expect(err.code).toBe('not_unique');
      expect(err.details['combination']).toBe('−1×(step 1) + 1×(step 2) + 1×(step 3)');
      expect(err.details['cycleDeltaH']).toBeCloseTo((393.51 - 110.53 - 280) * kJ, 6);
      expect(err.details['reaction']).toBe('C(graphite) + O2(g) -> CO2(g)');
      expect(err.message).toContain('inconsistent');
    });

    it('states the cycle in the unit asked for, and names it', () => {
      const err = failure(() =>
        solveHess('C(cr,graphite) + O2(g) -> CO2(g)', [CO2_FORMATION, CO_FORMATION, fictional], {
          unit: 'kJ/mol',
        }),
      );
      const cycle = 393.51 - 110.53 - 280;
      expect(err.details['unit']).toBe('kJ/mol');
      expect(err.details['cycleDeltaH']).toBeCloseTo(cycle, 9);
      const [one, other] = err.details['deltaHs'] as [number, number];
      expect(one - other).toBeCloseTo(cycle, 9);
      expect(Math.abs(one)).toBeLessThan(1000);
      expect(err.message).toContain(`ΔH = ${Number(cycle.toPrecision(12))} kJ/mol instead of 0`);
      expect(err.message).not.toMatch(/\d J\/mol/);
    });

    it('accepts a cycle inside a stated tolerance', () => {
      const r = solveHess(
        'C(cr,graphite) + O2(g) -> CO2(g)',
        [CO2_FORMATION, CO_FORMATION, fictional],
        { cycleTolerance: 5 * kJ },
      );
      expect(r.alternativeSolutions).toBe(true);
    });
  });

  it('has no uncertainty when a used step lacks one', () => {
    const r = solveHess('CO(g) + 1/2 O2(g) -> CO2(g)', [
      CO2_FORMATION,
      { ...CO_FORMATION, uncertainty: null },
      { ...WATER_L, uncertainty: null },
    ]);
    expect(r.uncertainty).toBeNull();
    const unusedOnly = solveHess('CO(g) + 1/2 O2(g) -> CO2(g)', [
      CO2_FORMATION,
      CO_FORMATION,
      { ...WATER_L, uncertainty: null },
    ]);
    expect(unusedOnly.uncertainty).not.toBeNull();
  });

  it('combines uncertainties without underflow or overflow', () => {
    const tiny = solveHess('H2O(l) -> H2O(g)', [
      { equation: 'H2O(l) -> H2O(cr)', deltaH: 1, uncertainty: 1e-200 },
      { equation: 'H2O(cr) -> H2O(g)', deltaH: 1, uncertainty: 1e-200 },
    ]);
    expect(tiny.uncertainty).toBeCloseTo(Math.SQRT2 * 1e-200, 210);
    expect(tiny.uncertainty! / 1e-200).toBeCloseTo(Math.SQRT2, 12);
    const huge = solveHess('H2O(l) -> H2O(g)', [
      { equation: 'H2O(l) -> H2O(g)', deltaH: 1, uncertainty: 1.7e308 },
    ]);
    expect(huge.uncertainty).toBe(1.7e308);
    const err = failure(() =>
      solveHess('H2O(l) -> H2O(g)', [
        { equation: 'H2O(l) -> H2O(cr)', deltaH: 1, uncertainty: 1.7e308 },
        { equation: 'H2O(cr) -> H2O(g)', deltaH: 1, uncertainty: 1.7e308 },
      ]),
    );
    expect(err.code).toBe('out_of_range');
    expect(err.message).toMatch(/uncertainty .* too large/);
    const sum = failure(() =>
      solveHess('H2O(l) -> H2O(g)', [
        { equation: 'H2O(l) -> H2O(cr)', deltaH: 1.7e308 },
        { equation: 'H2O(cr) -> H2O(g)', deltaH: 1.7e308 },
      ]),
    );
    expect(sum.code).toBe('out_of_range');
  });

  it('reports bad steps with their index', () => {
    const err = failure(() =>
      solveHess('H2O(l) -> H2O(g)', [WATER_L, { equation: 'H2(g) + O2(g) H2O(g)', deltaH: 1 }]),
    );
    expect(err.code).toBe('parse_error');
    expect(err.details['step']).toBe(1);
    expect(err.message).toMatch(/^step 2: /);
    expect(
      failure(() => solveHess('H2O(l) -> H2O(g)', [{ ...WATER_L, deltaH: Number.NaN }])).code,
    ).toBe('invalid_input');
    expect(
      failure(() => solveHess('H2O(l) -> H2O(g)', [{ ...WATER_L, uncertainty: -1 }])).code,
    ).toBe('invalid_input');
    expect(failure(() => solveHess('H2O(l) -> H2O(g)', [])).code).toBe('no_combination');
  });

  describe('properties', () => {
    const targets = [
      'CO(g) + 1/2 O2(g) -> CO2(g)',
      'H2O(l) -> H2O(g)',
      'CO(g) + H2O(g) -> CO2(g) + H2(g)',
      'C(cr,graphite) + H2O(l) -> CO(g) + H2(g)',
    ];
    const steps = (values: number[]): HessStep[] =>
      [CO2_FORMATION, CO_FORMATION, WATER_L, WATER_G].map((s, i) => ({
        ...s,
        deltaH: values[i] as number,
      }));
    const wholeValues = fc.array(fc.integer({ min: -1e6, max: 1e6 }), {
      minLength: 4,
      maxLength: 4,
    });

    it('flipping the target negates ΔH and every multiplier exactly', () => {
      fc.assert(
        fc.property(
          fc.constantFrom(...targets),
          fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 4, maxLength: 4 }),
          (text, values) => {
            const target = parseEquation(text);
            const a = solveHess(target, steps(values));
            const b = solveHess(reverseEquation(target), steps(values));
            // === rather than toBe: a zero ΔH is +0 both ways, and -(+0) is -0.
            expect(b.deltaH === -a.deltaH).toBe(true);
            expect(b.multipliers.map((m) => m.toFraction())).toEqual(
              a.multipliers.map((m) => m.neg().toFraction()),
            );
          },
        ),
      );
    });

    it('scaling the target by k scales the multipliers and ΔH by k exactly', () => {
      fc.assert(
        fc.property(
          fc.constantFrom(...targets),
          wholeValues,
          fc.integer({ min: 1, max: 40 }),
          (text, values, k) => {
            const target = parseEquation(text);
            const a = solveHess(target, steps(values));
            const b = solveHess(scaleEquation(target, frac(2 * k)), steps(values));
            expect(b.multipliers.map((m) => m.toFraction())).toEqual(
              a.multipliers.map((m) => m.mul(2 * k).toFraction()),
            );
            expect(b.deltaH).toBe(2 * k * a.deltaH);
          },
        ),
      );
    });
  });
});
