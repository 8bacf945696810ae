import type { HessRequest } from '../models/hess';

/**
 * The prefilled example. The process data team of a hydrogen unit checks the duty of the
 * steam-reforming step from the heats of combustion their lab keeps on file (water as vapour).
 * The team pasted the condensation step along with the rest; the combination does not need it,
 * so it comes back as unused.
 */
export const REFORMING_CHECK = {
  target: 'CH4(g) + H2O(g) -> CO(g) + 3 H2(g)',
  unit: 'kJ/mol',
  steps: [
    { equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)', deltaH: -802.3, uncertainty: 0.4 },
    { equation: 'CO(g) + 1/2 O2(g) -> CO2(g)', deltaH: -283.0, uncertainty: 0.2 },
    { equation: 'H2(g) + 1/2 O2(g) -> H2O(g)', deltaH: -241.8, uncertainty: 0.1 },
    { equation: 'H2O(g) -> H2O(l)', deltaH: -44.0, uncertainty: 0.1 },
  ],
} satisfies HessRequest;

export const REFORMING_CHECK_NOTE =
  'Filled in as an example: a process data team checks the steam-reforming step of a hydrogen ' +
  'unit against the heats of combustion it keeps on file. The last step is not needed and is ' +
  'reported as unused.';
