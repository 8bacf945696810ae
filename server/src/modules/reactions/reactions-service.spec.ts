import { AppError } from '../../lib/app-error';
import { isThermoError } from '../../thermo';
import { computeReaction, SAFETY_CAUTION } from './reaction-answer';
import { BATCH_SUGGESTIONS, createReactionsService } from './reactions-service';
import { starterSnapshot } from './testing/starter-snapshot';

// Computed on the starter dataset (imports/starter) read straight from its files; the figures
// against published values live in tests/reference/reactions-published.test.ts.
const snap = starterSnapshot();
/** The assumptions without the note on a missing uncertainty. */
const steps = (a: { assumptions: string[] }) =>
  a.assumptions.filter((x) => !x.startsWith('no combined uncertainty'));

const at = (
  equation: string,
  temperatureK = 298.15,
  unit: 'kJ/mol' | 'kcal/mol' | 'J/mol' = 'kJ/mol',
) => computeReaction(snap, { equation, temperatureK, unit });

function failure(fn: () => unknown): {
  code: string;
  status: number;
  details: Record<string, unknown>;
} {
  try {
    fn();
  } catch (err) {
    if (err instanceof AppError)
      return { code: err.code, status: err.status, details: err.details };
    if (isThermoError(err)) return { code: err.code, status: 0, details: err.details };
    throw err;
  }
  throw new Error('expected a failure');
}

describe('reaction enthalpy on a release snapshot', () => {
  it('sums ν·ΔfH° with each term’s provenance, reference elements as zero terms', () => {
    const a = at('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)');
    const value = (key: string) => a.terms.find((t) => t.species === key)!;
    expect(a.deltaH).toBeCloseTo(
      value('carbon-dioxide').deltaFH + 2 * value('water').deltaFH - value('methane').deltaFH,
      9,
    );
    expect(value('oxygen')).toMatchObject({ deltaFH: 0, referenceState: true, coefficient: -2 });
    expect(value('oxygen').note).toMatch(/reference state/);
    expect(value('methane')).toMatchObject({ coefficient: -1, referenceState: false, phase: 'g' });
    expect(value('methane').revisionId).toEqual(expect.any(String));
    expect(value('methane').source?.citation).toMatch(/Thermochemical Tables/);
    // CH4(g) states no uncertainty, so the answer has none, and says why.
    expect(a.uncertainty).toBeNull();
    expect(a.assumptions).toEqual([
      'no combined uncertainty: the release states none for ΔfH° of CH4(g)',
    ]);
  });

  it('converts every energy to the requested unit', () => {
    const kj = at('H2O(l) -> H2O(g)');
    const kcal = at('H2O(l) -> H2O(g)', 298.15, 'kcal/mol');
    const j = at('H2O(l) -> H2O(g)', 298.15, 'J/mol');
    expect(kcal.deltaH).toBeCloseTo(kj.deltaH / 4.184, 12);
    expect(j.deltaH).toBeCloseTo(kj.deltaH * 1000, 6);
    expect(j.uncertainty).toBeCloseTo(kj.uncertainty! * 1000, 6);
    expect(kcal.terms[0]!.deltaFH).toBeCloseTo(kj.terms[0]!.deltaFH / 4.184, 12);
  });

  it('holds the flip and scale laws exactly', () => {
    const forward = at('N2(g) + 3 H2(g) -> 2 NH3(g)');
    expect(at('2 NH3(g) -> N2(g) + 3 H2(g)').deltaH).toBe(-forward.deltaH);
    expect(at('2 N2(g) + 6 H2(g) -> 4 NH3(g)').deltaH).toBe(2 * forward.deltaH);
    expect(at('1/2 N2(g) + 3/2 H2(g) -> NH3(g)').deltaH).toBe(forward.deltaH / 2);
  });

  it('reads s as cr and fills in the only modification, saying so', () => {
    const a = at('CaCO3(s) -> CaO(s) + CO2(g)');
    const calcite = a.terms.find((t) => t.species === 'calcium-carbonate')!;
    expect(calcite).toMatchObject({ phase: 'cr', modification: 'calcite' });
    expect(steps(a)).toEqual([
      expect.stringMatching(/CaCO3\(s\).*read as cr/),
      expect.stringMatching(/modification calcite assumed/),
      expect.stringMatching(/CaO\(s\).*read as cr/),
    ]);
    expect(a.equation).not.toMatch(/\(s\)/);
  });

  it('fills in an unwritten phase when the release holds one, and a reference state by convention', () => {
    const a = at('NaOH + HCl(g) -> NaCl(cr) + H2O(l)');
    expect(a.terms[0]).toMatchObject({ species: 'sodium-hydroxide', phase: 'cr' });
    expect(steps(a)).toEqual([expect.stringMatching(/^NaOH: phase cr assumed/)]);
    const b = at('H2 + 1/2 O2 -> H2O(l)');
    expect(b.terms.slice(0, 2)).toMatchObject([
      { species: 'hydrogen', phase: 'g', referenceState: true },
      { species: 'oxygen', phase: 'g', referenceState: true },
    ]);
    expect(steps(b)).toEqual([
      expect.stringMatching(/^H2 read as H2\(g\), the reference state of H/),
      expect.stringMatching(/^O2 read as O2\(g\), the reference state of O/),
    ]);
  });

  it('refuses a formula two isomers share, naming both, and takes a registry key', () => {
    const err = failure(() => at('C4H10(g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)'));
    expect(err.code).toBe('ambiguous_species');
    expect(err.status).toBe(422);
    expect((err.details['candidates'] as { species: string }[]).map((c) => c.species)).toEqual(
      expect.arrayContaining(['butane', '2-methylpropane']),
    );
    const iso = at('[butane](g) -> [2-methylpropane](g)');
    expect(iso.terms.map((t) => [t.species, t.formula])).toEqual([
      ['butane', 'C4H10'],
      ['2-methylpropane', 'C4H10'],
    ]);
    expect(iso.deltaH).toBeCloseTo(iso.terms[1]!.deltaFH - iso.terms[0]!.deltaFH, 9);
  });

  it('checks the balance of registry-key terms by their formulas', () => {
    const err = failure(() => at('[butane](g) + 6 O2(g) -> 4 CO2(g) + 5 H2O(l)'));
    expect(err.code).toBe('unbalanced');
    expect(err.details['imbalance']).toEqual({ O: 1 });
  });

  it('answers unbalanced with the imbalance as numbers and a balanced suggestion', () => {
    const err = failure(() => at('CH4(g) + O2(g) -> CO2(g) + H2O(l)'));
    expect(err).toMatchObject({ code: 'unbalanced', status: 422 });
    expect(err.details['imbalance']).toEqual({ H: -2, O: 1 });
    expect(err.details['suggestion']).toBe('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)');
  });

  it('names unknown species with near matches', () => {
    const err = failure(() => at('[methan](g) + 2 O2(g) -> CO2(g) + 2 H2O(l)'));
    expect(err).toMatchObject({ code: 'unknown_species', status: 422 });
    expect(err.details['missing']).toEqual(['[methan](g)']);
    expect(err.details['suggestions']).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ term: '[methan](g)', species: 'methane' }),
      ]),
    );
  });

  it('answers missing_data for a phase the release lacks and for heat-capacity data', () => {
    const err = failure(() => at('H2O(aq) -> H2O(l)'));
    expect(err).toMatchObject({
      code: 'missing_data',
      status: 422,
      details: { missing: ['H2O(aq)'] },
    });
    const hot = failure(() => at('C2H2(g) + 2 H2(g) -> C2H6(g)', 500));
    expect(hot.code).toBe('missing_data');
    expect(hot.details['missing']).toEqual(['C2H2(g)']);
  });

  it('answers out_of_range past the heat-capacity ranges', () => {
    expect(failure(() => at('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)', 8000)).code).toBe(
      'out_of_range',
    );
  });

  it('carries each term’s enthalpy increment and crosses the boiling point of water', () => {
    const a = at('H2O(l) -> H2O(g)', 400);
    const [liquid, gas] = a.terms;
    expect(liquid!.transitions).toEqual([
      expect.objectContaining({ temperature: 373.15, phase: 'g', revisionId: expect.any(String) }),
    ]);
    expect(a.deltaH).toBeCloseTo(
      a.deltaH298! + gas!.enthalpyIncrement! - liquid!.enthalpyIncrement!,
      9,
    );
    // Both sides are steam at 400 K: what remains is the gap between the tabulated 298.15 K and
    // boiling-point enthalpies (real against ideal vapour, about 0.3 kJ/mol).
    expect(Math.abs(a.deltaH)).toBeLessThan(0.6);
    expect(a.assumptions.at(-1)).toMatch(/Kirchhoff/);
  });

  it('going below a transition needs the heat capacity of the phase beyond it', () => {
    // Liquid water cooled under 273.15 K freezes; the starter data has no heat capacity of ice.
    const err = failure(() => at('H2O(l) -> H2O(g)', 260));
    expect(err.code).toBe('missing_data');
    expect(err.details['needs']).toEqual([
      {
        species: 'H2O(l)',
        needs: expect.stringMatching(/phase cr beyond its transition at 273.15 K/),
      },
    ]);
  });

  it('reports parse errors with their position', () => {
    const err = failure(() => at('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l'));
    expect(err.code).toBe('parse_error');
    expect(err.details['position']).toEqual(expect.any(Number));
  });
});

describe('reactions service', () => {
  const service = createReactionsService(async (v) =>
    v === '2026.1' || v === 'latest' ? snap : null,
  );

  it('answers unknown_release with 404', async () => {
    await expect(service.release('1999.9')).rejects.toMatchObject({
      status: 404,
      code: 'unknown_release',
    });
    await expect(service.release('latest')).resolves.toBe(snap);
  });

  it('adds the safety caution', () => {
    const a = service.compute(snap, {
      equation: 'H2(g) + 1/2 O2(g) -> H2O(l)',
      temperatureK: 298.15,
      unit: 'kJ/mol',
    });
    expect(a.caution).toBe(SAFETY_CAUTION);
  });

  it('answers a batch in order, with an error per failing item', () => {
    const answer = service.batch(snap, {
      unit: 'kJ/mol',
      reactions: [
        { id: 'a', equation: 'H2O(l) -> H2O(g)' },
        { id: 'b', equation: 'CH4(g) + O2(g) -> CO2(g) + H2O(l)' },
        { equation: 'H2O(l) -> H2O(g' },
        { id: 7, equation: 'H2O(l) -> H2O(g)', temperatureK: 350 },
      ],
    });
    expect(answer).toMatchObject({ release: '2026.1', count: 4, errors: 2 });
    expect(answer.results.map((r) => [r.index, r.id, 'error' in r ? r.error.code : 'ok'])).toEqual([
      [0, 'a', 'ok'],
      [1, 'b', 'unbalanced'],
      [2, null, 'parse_error'],
      [3, 7, 'ok'],
    ]);
    const bad = answer.results[2]!;
    expect('error' in bad && bad.error.status).toBe(400);
    const single = at('H2O(l) -> H2O(g)', 350);
    expect(answer.results[3]).toMatchObject({ deltaH: single.deltaH, temperatureK: 350 });
  });
});

describe('elements in their reference state', () => {
  it('reads a modification alias as the convention’s label and finds the release’s row', () => {
    const a = at('S(cr,orthorhombic) + O2(g) -> SO2(g)');
    expect(a.terms[0]).toMatchObject({
      species: 'sulfur',
      modification: 'rhombic',
      referenceState: true,
      deltaFH: 0,
    });
  });
});

describe('batch cost bounds', () => {
  const service = createReactionsService(async () => snap);

  it('offers fuzzy suggestions for the first failures only', () => {
    const reactions = Array.from({ length: 60 }, (_, i) => ({
      equation: `[methan-${i}](g) + 2 O2(g) -> CO2(g) + 2 H2O(l)`,
    }));
    const answer = service.batch(snap, { unit: 'kJ/mol', reactions });
    const counts = answer.results.map((r) =>
      'error' in r ? (r.error as { suggestions?: unknown[] }).suggestions?.length : -1,
    );
    expect(answer.errors).toBe(60);
    expect(counts.slice(0, BATCH_SUGGESTIONS).every((n) => n! > 0)).toBe(true);
    expect(counts.slice(BATCH_SUGGESTIONS)).toEqual(Array(60 - BATCH_SUGGESTIONS).fill(0));
  });
});

describe('ambiguity', () => {
  it('offers the formula with a phase when one species has several phases', () => {
    const err = failure(() => at('H2O2 -> H2O2(g)'));
    expect(err.code).toBe('ambiguous_species');
    expect((err.details['candidates'] as { write: string }[]).map((c) => c.write)).toEqual([
      'H2O2(l)',
      'H2O2(g)',
    ]);
  });
});
