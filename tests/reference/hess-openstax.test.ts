/**
 * Hess's law worked examples from OpenStax, Chemistry 2e (CC BY 4.0), §5.3. The ΔH values are
 * those listed in check-values.md (the project's list of published reference values); the step
 * equations of the ClF3 and AlCl3 examples are written from memory (the file lists only their
 * ΔH values) and are checked by the fact that they combine to the published results.
 */
import { checkBalance, parseEquation, solveHess } from '../../server/src/thermo';

const kJ = 1000;
const multipliers = (r: { multipliers: { toFraction(): string }[] }): string[] =>
  r.multipliers.map((m) => m.toFraction());

describe('OpenStax Chemistry 2e §5.3 (CC BY 4.0)', () => {
  it('3 O2 → 2 O3, ΔH° = +286 kJ ⇒ ΔfH°(O3) = +143 kJ/mol', () => {
    const r = solveHess('3/2 O2(g) -> O3(g)', [
      { equation: '3 O2(g) -> 2 O3(g)', deltaH: 286 * kJ },
    ]);
    expect(multipliers(r)).toEqual(['1/2']);
    // Exact: halving 286 is exact in binary floating point.
    expect(r.deltaH).toBe(143 * kJ);
  });

  it('stepwise chlorination of iron ⇒ ΔfH°(FeCl3, s) = −399.5 kJ/mol', () => {
    const r = solveHess('Fe(s) + 3/2 Cl2(g) -> FeCl3(s)', [
      { equation: 'Fe(s) + Cl2(g) -> FeCl2(s)', deltaH: -341.8 * kJ },
      { equation: 'FeCl2(s) + 1/2 Cl2(g) -> FeCl3(s)', deltaH: -57.7 * kJ },
    ]);
    expect(multipliers(r)).toEqual(['1', '1']);
    // Tolerance 1e-6 kJ/mol: the sum of two published one-decimal numbers, floating point only.
    expect(Math.abs(r.deltaH / kJ - -399.5)).toBeLessThanOrEqual(1e-6);
  });

  it('ClF(g) + F2(g) → ClF3(g) from three steps (−49.4, +214.0, +236.2 kJ) ⇒ −104.5 kJ', () => {
    const steps = [
      { equation: '2 OF2(g) -> O2(g) + 2 F2(g)', deltaH: -49.4 * kJ },
      { equation: '2 ClF(g) + O2(g) -> Cl2O(g) + OF2(g)', deltaH: 214.0 * kJ },
      { equation: 'ClF3(g) + O2(g) -> 1/2 Cl2O(g) + 3/2 OF2(g)', deltaH: 236.2 * kJ },
    ];
    for (const s of steps) expect(checkBalance(parseEquation(s.equation)).balanced).toBe(true);
    const r = solveHess('ClF(g) + F2(g) -> ClF3(g)', steps);
    expect(multipliers(r)).toEqual(['-1/2', '1/2', '-1']);
    expect(r.steps.map((s) => s.flipped)).toEqual([true, false, true]);
    expect(Math.abs(r.deltaH / kJ - -104.5)).toBeLessThanOrEqual(1e-6);
  });

  it('2 Al(s) + 3 Cl2(g) → 2 AlCl3(s) from four steps (−74.8, −185, +323, −1049 kJ) ⇒ −1407 kJ', () => {
    const r = solveHess('2 Al(s) + 3 Cl2(g) -> 2 AlCl3(s)', [
      { equation: 'HCl(g) -> HCl(aq)', deltaH: -74.8 * kJ },
      { equation: 'H2(g) + Cl2(g) -> 2 HCl(g)', deltaH: -185 * kJ },
      { equation: 'AlCl3(aq) -> AlCl3(s)', deltaH: 323 * kJ },
      { equation: '2 Al(s) + 6 HCl(aq) -> 2 AlCl3(aq) + 3 H2(g)', deltaH: -1049 * kJ },
    ]);
    expect(multipliers(r)).toEqual(['6', '3', '2', '1']);
    // The exact sum is −1406.8 kJ; the book rounds to −1407. Tolerance 0.5 kJ (rounding).
    expect(Math.abs(r.deltaH / kJ - -1407)).toBeLessThanOrEqual(0.5);
  });
});
