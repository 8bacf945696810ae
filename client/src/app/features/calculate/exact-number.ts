/**
 * Exact numbers from the API (coefficients, multipliers, imbalances, charges) arrive as text
 * such as "-1/2" (older answers sent plain JSON numbers); both are read here.
 */
export type ExactValue = string | number;

export function exactValue(value: ExactValue): number {
  if (typeof value === 'number') return value;
  const [numerator, denominator = '1'] = value.split('/');
  return Number(numerator) / Number(denominator);
}

const GLYPHS: Record<string, string> = {
  '1/2': '½',
  '1/3': '⅓',
  '2/3': '⅔',
  '1/4': '¼',
  '3/4': '¾',
};

/** The size of a multiplier as people write it: `½`, `2`, `1 ½`, `3/7`. */
export function factorText(value: ExactValue): string {
  const magnitude = Math.abs(exactValue(value));
  const text = typeof value === 'string' ? value.replace(/^-/, '') : fractionOf(magnitude);
  const [n, d] = text.split('/').map(Number);
  if (d === undefined || d === 1) return String(n);
  const whole = Math.floor(n / d);
  const part = `${n % d}/${d}`;
  const shown = GLYPHS[part] ?? part;
  return whole > 0 ? `${whole} ${shown}` : shown;
}

/** A float as a small fraction when it is one (older answers sent 0.5 for ½). */
function fractionOf(magnitude: number): string {
  for (let d = 1; d <= 1000; d++) {
    const n = Math.round(magnitude * d);
    if (Math.abs(magnitude * d - n) < 1e-9) return d === 1 ? String(n) : `${n}/${d}`;
  }
  return String(Number(magnitude.toPrecision(6)));
}
