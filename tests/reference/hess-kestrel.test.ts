/**
 * Scenario: the Kestrel Process Works data team (a fictional engineering data team) checks two
 * process duties by combining formation steps, before trusting the numbers in a heat balance.
 * The scenario is ours; every ΔH in it is a published value named beside it, or arithmetic on
 * such values, except the one mistyped entry marked fictional.
 */
import {
  molarToSpecific,
  reactionEnthalpy,
  solveHess,
  tableLookup,
  ThermoError,
} from '../../server/src/thermo';

const kJ = 1000;

const FORMATION_STEPS = {
  // CODATA Key Values (Cox, Wagman, Medvedev 1989)
  co: {
    equation: 'C(cr,graphite) + 1/2 O2(g) -> CO(g)',
    deltaH: -110.53 * kJ,
    uncertainty: 0.17 * kJ,
  },
  co2: {
    equation: 'C(cr,graphite) + O2(g) -> CO2(g)',
    deltaH: -393.51 * kJ,
    uncertainty: 0.13 * kJ,
  },
  steam: { equation: 'H2(g) + 1/2 O2(g) -> H2O(g)', deltaH: -241.826 * kJ, uncertainty: 0.04 * kJ },
  lime: { equation: 'Ca(cr) + 1/2 O2(g) -> CaO(cr)', deltaH: -634.92 * kJ, uncertainty: 0.9 * kJ },
  // Chase, Thermochemical Tables, 4th ed. (1998) — from memory (check-values.md marks it M); no ± given
  methane: { equation: 'C(cr,graphite) + 2 H2(g) -> CH4(g)', deltaH: -74.87 * kJ },
  // NBS tables (Wagman et al. 1982), secondary source; no ± given
  calcite: {
    equation: 'Ca(cr) + C(cr,graphite) + 3/2 O2(g) -> CaCO3(cr,calcite)',
    deltaH: -1206.92 * kJ,
  },
};

describe('Kestrel Process Works data team: steam-methane reforming duty', () => {
  const target = 'CH4(g) + H2O(g) -> CO(g) + 3 H2(g)';
  const { co, co2, steam, methane } = FORMATION_STEPS;

  it('combines the formation steps to ΔrH° = −110.53 + 241.826 + 74.87 = 206.166 kJ/mol', () => {
    const r = solveHess(target, [co2, co, steam, methane]);
    expect(r.multipliers.map((m) => m.toFraction())).toEqual(['0', '1', '-1', '-1']);
    expect(r.unused).toEqual([0]);
    expect(Math.abs(r.deltaH / kJ - 206.166)).toBeLessThanOrEqual(1e-9);
    // CH4 has no published ± in the chosen source, so no combined uncertainty is claimed.
    expect(r.uncertainty).toBeNull();
  });

  it('agrees with the same values used as formation enthalpies', () => {
    const lookup = tableLookup({
      'CO(g)': co.deltaH,
      'H2O(g)': steam.deltaH,
      'CH4(g)': methane.deltaH,
    });
    expect(reactionEnthalpy(target, lookup).deltaH).toBeCloseTo(
      solveHess(target, [co, steam, methane]).deltaH,
      6,
    );
  });

  it('accepts a redundant but consistent water-gas shift step and still gives one answer', () => {
    // CO + H2O(g) → CO2 + H2: −393.51 − (−110.53) − (−241.826) = −41.154 kJ/mol, arithmetic on CODATA.
    const shift = {
      equation: 'CO(g) + H2O(g) -> CO2(g) + H2(g)',
      deltaH: (-393.51 + 110.53 + 241.826) * kJ,
    };
    const r = solveHess(target, [co, steam, methane, co2, shift]);
    expect(r.alternativeSolutions).toBe(true);
    expect(Math.abs(r.deltaH / kJ - 206.166)).toBeLessThanOrEqual(1e-9);
  });

  it('catches a mistyped step that makes the data inconsistent', () => {
    // Fictional: the shift value mistyped as −41.9 kJ/mol in a spreadsheet.
    const typo = { equation: 'CO(g) + H2O(g) -> CO2(g) + H2(g)', deltaH: -41.9 * kJ };
    try {
      solveHess(target, [co, steam, methane, co2, typo]);
      throw new Error('expected not_unique');
    } catch (err) {
      expect(err).toBeInstanceOf(ThermoError);
      expect((err as ThermoError).code).toBe('not_unique');
      expect(
        Math.abs(
          Math.abs((err as ThermoError).details['cycleDeltaH'] as number) / kJ - (41.9 - 41.154),
        ),
      ).toBeLessThanOrEqual(1e-9);
    }
  });
});

describe('Kestrel Process Works data team: limestone calcination duty', () => {
  const { co2, lime, calcite } = FORMATION_STEPS;

  it('CaCO3(calcite) → CaO + CO2: ΔrH° = −634.92 − 393.51 + 1206.92 = 178.49 kJ/mol', () => {
    const r = solveHess('CaCO3(cr,calcite) -> CaO(cr) + CO2(g)', [calcite, lime, co2]);
    expect(r.steps.map((s) => s.flipped)).toEqual([true, false, false]);
    expect(Math.abs(r.deltaH / kJ - 178.49)).toBeLessThanOrEqual(1e-9);
    expect(r.uncertainty).toBeNull();
  });

  it('is 1.7834 MJ per kg of calcite (M(CaCO3) = 100.086 g/mol from CIAAW 2021 weights)', () => {
    const r = solveHess('CaCO3(cr,calcite) -> CaO(cr) + CO2(g)', [calcite, lime, co2]);
    // 178.49 kJ/mol ÷ 100.086 g/mol = 1.78337 MJ/kg; tolerance 1e-4 MJ/kg for the quoted digits.
    expect(
      Math.abs(molarToSpecific(r.deltaH, 'CaCO3', 'MJ/kg') - 178.49 / 100.086),
    ).toBeLessThanOrEqual(1e-4);
  });

  it('does not accept an unqualified solid for calcite: s is not cr,calcite', () => {
    expect(() => solveHess('CaCO3(s) -> CaO(cr) + CO2(g)', [calcite, lime, co2])).toThrow(
      expect.objectContaining({
        code: 'no_combination',
        details: expect.objectContaining({ unmatched: ['CaCO3(s)'] }),
      }),
    );
  });
});
