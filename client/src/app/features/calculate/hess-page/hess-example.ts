import type { HessFormValue } from './hess-form';

/**
 * The prefilled example, from the Kestrel Process Works utilities team: checking the duty of the
 * fuel-gas heater (methane burnt, flue water leaving as vapour) from the step enthalpies the
 * team keeps on file. Step values are built from published ΔfH°(298.15 K), kJ/mol:
 * CO(g) −110.53 ± 0.17, CO2(g) −393.51 ± 0.13, H2O(l) −285.830 ± 0.040, H2O(g) −241.826 ± 0.040
 * (CODATA Key Values, Cox, Wagman, Medvedev 1989); CH4(g) −74.87 with no stated uncertainty
 * (Chase, Thermochemical Tables, 4th ed., 1998; from memory); NO(g) 90.25 (OpenStax Chemistry
 * 2e, App. G).
 * Step ± are root sums of squares of the cited ones. Step 4 is the phase change (water
 * evaporating, 44.00 = the difference of the two water values); step 5 (thermal NO from the
 * burner) is pasted along with the rest and comes back as unused. Expected total:
 * −802.29 kJ/mol, with the uncertainty not combined because step 1 has none.
 */
export const FUEL_GAS_CHECK: HessFormValue = {
  target: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)',
  unit: 'kJ/mol',
  temperature: '298.15',
  steps: [
    { equation: 'CH4(g) + 1/2 O2(g) -> CO(g) + 2 H2(g)', deltaH: '-35.66', uncertainty: '' },
    { equation: 'CO(g) + 1/2 O2(g) -> CO2(g)', deltaH: '-282.98', uncertainty: '0.21' },
    { equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', deltaH: '-285.83', uncertainty: '0.04' },
    { equation: 'H2O(l) -> H2O(g)', deltaH: '44.00', uncertainty: '0.06' },
    { equation: 'N2(g) + O2(g) -> 2 NO(g)', deltaH: '180.50', uncertainty: '' },
  ],
};

export const FUEL_GAS_CHECK_NOTE =
  'Filled in as an example: the Kestrel Process Works utilities team checks the duty of its ' +
  'fuel-gas heater (methane burnt, flue water leaving as vapour) from step enthalpies on file. ' +
  'Step 4 is the phase change of water; step 5 is not needed and is reported as unused.';
