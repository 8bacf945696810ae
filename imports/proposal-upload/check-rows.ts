import { stringify } from 'csv-stringify/sync';
import type { RowError } from '../registry-csv/csv-table';
import type {
  CrossReferences,
  FormationRow,
  HeatCapacitySet,
  SpeciesRow,
  TransitionRow,
} from '../registry-csv/row-types';
import { LAYOUT_NAMES, LAYOUTS, PARSERS, type Layout } from './layouts';
import type { FileError, RawUpload, RowProblem, UploadRow } from './upload-rows';

/** One future proposal item: the parsed row (or heat-capacity set) and the rows it came from. */
export type UploadEntry =
  | { readonly layout: 'species'; readonly rows: UploadRow[]; readonly parsed: SpeciesRow }
  | { readonly layout: 'formation'; readonly rows: UploadRow[]; readonly parsed: FormationRow }
  | {
      readonly layout: 'heat_capacity';
      readonly rows: UploadRow[];
      readonly parsed: HeatCapacitySet;
    }
  | { readonly layout: 'transition'; readonly rows: UploadRow[]; readonly parsed: TransitionRow };

export interface CheckedUpload extends RawUpload {
  /** Entries in upload order; rows with errors have none. */
  readonly entries: UploadEntry[];
}

/** The registry's species keys and source references an upload may cite. */
export interface KnownReferences {
  /** Species key → formula (as stored or as written; used for the reference-state check). */
  readonly species: ReadonlyMap<string, string>;
  /** Source keys and source ids (as text) that exist. */
  readonly sources: ReadonlySet<string>;
}

/** The code a curator's script can branch on, from the registry parser's message. */
function codeOf(e: RowError): string {
  if (e.message.startsWith('unknown species key')) return 'unknown_species';
  if (e.message.startsWith('unknown source id')) return 'unknown_source';
  if (e.message.includes('already on line')) return 'duplicate_row';
  if (e.message.includes('reference state')) return 'reference_state';
  if (e.column === 'formula' || e.column === 'charge') return 'formula';
  if (e.column !== undefined && /phase|modification/.test(e.column)) return 'phase';
  if (e.message.startsWith('expected ') && e.message.includes(' cells')) return 'cell_count';
  return 'invalid_value';
}

// The registry parser wants whole SpeciesRow objects; it reads only the key's formula.
function speciesRefs(known: ReadonlyMap<string, string>, added: SpeciesRow[]) {
  const map = new Map<string, SpeciesRow>();
  for (const [key, formula] of known) map.set(key, { key, formula } as SpeciesRow);
  for (const s of added) map.set(s.key, s);
  return map;
}

/**
 * Checks every row with the registry's own parser (zod cells, the engine's formula and phase
 * checks, references, duplicates) and groups valid rows into entries. Problems land on their
 * rows; header problems (a missing column) become file errors.
 */
export function checkRows(raw: RawUpload, known: KnownReferences): CheckedUpload {
  const fileErrors: FileError[] = [...raw.fileErrors];
  const entries: (UploadEntry & { first: number })[] = [];
  let addedSpecies: SpeciesRow[] = [];
  for (const layout of LAYOUT_NAMES) {
    const rows = raw.rows.filter((r) => r.layout === layout);
    if (rows.length === 0) continue;
    // XML rows become one-line CSV records (line n + 1), so errors map back to their rows.
    const byLine = new Map<number, UploadRow>();
    let text: string;
    if (raw.csvText !== undefined) {
      text = raw.csvText;
      for (const r of rows) byLine.set(r.line, r);
    } else {
      const columns = [...LAYOUTS[layout].columns];
      text = stringify([columns, ...rows.map((r) => columns.map((c) => r.cells[c] ?? ''))]);
      rows.forEach((r, i) => byLine.set(i + 2, r));
    }
    const refs: CrossReferences = {
      species: speciesRefs(known.species, addedSpecies),
      sources: known.sources,
    };
    const result = layout === 'species' ? PARSERS.species(text) : PARSERS[layout](text, refs);
    for (const e of result.errors) {
      const row = byLine.get(e.line);
      if (row === undefined) {
        fileErrors.push({ line: e.line, column: e.column, message: e.message });
        continue;
      }
      const problem: RowProblem = { code: codeOf(e), message: e.message };
      row.errors.push(e.column === undefined ? problem : { ...problem, column: e.column });
    }
    collect(layout, result.rows, byLine, entries);
    if (layout === 'species') addedSpecies = result.rows as SpeciesRow[];
  }
  const usable = entries.filter((e) => e.rows.every((r) => r.errors.length === 0));
  const inEntry = new Set(usable.flatMap((e) => e.rows));
  if (fileErrors.length === 0)
    for (const row of raw.rows)
      if (!inEntry.has(row) && row.errors.length === 0)
        row.errors.push({
          code: 'invalid_set',
          message: 'this row belongs to a heat-capacity set with errors on another row',
        });
  usable.sort((a, b) => a.first - b.first);
  return {
    ...raw,
    fileErrors,
    entries: usable.map(({ first: _first, ...e }) => e as UploadEntry),
  };
}

function collect(
  layout: Layout,
  parsed: readonly (SpeciesRow | FormationRow | HeatCapacitySet | TransitionRow)[],
  byLine: ReadonlyMap<number, UploadRow>,
  out: (UploadEntry & { first: number })[],
): void {
  for (const p of parsed) {
    const lines =
      layout === 'heat_capacity' ? (p as HeatCapacitySet).ranges.map((r) => r.line) : [p.line];
    const rows = lines.map((l) => byLine.get(l)).filter((r): r is UploadRow => r !== undefined);
    if (rows.length === 0) continue;
    out.push({
      layout,
      rows,
      parsed: p,
      first: Math.min(...rows.map((r) => r.n)),
    } as UploadEntry & {
      first: number;
    });
  }
}
