import type { Term } from '../equation/equation-types';
import type { ShomateModel } from './heat-capacity';
import { reactionEnthalpyAtT, type TemperatureValue } from './kirchhoff';
import { thermoFailure } from '../testing/expect-thermo-error';

// Constant heat capacities are illustrative (not measurements): they make every expected value
// a one-line sum. ΔfH° of water: CODATA Key Values (Cox, Wagman, Medvedev 1989); ΔvapH at
// 373.15 K: OpenStax Chemistry 2e App. E; ΔfusH at 273.15 K: Geankoplis App. A.2.
const cp = (A: number, tMin = 200, tMax = 3000): ShomateModel => ({
  kind: 'shomate',
  ranges: [{ tMin, tMax, A, B: 0, C: 0, D: 0, E: 0 }],
});
const kJ = 1000;

const DATA: Record<string, TemperatureValue> = {
  'H2(g)': { thermal: { model: cp(29) } },
  'O2(g)': { thermal: { model: cp(29.4) } },
  'H2O(g)': { value: -241.826 * kJ, uncertainty: 0.04 * kJ, thermal: { model: cp(33.6) } },
  // Liquid that boils at 373.15 K with ΔvapH 40.656 kJ/mol, then a gas.
  'H2O(l)': {
    value: -285.83 * kJ,
    uncertainty: 0.04 * kJ,
    thermal: {
      model: cp(75.3, 273.15, 373.15),
      transitions: [
        { temperature: 373.15, deltaH: 40.656 * kJ, phase: 'g', model: cp(33.6, 373.15, 3000) },
        { temperature: 273.15, deltaH: 6.0134 * kJ, phase: 'cr', model: cp(38, 100, 273.15) },
      ],
    },
  },
};
const lookup = (t: Term): TemperatureValue | undefined => DATA[t.id];

const failure = thermoFailure;

describe('reactionEnthalpyAtT', () => {
  it('adds Σν·[H(T) − H(298.15)] to the standard value', () => {
    const r = reactionEnthalpyAtT('H2(g) + 1/2 O2(g) -> H2O(g)', 1000, lookup);
    const dCp = 33.6 - 29 - 0.5 * 29.4;
    expect(r.deltaH298).toBeCloseTo(-241.826 * kJ, 6);
    expect(r.deltaH).toBeCloseTo(-241.826 * kJ + dCp * (1000 - 298.15), 6);
    expect(r.terms.map((t) => [t.term.id, t.increment])).toEqual([
      ['H2(g)', expect.closeTo(29 * 701.85, 6)],
      ['O2(g)', expect.closeTo(29.4 * 701.85, 6)],
      ['H2O(g)', expect.closeTo(33.6 * 701.85, 6)],
    ]);
    expect(r.uncertainty).toBeCloseTo(0.04 * kJ, 9);
  });

  it('equals the standard value at 298.15 K without needing heat capacities', () => {
    const r = reactionEnthalpyAtT('H2(g) + 1/2 O2(g) -> H2O(g)', 298.15, (t) =>
      t.id === 'H2O(g)' ? { value: -241.826 * kJ } : undefined,
    );
    expect(r.deltaH).toBe(-241.826 * kJ);
  });

  it('carries a species through a phase transition inside the interval', () => {
    const r = reactionEnthalpyAtT('H2O(l) -> H2O(g)', 500, lookup);
    const liquid = 75.3 * (373.15 - 298.15) + 40.656 * kJ + 33.6 * (500 - 373.15);
    const gas = 33.6 * (500 - 298.15);
    expect(r.deltaH).toBeCloseTo(44.004 * kJ + gas - liquid, 6);
    expect(r.terms[0]?.transitions).toEqual([
      { temperature: 373.15, deltaH: 40.656 * kJ, phase: 'g' },
    ]);
    expect(r.terms[1]?.transitions).toEqual([]);
  });

  it('subtracts ΔtrsH for a transition crossed on the way down', () => {
    const r = reactionEnthalpyAtT('H2O(l) -> H2O(g)', 250, lookup);
    const liquid = 75.3 * (273.15 - 298.15) - 6.0134 * kJ + 38 * (250 - 273.15);
    const gas = 33.6 * (250 - 298.15);
    expect(r.deltaH).toBeCloseTo(44.004 * kJ + gas - liquid, 6);
    expect(r.terms[0]?.transitions.map((t) => t.phase)).toEqual(['cr']);
  });

  it('does not cross a transition outside the interval', () => {
    const r = reactionEnthalpyAtT('H2O(l) -> H2O(g)', 350, lookup);
    expect(r.deltaH).toBeCloseTo(44.004 * kJ + (33.6 - 75.3) * (350 - 298.15), 6);
  });

  it('fails out_of_range naming the species and its range', () => {
    const err = failure(() => reactionEnthalpyAtT('H2(g) + 1/2 O2(g) -> H2O(g)', 3500, lookup));
    expect(err.code).toBe('out_of_range');
    expect(err.details).toMatchObject({
      species: 'H2(g)',
      range: { min: 200, max: 3000 },
      temperature: 3500,
    });
    expect(err.message).toMatch(/^H2\(g\): /);
  });

  it('needs heat-capacity data for every species, reference elements included', () => {
    const err = failure(() =>
      reactionEnthalpyAtT('H2(g) + 1/2 O2(g) -> H2O(g)', 800, (t) =>
        t.id === 'O2(g)' ? undefined : DATA[t.id],
      ),
    );
    expect(err.code).toBe('missing_data');
    expect(err.details['missing']).toEqual(['O2(g)']);
    const both = failure(() => reactionEnthalpyAtT('CO(g) + 1/2 O2(g) -> CO2(g)', 800, lookup));
    expect(both.details['missing']).toEqual(['CO(g)', 'CO2(g)']);
    expect(both.message).toContain('CO(g) (standard enthalpy of formation)');
    expect(both.message).toContain('CO2(g) (heat-capacity data)');
  });

  it('refuses an unbalanced equation', () => {
    expect(failure(() => reactionEnthalpyAtT('H2(g) + O2(g) -> H2O(g)', 800, lookup)).code).toBe(
      'unbalanced',
    );
  });

  it('rejects a temperature that is not a positive number', () => {
    expect(failure(() => reactionEnthalpyAtT('H2O(l) -> H2O(g)', -5, lookup)).code).toBe(
      'invalid_input',
    );
    expect(
      failure(() => reactionEnthalpyAtT('H2O(l) -> H2O(g)', Number.POSITIVE_INFINITY, lookup)).code,
    ).toBe('invalid_input');
  });
});
