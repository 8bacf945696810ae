import type Fraction from 'fraction.js';
import { isElementSymbol } from './atomic-weights';
import { ThermoError } from '../errors/thermo-error';

/**
 * Hill order (E. A. Hill, J. Am. Chem. Soc. 1900; the order of most handbooks): with carbon,
 * C first, then H, then the other elements alphabetically; without carbon, every element
 * alphabetically (H included).
 */
export function hillOrder(symbols: Iterable<string>): string[] {
  const list =
    symbols !== null && typeof symbols === 'object' && Symbol.iterator in symbols
      ? [...symbols]
      : null;
  if (list === null || !list.every((s) => typeof s === 'string')) {
    throw new ThermoError('invalid_input', 'hillOrder needs a list of element symbols');
  }
  const hasCarbon = list.includes('C');
  return list.sort((a, b) => {
    if (hasCarbon) {
      const ra = a === 'C' ? 0 : a === 'H' ? 1 : 2;
      const rb = b === 'C' ? 0 : b === 'H' ? 1 : 2;
      if (ra !== rb) return ra - rb;
    }
    return a < b ? -1 : a > b ? 1 : 0;
  });
}

/**
 * A count as formulas write it: `2`, a terminating decimal `0.947` / `4.5`, or, for the rare
 * count with another denominator (a 1/3 hydrate), the fraction `13/3`.
 */
export function countText(n: Fraction): string {
  if (n.d === 1n) return String(n.n);
  let d = n.d;
  while (d % 2n === 0n) d /= 2n;
  while (d % 5n === 0n) d /= 5n;
  return d === 1n ? n.toString() : `${n.n}/${n.d}`;
}

/** Charge suffix as the parser reads it back: `+`/`-` for ±1, `^2-`, `^3+` otherwise. */
export function chargeSuffix(charge: number): string {
  if (charge === 0) return '';
  const sign = charge > 0 ? '+' : '-';
  const size = Math.abs(charge);
  return size === 1 ? sign : `^${size}${sign}`;
}

/** Display formula in Hill order, e.g. hillFormula({ O: 4, S: 1 }, -2) → "O4S^2-". */
export function hillFormula(elements: Readonly<Record<string, number>>, charge = 0): string {
  if (elements === null || typeof elements !== 'object') {
    throw new ThermoError('invalid_input', 'elements must be an object of symbol → count');
  }
  if (!Number.isSafeInteger(charge)) {
    throw new ThermoError('invalid_input', 'charge must be a whole number', { charge });
  }
  const present: string[] = [];
  for (const symbol of Object.keys(elements)) {
    const count = elements[symbol];
    if (!isElementSymbol(symbol)) {
      throw new ThermoError('unknown_element', `unknown element symbol '${symbol}'`, { symbol });
    }
    // Non-integer counts (Fe0.947O) print as decimals; whole counts as written.
    if (typeof count !== 'number' || !Number.isFinite(count) || count < 0 || count > 1e15) {
      throw new ThermoError('invalid_input', `count of ${symbol} must be a number ≥ 0`, {
        symbol,
        count,
      });
    }
    if (count > 0) present.push(symbol);
  }
  let out = '';
  for (const symbol of hillOrder(present)) {
    const count = elements[symbol] as number;
    out += count === 1 ? symbol : `${symbol}${count}`;
  }
  return out + chargeSuffix(charge);
}
