import type Fraction from 'fraction.js';
import { ThermoError } from '../errors/thermo-error';
import * as input from '../equation/equation-input';
import type { Equation, Term } from '../equation/equation-types';
import { printEquation } from '../equation/equation-printer';
import { exactCounts } from '../formula/formula-parser';
import { hillOrder } from '../formula/hill-formula';
import * as rational from '../rational/rational';

export interface BalanceReport {
  /** null when some term is a registry key, whose composition the engine does not know. */
  readonly balanced: boolean | null;
  /** Products minus reactants per element, non-zero entries only, over terms of known composition. */
  readonly imbalance: Readonly<Record<string, Fraction>>;
  /** Products minus reactants of the charge. */
  readonly charge: Fraction;
  /** Registry keys of the terms that could not be counted. */
  readonly unknownComposition: readonly string[];
}

// Hot path: imported functions bound once (development module loaders put a getter on every
// imported binding, which costs more than the work here).
const { toEquation } = input;
const { fractionText, frac, sign, ZERO } = rational;

const SAFE = Number.MAX_SAFE_INTEGER;

/**
 * Exact element and charge balance. The common case (small rational coefficients) runs on
 * integers: every coefficient is scaled by the common denominator, and each product and sum is
 * checked to stay below 2^53, so the arithmetic is exact; anything larger falls back to fractions.
 */
export function checkBalance(input: Equation | string): BalanceReport {
  const eq = toEquation(input);
  return integerBalance(eq) ?? fractionBalance(eq);
}

function report(eq: Equation): BalanceReport {
  return integerBalance(eq) ?? fractionBalance(eq);
}

// Scratch space for the integer path, reused between calls (the function never re-enters).
const scratchSymbols: string[] = [];
const scratchSums: number[] = [];

interface Tally {
  charge: number;
  unknown: string[];
}

/** Adds dir·ν·count for every term; false when a number leaves the exact-integer range. */
function tallyIntegers(terms: readonly Term[], dir: number, common: number, acc: Tally): boolean {
  for (const t of terms) {
    if (t.species.kind === 'key') {
      acc.unknown.push(t.species.key);
      continue;
    }
    // Non-integer counts (Fe0.947O) take the exact path.
    if (t.species.exact !== undefined) return false;
    const c = t.coefficient;
    const w = (Number(c.n) * common) / Number(c.d);
    if (w > SAFE) return false;
    const els = t.species.elements;
    for (const symbol in els) {
      let k = scratchSymbols.indexOf(symbol);
      if (k < 0) {
        k = scratchSymbols.length;
        scratchSymbols.push(symbol);
        scratchSums.push(0);
      }
      const x = (scratchSums[k] as number) + dir * w * (els[symbol] as number);
      if (Math.abs(x) > SAFE / 2) return false;
      scratchSums[k] = x;
    }
    acc.charge += dir * w * t.species.charge;
    if (Math.abs(acc.charge) > SAFE / 2) return false;
  }
  return true;
}

function commonDenominator(terms: readonly Term[], start: number): number {
  let common = start;
  for (const t of terms) {
    const d = Number(t.coefficient.d);
    if (d > 1) common = (common / gcd(common, d)) * d;
  }
  return common;
}

function integerBalance(eq: Equation): BalanceReport | null {
  const common = commonDenominator(eq.products, commonDenominator(eq.reactants, 1));
  if (common > 2 ** 31) return null;
  scratchSymbols.length = 0;
  scratchSums.length = 0;
  const acc: Tally = { charge: 0, unknown: [] };
  if (!tallyIntegers(eq.reactants, -1, common, acc) || !tallyIntegers(eq.products, 1, common, acc))
    return null;
  const imbalance: Record<string, Fraction> = {};
  let off: string[] | null = null;
  for (let k = 0; k < scratchSymbols.length; k++)
    if (scratchSums[k] !== 0) (off ??= []).push(scratchSymbols[k] as string);
  if (off !== null) {
    for (const symbol of hillOrder(off))
      imbalance[symbol] = frac(scratchSums[scratchSymbols.indexOf(symbol)] as number, common);
  }
  return {
    balanced: acc.unknown.length > 0 ? null : off === null && acc.charge === 0,
    imbalance,
    charge: acc.charge === 0 ? ZERO : frac(acc.charge, common),
    unknownComposition: acc.unknown,
  };
}

function tallyFractions(
  terms: readonly Term[],
  dir: number,
  totals: Map<string, Fraction>,
  acc: { charge: Fraction; unknown: string[] },
): void {
  for (const t of terms) {
    if (t.species.kind === 'key') {
      acc.unknown.push(t.species.key);
      continue;
    }
    const nu = dir < 0 ? t.coefficient.neg() : t.coefficient;
    const els = exactCounts(t.species);
    for (const symbol in els)
      totals.set(symbol, (totals.get(symbol) ?? ZERO).add(nu.mul(els[symbol] as Fraction)));
    acc.charge = acc.charge.add(nu.mul(t.species.charge));
  }
}

function fractionBalance(eq: Equation): BalanceReport {
  const totals = new Map<string, Fraction>();
  const acc = { charge: ZERO, unknown: [] as string[] };
  tallyFractions(eq.reactants, -1, totals, acc);
  tallyFractions(eq.products, 1, totals, acc);
  const imbalance: Record<string, Fraction> = {};
  for (const symbol of hillOrder(totals.keys())) {
    const v = totals.get(symbol) as Fraction;
    if (sign(v) !== 0) imbalance[symbol] = v;
  }
  const clean = Object.keys(imbalance).length === 0 && sign(acc.charge) === 0;
  return {
    balanced: acc.unknown.length > 0 ? null : clean,
    imbalance,
    charge: acc.charge,
    unknownComposition: acc.unknown,
  };
}

function gcd(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return a;
}

/** Products-minus-reactants text of a report, e.g. "O: 2, H: -1/2, charge: 1". */
function describeImbalance(report: BalanceReport): string {
  const parts = Object.entries(report.imbalance).map(
    ([symbol, v]) => `${symbol}: ${fractionText(v)}`,
  );
  if (sign(report.charge) !== 0) parts.push(`charge: ${fractionText(report.charge)}`);
  return parts.join(', ');
}

/**
 * Throws `unbalanced` (with the imbalance, products minus reactants, as exact fraction strings)
 * unless the equation balances. Terms of unknown composition (registry keys) cannot be checked;
 * the report says so and the equation passes.
 */
export function assertBalanced(
  input: Equation | string,
  context: Record<string, unknown> = {},
): BalanceReport {
  const eq = toEquation(input);
  const result = report(eq);
  if (result.balanced === false) {
    // Steps are counted from 1 for people; the `step` detail stays a 0-based index.
    const prefix = typeof context['step'] === 'number' ? `step ${context['step'] + 1}: ` : '';
    throw new ThermoError(
      'unbalanced',
      `${prefix}${printEquation(eq)} is not balanced (products minus reactants: ${describeImbalance(result)})`,
      {
        ...context,
        imbalance: Object.fromEntries(
          Object.entries(result.imbalance).map(([k, v]) => [k, fractionText(v)]),
        ),
        charge: fractionText(result.charge),
      },
    );
  }
  return result;
}
