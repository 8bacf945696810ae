/**
 * Registry numbers as the screens show them. The API gives energies in J/mol, with the exact
 * stored decimal beside the number; shown in kJ/mol by moving the decimal point (exact, no
 * floating-point rounding), keeping every digit the source gave.
 */
import type { RevisionView } from '@contracts/species/species-schemas';

/** Exact J/mol text (`-285830`, `-74.6e3` is never sent) → kJ/mol text (`-285.83`). */
export function kjFromJoulesText(text: string): string {
  const match = /^([+-]?)(\d+)(?:\.(\d+))?$/.exec(text.trim());
  if (!match) return text;
  const [, sign, whole, fraction = ''] = match;
  const padded = whole.padStart(4, '0');
  const intPart = padded.slice(0, -3).replace(/^0+(?=\d)/, '');
  let decimals = (padded.slice(-3) + fraction).replace(/0+$/, '');
  // One decimal at least, so -283000 J/mol reads -283.0 kJ/mol, not -283.
  if (decimals === '') decimals = '0';
  const negative = sign === '-' && /[1-9]/.test(intPart + decimals);
  return `${negative ? '−' : ''}${intPart}.${decimals}`;
}

/** A J/mol uncertainty in kJ/mol with two significant digits (`420` → `0.42`). */
export function kjUncertainty(joules: number | null): string | null {
  if (joules === null) return null;
  return new Intl.NumberFormat('en-US', {
    maximumSignificantDigits: 2,
    useGrouping: false,
  }).format(joules / 1000);
}

/** What an uncertainty is, in the words of a table note. */
export function basisWords(basis: string | null): string {
  switch (basis) {
    case 'standard':
      return 'standard uncertainty';
    case 'expanded_k2':
      return 'expanded uncertainty, k = 2';
    case 'as_stated':
      return 'as the source states it';
    default:
      return 'no uncertainty recorded';
  }
}

/** A molar mass in g/mol to 3 decimals (`18.015`). */
export function molarMassText(grams: number): string {
  return `${grams.toFixed(3)} g/mol`;
}

const kjFormat = new Intl.NumberFormat('en-US', {
  minimumFractionDigits: 1,
  maximumFractionDigits: 3,
  useGrouping: false,
});

/** A J/mol number in kJ/mol for tables and charts (`-285830` → `−285.83`). */
export function kjFromJoules(joules: number): string {
  return kjFormat.format(joules / 1000 || 0).replace('-', '−');
}

/** Stale-derived notices in words, so staleness never rests on colour alone. */
export function staleWords(inputs: RevisionView['staleInputs']): string[] {
  if (!inputs?.length) return ['Out of date: an input has changed since this was derived.'];
  return inputs.map((i) => {
    const what = `input #${i.inputRevisionId} (${i.species}, ${i.phase})`;
    return i.supersededBy === null
      ? `Out of date: ${what} was retired.`
      : `Out of date: ${what} was superseded by revision #${i.supersededBy}.`;
  });
}
