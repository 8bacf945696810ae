/**
 * Exact decimal text. Values keep the digits their source prints; conversion to J/mol scales
 * an integer mantissa (BigInt), so 1 kcal = 4184 J and 1 kJ = 1000 J hold exactly and no
 * floating-point rounding enters the registry.
 */
export type EnergyUnitText = 'J/mol' | 'kJ/mol' | 'kcal/mol';
export const ENERGY_UNITS: readonly EnergyUnitText[] = ['kJ/mol', 'kcal/mol', 'J/mol'];

const FACTOR: Record<EnergyUnitText, bigint> = { 'J/mol': 1n, 'kJ/mol': 1000n, 'kcal/mol': 4184n };

/** Plain decimal as tables print it: optional sign, digits, optional fraction. No exponent. */
export const DECIMAL_PATTERN = /^[+-]?\d+(\.\d+)?$/;

interface Scaled {
  readonly mantissa: bigint;
  readonly scale: number;
}

function scaled(text: string): Scaled {
  const match = /^([+-]?)(\d+)(?:\.(\d+))?$/.exec(text);
  if (match === null) throw new Error(`not a plain decimal: ${JSON.stringify(text)}`);
  const fraction = match[3] ?? '';
  const digits = BigInt(`${match[2]}${fraction}`);
  return { mantissa: match[1] === '-' ? -digits : digits, scale: fraction.length };
}

function printScaled({ mantissa, scale }: Scaled): string {
  const negative = mantissa < 0n;
  let digits = (negative ? -mantissa : mantissa).toString().padStart(scale + 1, '0');
  const point = digits.length - scale;
  // Trailing zeros of the fraction carry no value once converted; drop them.
  while (digits.length > point && digits.endsWith('0')) digits = digits.slice(0, -1);
  const text = digits.length > point ? `${digits.slice(0, point)}.${digits.slice(point)}` : digits;
  return negative && /[1-9]/.test(text) ? `-${text}` : text;
}

/** `value` (plain decimal text) in `unit` → exact decimal text in J/mol. */
export function toJoulesPerMoleText(value: string, unit: EnergyUnitText): string {
  const { mantissa, scale } = scaled(value);
  return printScaled({ mantissa: mantissa * FACTOR[unit], scale });
}

/** Canonical form of a plain decimal (no `+`, no trailing fraction zeros, no `-0`). */
export function canonicalDecimal(value: string): string {
  return printScaled(scaled(value));
}
