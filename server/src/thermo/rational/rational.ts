import Fraction from 'fraction.js';
import { ThermoError } from '../errors/thermo-error';

/**
 * Exact-rational plumbing shared by the parser, balance and linear algebra. Fraction instances
 * handed out from here may be shared between equations, so they are frozen; fraction.js never
 * mutates an instance, it always returns a new one.
 */
export const ZERO: Fraction = Object.freeze(new Fraction(0));
export const ONE: Fraction = Object.freeze(new Fraction(1));

const small: Fraction[] = [];
for (let i = 0; i <= 64; i++) small.push(Object.freeze(new Fraction(i)));

/** A frozen Fraction for n/d, reusing instances for small integers. */
export function frac(n: number | bigint, d: number | bigint = 1): Fraction {
  if (d === 1 && typeof n === 'number' && n >= 0 && n <= 64 && Number.isInteger(n))
    return small[n] as Fraction;
  return Object.freeze(new Fraction(n, d));
}

export function isZero(f: Fraction): boolean {
  return f.n === 0n;
}

/** -1, 0 or 1. */
export function sign(f: Fraction): number {
  return f.n === 0n ? 0 : f.s < 0n ? -1 : 1;
}

/**
 * value · f in floating point, multiplying before dividing so that integer coefficients give
 * exact products and the sign flips exactly with f.
 */
export function scaleNumber(value: number, f: Fraction): number {
  if (f.n === 0n) return 0;
  const n = Number(f.n);
  const d = Number(f.d);
  const scaled = d === 1 ? value * n : (value * n) / d;
  return f.s < 0n ? -scaled : scaled;
}

export function toNumber(f: Fraction): number {
  return scaleNumber(1, f);
}

export function gcdBig(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

export function lcmBig(a: bigint, b: bigint): bigint {
  if (a === 0n || b === 0n) return 0n;
  return (a / gcdBig(a, b)) * b;
}

/** Scales a rational vector to the smallest integers with the same ratios (sign kept). */
export function toSmallestIntegers(vector: readonly Fraction[]): bigint[] {
  let denominators = 1n;
  for (const f of vector) denominators = lcmBig(denominators, f.d);
  const ints = vector.map((f) => (f.s * f.n * denominators) / f.d);
  let g = 0n;
  for (const v of ints) g = gcdBig(g, v);
  return g === 0n ? ints : ints.map((v) => v / g);
}

/** Canonical text of a coefficient: "2", "1/2", "-3/4". */
export function fractionText(f: Fraction): string {
  if (!(f instanceof Fraction))
    throw new ThermoError('invalid_input', 'expected an exact number (a fraction)');
  return f.toFraction(false);
}
