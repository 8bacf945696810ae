import { z } from 'zod';
import { UNCERTAINTY_BASES } from '../../server/src/thermo';
import {
  readCsv,
  type CsvRecord,
  type ParseResult,
  type RowError,
  type TextInput,
} from './csv-table';
import { DECIMAL_PATTERN, ENERGY_UNITS, toJoulesPerMoleText } from './decimal-text';
import {
  DATA_PHASES,
  METHODS,
  type CrossReferences,
  type EnergyFields,
  type StandardPressurePa,
} from './row-types';

// zod schemas for single cells; an empty cell arrives as null.
const required = z.string({ message: 'required' });
export const cell = {
  required,
  optional: z.string().nullable(),
  decimal: required.regex(
    DECIMAL_PATTERN,
    'a plain decimal such as -285.83 (ASCII minus, no exponent)',
  ),
  positiveDecimal: z
    .string()
    .regex(/^\d+(\.\d+)?$/, 'a positive plain decimal such as 0.04')
    .refine((t) => /[1-9]/.test(t), 'must be greater than zero')
    .nullable(),
  number: required.regex(/^[+-]?\d+(\.\d+)?([eE][+-]?\d+)?$/, 'a number such as -3.0294E+04'),
  optionalNumber: z
    .string()
    .regex(/^[+-]?\d+(\.\d+)?([eE][+-]?\d+)?$/, 'a number such as -3.0294E+04')
    .nullable(),
  kelvin: required
    .regex(/^\d+(\.\d+)?$/, 'a temperature in kelvin such as 298.15')
    .refine((t) => Number(t) > 0, 'must be above 0 K'),
  phase: z.enum(DATA_PHASES, { message: `one of ${DATA_PHASES.join(', ')}` }),
  modification: z
    .string()
    .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'lowercase words with hyphens, e.g. graphite, alpha-quartz')
    .nullable(),
  unit: z.enum(ENERGY_UNITS, { message: `one of ${ENERGY_UNITS.join(', ')}` }),
  basis: z
    .enum(UNCERTAINTY_BASES, { message: `one of ${UNCERTAINTY_BASES.join(', ')}` })
    .nullable(),
  method: z.enum(METHODS, { message: `one of ${METHODS.join(', ')}` }),
  pressure: z
    .enum(['100000', '101325'], { message: '100000 (1 bar) or 101325 (1 atm)' })
    .transform((p) => Number(p) as StandardPressurePa),
  fromMemory: z.enum(['yes', 'no'], { message: 'yes or no' }).transform((v) => v === 'yes'),
};

/** The cells a value row ends with: where it came from, and notes. */
export const sourceCells = {
  source: cell.required,
  from_memory: cell.fromMemory,
  notes: cell.optional,
};

/** The cells of an energy value (ΔfH°, ΔtrsH) as its source printed it, then `sourceCells`. */
export const valueCells = {
  value: cell.decimal,
  unit: cell.unit,
  uncertainty: cell.positiveDecimal,
  uncertainty_basis: cell.basis,
  method: cell.method,
  standard_pressure_pa: cell.pressure,
  ...sourceCells,
};

/** How a row's checks report a problem: the message and the column it concerns. */
export type Report = (message: string, column: string) => void;

/**
 * Reads a CSV file's rows: each record's cells checked against `schema`, then `toRow` with a
 * report for that record's line. A row with any problem reported is left out of `rows`.
 */
export function readRows<S extends z.ZodType, T>(
  input: TextInput,
  file: string,
  columns: readonly string[],
  schema: S,
  toRow: (c: z.infer<S>, line: number, report: Report) => T | null,
): ParseResult<T> {
  const { records, errors } = readCsv(input, file, columns);
  const rows: T[] = [];
  for (const record of records) {
    const c = validateCells(schema, record, file, errors);
    if (c === null) continue;
    const before = errors.length;
    const row = toRow(c, record.line, (message, column) => {
      rowError(errors, file, record.line, message, column);
    });
    if (row !== null && errors.length === before) rows.push(row);
  }
  return { rows, errors };
}

/** Remembers where each identity first stood: a repeat's earlier line, else undefined. */
export function firstLines(): (id: string, line: number) => number | undefined {
  const first = new Map<string, number>();
  return (id, line) => {
    const earlier = first.get(id);
    if (earlier === undefined) first.set(id, line);
    return earlier;
  };
}

/** Validates one record's cells; schema issues become row errors naming their column. */
export function validateCells<S extends z.ZodType>(
  schema: S,
  record: CsvRecord,
  file: string,
  errors: RowError[],
): z.infer<S> | null {
  const result = schema.safeParse(record.cells);
  if (result.success) return result.data;
  for (const issue of result.error.issues) {
    const column = issue.path[0] === undefined ? undefined : String(issue.path[0]);
    errors.push({ file, line: record.line, column, message: issue.message });
  }
  return null;
}

/** Reports a problem with one row; returns false so checks can chain. */
export function rowError(
  errors: RowError[],
  file: string,
  line: number,
  message: string,
  column?: string,
): false {
  errors.push(column === undefined ? { file, line, message } : { file, line, column, message });
  return false;
}

/** value/unit/uncertainty cells → EnergyFields with exact J/mol text; reports a lone basis. */
function energyFields(
  cells: z.infer<z.ZodObject<typeof valueCells>>,
  report: Report,
): EnergyFields {
  if (cells.uncertainty === null && cells.uncertainty_basis !== null)
    report('a basis without an uncertainty', 'uncertainty_basis');
  if (cells.uncertainty !== null && cells.uncertainty_basis === null)
    report(
      'an uncertainty needs its basis (standard, expanded_k2 or as_stated)',
      'uncertainty_basis',
    );
  return {
    value: cells.value,
    unit: cells.unit,
    valueJPerMol: toJoulesPerMoleText(cells.value, cells.unit),
    uncertainty: cells.uncertainty,
    uncertaintyJPerMol:
      cells.uncertainty === null ? null : toJoulesPerMoleText(cells.uncertainty, cells.unit),
    uncertaintyBasis: cells.uncertainty_basis,
  };
}

/** The fields every value row ends with: its energy (exact J/mol too) and its provenance. */
export function valueFields(cells: z.infer<z.ZodObject<typeof valueCells>>, report: Report) {
  return {
    ...energyFields(cells, report),
    method: cells.method,
    standardPressurePa: cells.standard_pressure_pa,
    source: cells.source,
    fromMemory: cells.from_memory,
    notes: cells.notes,
  };
}

/** Modification labels belong to crystals only (graphite, calcite, rutile…). */
export function checkModification(
  phase: string,
  modification: string | null,
  column: string,
  report: Report,
): void {
  if (modification !== null && phase !== 'cr')
    report(`a modification (${modification}) is only given for phase cr`, column);
}

/** Species key and source id must exist when the caller passes the dataset's lists. */
export function checkReferences(
  refs: CrossReferences,
  species: string,
  source: string | null,
  report: Report,
): void {
  if (refs.species !== undefined && !refs.species.has(species))
    report(`unknown species key ${species}`, 'species');
  if (source !== null && refs.sources !== undefined && !refs.sources.has(source))
    report(`unknown source id ${source}`, 'source');
}
