import type { EnergyUnit } from '../../../shared/energy-unit';
import { readNumber } from '../../../shared/number-input/number-text';

/** J/mol per unit; the calorie is the thermochemical one (4.184 J exactly, by definition). */
const JOULES_PER: Readonly<Record<EnergyUnit, number>> = {
  'J/mol': 1,
  'kJ/mol': 1000,
  'kcal/mol': 4184,
};

// 15 significant digits hide binary noise (1.1 × 4184 = 4602.400000000001) and keep every
// digit a person can type.
const siFormat = new Intl.NumberFormat('en-US', {
  maximumSignificantDigits: 15,
  useGrouping: false,
});

/**
 * What the server will store for a typed value, in J/mol, written with a real minus sign; ''
 * while the text is empty or cannot be read (the field shows why). A preview only: the server
 * does the conversion that counts.
 */
export function siPreview(text: string, unit: EnergyUnit): string {
  const reading = readNumber(text);
  if (!reading.ok) return '';
  const joules = reading.value * JOULES_PER[unit];
  return `${siFormat.format(joules === 0 ? 0 : joules).replace('-', '−')} J/mol`;
}
