import { toJoulesPerMoleText } from '../../../../imports/registry-csv';
import { toJoulesPerMole, type EnergyUnit } from '../../thermo';

/**
 * A JSON number as the plain decimal text it was written as (`1e-7` → `0.0000001`): the shortest
 * text that reads back as the same double, so `-74.87` stays `-74.87` and never becomes
 * `-74.8700000000000045…`.
 */
export function decimalText(n: number): string {
  const text = String(n);
  const m = /^(-?)(\d)(?:\.(\d+))?e([+-]\d+)$/.exec(text);
  if (!m) return text;
  const [, sign, lead, frac = '', exp] = m;
  const digits = lead + frac;
  const point = 1 + Number(exp);
  if (point <= 0) return `${sign}0.${'0'.repeat(-point)}${digits}`;
  if (point >= digits.length) return `${sign}${digits}${'0'.repeat(point - digits.length)}`;
  return `${sign}${digits.slice(0, point)}.${digits.slice(point)}`;
}

/**
 * An energy in kJ/mol, kcal/mol (thermochemical calorie, 4.184 J exactly) or J/mol, converted
 * to J/mol: `joules` through the engine (which also refuses out-of-range input) and `text` as
 * the exact decimal the registry stores (an integer-scaled conversion, no rounding).
 */
export function toStoredJoules(value: number, unit: EnergyUnit): { joules: number; text: string } {
  const joules = toJoulesPerMole(value, unit);
  return { joules, text: toJoulesPerMoleText(decimalText(value), unit) };
}
