import { shown, ThermoError } from '../errors/thermo-error';
import type { ParsedFormula } from '../formula/formula-parser';
import { molarMass } from '../formula/molar-mass';

export type EnergyUnit = 'J/mol' | 'kJ/mol' | 'kcal/mol';
export type SpecificEnergyUnit = 'J/kg' | 'kJ/kg' | 'MJ/kg';

/** Thermochemical calorie, exactly 4.184 J. */
export const THERMOCHEMICAL_CALORIE = 4.184;
/** Molar gas constant N_A·k of the 2019 SI defining constants, to the nine decimals tables print, J/(mol·K). */
export const GAS_CONSTANT = 8.314462618;
/** Standard reference temperature, K. */
export const STANDARD_TEMPERATURE = 298.15;

const MOLAR: Record<EnergyUnit, number> = {
  'J/mol': 1,
  'kJ/mol': 1000,
  'kcal/mol': 1000 * THERMOCHEMICAL_CALORIE,
};
const SPECIFIC: Record<SpecificEnergyUnit, number> = { 'J/kg': 1, 'kJ/kg': 1e3, 'MJ/kg': 1e6 };

function finite(value: number, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new ThermoError('invalid_input', `${what} must be a finite number`, { value });
  }
  return value;
}

function factor<U extends string>(table: Record<U, number>, unit: U): number {
  const f =
    typeof unit === 'string' && Object.prototype.hasOwnProperty.call(table, unit)
      ? table[unit]
      : undefined;
  if (f === undefined) {
    throw new ThermoError(
      'invalid_input',
      `unknown unit ${shown(unit)}; use ${Object.keys(table).join(', ')}`,
      { unit },
    );
  }
  return f;
}

export function toJoulesPerMole(value: number, unit: EnergyUnit): number {
  const joules = finite(value, 'the value') * factor(MOLAR, unit);
  if (!Number.isFinite(joules)) {
    throw new ThermoError(
      'invalid_input',
      `${value} ${unit} is too large: beyond ±${(Number.MAX_VALUE / factor(MOLAR, unit)).toPrecision(3)} ${unit}`,
      { value, unit },
    );
  }
  return joules;
}

export function fromJoulesPerMole(value: number, unit: EnergyUnit): number {
  return finite(value, 'the value') / factor(MOLAR, unit);
}

export function convertEnergy(value: number, from: EnergyUnit, to: EnergyUnit): number {
  if (from === to) {
    factor(MOLAR, from);
    return finite(value, 'the value');
  }
  return fromJoulesPerMole(toJoulesPerMole(value, from), to);
}

function resolveMolarMass(m: number | string | ParsedFormula): number {
  const grams = typeof m === 'number' ? m : molarMass(m);
  if (!Number.isFinite(grams) || grams <= 0) {
    throw new ThermoError('invalid_input', 'molar mass must be a positive number of g/mol', {
      molarMass: grams,
    });
  }
  return grams;
}

/** Molar quantity (J/mol) to a per-mass one: J/mol ÷ (g/mol) = J/g = kJ/kg. */
export function molarToSpecific(
  valueJPerMol: number,
  molarMassOrFormula: number | string | ParsedFormula,
  unit: SpecificEnergyUnit = 'kJ/kg',
): number {
  const perKg = (finite(valueJPerMol, 'the value') * 1000) / resolveMolarMass(molarMassOrFormula);
  return perKg / factor(SPECIFIC, unit);
}

export function specificToMolar(
  value: number,
  unit: SpecificEnergyUnit,
  molarMassOrFormula: number | string | ParsedFormula,
): number {
  const perKg = finite(value, 'the value') * factor(SPECIFIC, unit);
  return (perKg * resolveMolarMass(molarMassOrFormula)) / 1000;
}
