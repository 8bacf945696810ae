import { z } from 'zod';
import { parseFormula } from '../../server/src/thermo';
import type { ParseResult, TextInput } from './csv-table';
import { cell, firstLines, readRows, type Report } from './cells';
import type { SpeciesRow } from './row-types';

const FILE = 'species.csv';
export const SPECIES_COLUMNS = [
  'key',
  'name',
  'formula',
  'charge',
  'synonyms',
  'cas_rn',
  'inchi',
  'inchikey',
  'smiles',
  'notes',
] as const;

/** Registry keys: lowercase words (letters, digits) joined by hyphens, e.g. `2-methylpropane`. */
export const SPECIES_KEY = /^[a-z0-9]+(-[a-z0-9]+)*$/;

const schema = z.object({
  key: cell.required.regex(SPECIES_KEY, 'lowercase words with hyphens, e.g. carbon-dioxide'),
  name: cell.required,
  formula: cell.required,
  charge: cell.required.regex(/^[+-]?\d+$/, 'an integer such as 0, 1 or -2').transform(Number),
  synonyms: cell.optional,
  cas_rn: z
    .string()
    .regex(/^\d{2,7}-\d{2}-\d$/, 'a CAS RN such as 7732-18-5')
    .nullable(),
  inchi: z.string().startsWith('InChI=1S/', 'a standard InChI (InChI=1S/…)').nullable(),
  inchikey: z
    .string()
    .regex(/^[A-Z]{14}-[A-Z]{8}SA-[A-Z]$/, 'a standard InChIKey (14-8SA-1 letters)')
    .nullable(),
  smiles: cell.optional,
  notes: cell.optional,
});

/** CAS RN check digit: Σ (position from the right × digit) mod 10 over the digits before it. */
export function casCheckDigitValid(casRn: string): boolean {
  const digits = casRn.replace(/-/g, '');
  const body = digits.slice(0, -1);
  let sum = 0;
  for (let i = 0; i < body.length; i++) sum += (body.length - i) * Number(body[i]);
  return sum % 10 === Number(digits.slice(-1));
}

export function parseSpeciesCsv(input: TextInput): ParseResult<SpeciesRow> {
  const seenOn = firstLines();
  const once = (column: string, value: string | null, line: number, report: Report): void => {
    const earlier = value === null ? undefined : seenOn(`${column}\u0000${value}`, line);
    if (earlier !== undefined) report(`${column} ${value} already on line ${earlier}`, column);
  };
  return readRows(input, FILE, SPECIES_COLUMNS, schema, (c, line, report): SpeciesRow | null => {
    once('key', c.key, line, report);
    once('cas_rn', c.cas_rn, line, report);
    once('inchikey', c.inchikey, line, report);
    if (c.cas_rn !== null && !casCheckDigitValid(c.cas_rn))
      report(`CAS RN ${c.cas_rn} has a wrong check digit`, 'cas_rn');
    if ((c.inchi === null) !== (c.inchikey === null))
      report('give the InChI and the InChIKey together', c.inchi === null ? 'inchi' : 'inchikey');
    let parsed: ReturnType<typeof parseFormula> | null = null;
    try {
      parsed = parseFormula(c.formula);
    } catch (err) {
      report(`formula ${c.formula}: ${(err as Error).message}`, 'formula');
    }
    if (parsed !== null && parsed.charge !== c.charge)
      report(`charge ${c.charge} differs from the formula's ${parsed.charge}`, 'charge');
    const synonyms = (c.synonyms ?? '').split('|').map((s) => s.trim());
    if (c.synonyms !== null && synonyms.some((s) => s === ''))
      report('an empty synonym (synonyms are separated by |)', 'synonyms');
    if (parsed === null) return null;
    return {
      line,
      key: c.key,
      name: c.name,
      formula: c.formula,
      hill: parsed.hill,
      elements: parsed.elements,
      charge: c.charge,
      synonyms: c.synonyms === null ? [] : synonyms,
      casRn: c.cas_rn,
      inchi: c.inchi,
      inchiKey: c.inchikey,
      smiles: c.smiles,
      notes: c.notes,
    };
  });
}
