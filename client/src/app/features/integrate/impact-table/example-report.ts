import type { ImpactAnswer } from '@contracts/watchlists/watchlists-schemas';

/** An impact report with one flagged change, one unchanged and one failed item (for specs). */
export const exampleReport: ImpactAnswer = {
  from: '2026.1',
  to: '2026.2',
  unit: 'kJ/mol',
  watchlistId: 3,
  count: 3,
  errors: 1,
  exceeding: 1,
  caution: 'Computed values are estimates from tabulated data.',
  results: [
    {
      index: 0,
      label: 'Water formation',
      input: 'H2(g) + 1/2 O2(g) -> H2O(l)',
      temperatureK: 298.15,
      from: {
        equation: 'H2(g) + 1/2 O2(g) → H2O(l)',
        deltaH: -285.83,
        uncertainty: 0.04,
        uncertaintyBasis: 'expanded_k2',
      },
      to: {
        equation: 'H2(g) + 1/2 O2(g) → H2O(l)',
        deltaH: -285.33,
        uncertainty: 0.04,
        uncertaintyBasis: 'expanded_k2',
      },
      change: 0.5,
      combinedUncertainty: 0.0566,
      exceedsUncertainty: true,
    },
    {
      index: 1,
      label: null,
      input: 'C(graphite) + O2(g) -> CO2(g)',
      temperatureK: 298.15,
      from: {
        equation: 'C(graphite) + O2(g) → CO2(g)',
        deltaH: -393.51,
        uncertainty: 0.13,
        uncertaintyBasis: 'expanded_k2',
      },
      to: {
        equation: 'C(graphite) + O2(g) → CO2(g)',
        deltaH: -393.51,
        uncertainty: 0.13,
        uncertaintyBasis: 'expanded_k2',
      },
      change: 0,
      combinedUncertainty: 0.18,
      exceedsUncertainty: false,
    },
    {
      index: 2,
      label: null,
      input: 'Xx(g) -> Xx(l)',
      temperatureK: 298.15,
      from: { error: { status: 400, code: 'unknown_element', message: 'Xx is not an element' } },
      to: { error: { status: 400, code: 'unknown_element', message: 'Xx is not an element' } },
      change: null,
      combinedUncertainty: null,
      exceedsUncertainty: null,
    },
  ],
};
