import Fraction from 'fraction.js';

/**
 * Engine results hold exact coefficients as fraction.js values, whose bigint fields JSON cannot
 * carry. Pass this to JSON.stringify: fractions become exact strings ("1/2", "-3"), any bigint
 * a decimal string.
 */
export function thermoJsonReplacer(_key: string, value: unknown): unknown {
  if (value instanceof Fraction) return value.toFraction();
  if (typeof value === 'bigint') return value.toString();
  return value;
}
