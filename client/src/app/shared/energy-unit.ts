/** Molar energy units the API accepts and answers in. */
export type EnergyUnit = 'kJ/mol' | 'kcal/mol' | 'J/mol';

export const ENERGY_UNITS: readonly EnergyUnit[] = ['kJ/mol', 'kcal/mol', 'J/mol'];

export const DEFAULT_ENERGY_UNIT: EnergyUnit = 'kJ/mol';

const valueFormat = new Intl.NumberFormat('en-US', {
  maximumFractionDigits: 2,
  useGrouping: false,
});

const spreadFormat = new Intl.NumberFormat('en-US', {
  maximumSignificantDigits: 2,
  useGrouping: false,
});

const factorFormat = new Intl.NumberFormat('en-US', {
  maximumFractionDigits: 4,
  useGrouping: false,
});

/** An enthalpy as shown in results: decimal point, no grouping, at most 2 decimals. */
export function formatValue(value: number): string {
  return valueFormat.format(value === 0 ? 0 : value);
}

/** A multiplier or scale factor: at most 4 decimals (`0.5`, `3`, `0.3333`). */
export function formatFactor(value: number): string {
  return factorFormat.format(value === 0 ? 0 : value);
}

/** `206.1 kJ/mol`, or `206.1 ± 0.54 kJ/mol` when an uncertainty is known (2 significant digits). */
export function formatEnergy(value: number, unit: string, uncertainty?: number | null): string {
  const spread =
    uncertainty === null || uncertainty === undefined
      ? ''
      : ` ± ${spreadFormat.format(uncertainty)}`;
  return `${formatValue(value)}${spread} ${unit}`;
}
