import type { ReleaseDiffRow } from '@contracts/releases/releases-schemas';
import { phaseName } from '../../../shared/phase-name';
import { kjFromJoulesText } from '../../species/species-format';

/** A diff row with the words and kJ/mol figures the table shows. */
export interface DiffViewRow extends ReleaseDiffRow {
  readonly phaseText: string;
  readonly quantityText: string;
  readonly oldKj: string | null;
  readonly newKj: string | null;
  readonly differenceKj: string | null;
  readonly sigmas: string | null;
}

/** `formation_enthalpy` → ΔfH°, `heat_capacity` → heat capacity, `transition:l` → to liquid. */
export function quantityText(quantity: string): string {
  if (quantity === 'formation_enthalpy') return 'ΔfH°';
  if (quantity === 'heat_capacity') return 'heat capacity';
  const [, target = ''] = quantity.split(':');
  const [phase, modification] = target.split(',');
  return `transition to ${phaseName(phase, modification ?? null)}`;
}

const minus = (text: string) => text.replace(/^-/, '−');
const signed = (text: string) => (/^-/.test(text) ? minus(text) : `+${text}`);

export function diffViewRow(row: ReleaseDiffRow): DiffViewRow {
  return {
    ...row,
    phaseText: phaseName(row.phase, row.modification),
    quantityText: quantityText(row.quantity),
    oldKj: row.oldValue === null ? null : kjFromJoulesText(row.oldValue),
    newKj: row.newValue === null ? null : kjFromJoulesText(row.newValue),
    differenceKj: row.differenceKjPerMol === null ? null : signed(row.differenceKjPerMol),
    sigmas: row.differenceInUncertainties === null ? null : minus(row.differenceInUncertainties),
  };
}

/** What the table sorts a column by: numbers as numbers, a missing number last. */
export function diffSortValue(row: DiffViewRow, column: string): string | number {
  const num = (text: string | null) => (text === null ? Number.NEGATIVE_INFINITY : Number(text));
  switch (column) {
    case 'species':
      return row.speciesName.toLowerCase();
    case 'old':
      return num(row.oldValue);
    case 'new':
      return num(row.newValue);
    case 'difference':
      return num(row.differenceKjPerMol);
    case 'sigmas':
      return row.differenceInUncertainties === null
        ? Number.NEGATIVE_INFINITY
        : Math.abs(Number(row.differenceInUncertainties));
    case 'quantity':
      return row.quantityText;
    case 'phase':
      return row.phaseText;
    default:
      return row.change;
  }
}

/** The filter: free text over names, keys, formulas and sources, and one kind of change. */
export interface DiffFilter {
  readonly text: string;
  readonly change: '' | ReleaseDiffRow['change'];
}

export function matchesDiffFilter(row: DiffViewRow, filter: DiffFilter): boolean {
  if (filter.change && row.change !== filter.change) return false;
  const text = filter.text.trim().toLowerCase();
  if (!text) return true;
  return [
    row.speciesName,
    row.speciesKey,
    row.formula,
    row.quantityText,
    row.oldSourceCitation ?? '',
    row.newSourceCitation ?? '',
  ].some((field) => field.toLowerCase().includes(text));
}
