import Fraction from 'fraction.js';
import { fractionText } from './rational';

/**
 * The one wire format for exact numbers: a JSON string holding the rational in lowest terms,
 * sign first, denominator only when it is not 1 ("2", "-1/2", "13/2"). Measured quantities
 * (enthalpies, uncertainties) stay JSON numbers. The app passes this to JSON.stringify so a
 * Fraction anywhere in an answer goes out in that format; any bigint as a decimal string.
 */
export function thermoJsonReplacer(_key: string, value: unknown): unknown {
  if (value instanceof Fraction) return fractionText(value);
  if (typeof value === 'bigint') return value.toString();
  return value;
}
