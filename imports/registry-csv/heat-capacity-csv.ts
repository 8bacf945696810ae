import { z } from 'zod';
import { validateModel, type HeatCapacityModel } from '../../server/src/thermo';
import type { ParseResult, TextInput } from './csv-table';
import { cell, checkModification, checkReferences, readRows, rowError, sourceCells } from './cells';
import { speciesPhaseKey } from './formation-csv';
import type { CoefficientRange, CrossReferences, HeatCapacitySet } from './row-types';

const FILE = 'heat-capacity.csv';
export const HEAT_CAPACITY_COLUMNS = [
  'species',
  'phase',
  'modification',
  'model',
  't_min_k',
  't_max_k',
  'c1',
  'c2',
  'c3',
  'c4',
  'c5',
  'c6',
  'c7',
  'c8',
  'source',
  'from_memory',
  'notes',
] as const;

const schema = z.object({
  species: cell.required,
  phase: cell.phase,
  modification: cell.modification,
  model: z.enum(['nasa7', 'shomate'], { message: 'nasa7 or shomate' }),
  t_min_k: cell.kelvin,
  t_max_k: cell.kelvin,
  c1: cell.number,
  c2: cell.number,
  c3: cell.number,
  c4: cell.number,
  c5: cell.number,
  c6: cell.optionalNumber,
  c7: cell.optionalNumber,
  c8: cell.optionalNumber,
  ...sourceCells,
});

type Cells = z.infer<typeof schema>;
interface Row {
  readonly line: number;
  readonly c: Cells;
}

const coefficientsOf = (c: Cells): (string | null)[] => [
  c.c1,
  c.c2,
  c.c3,
  c.c4,
  c.c5,
  c.c6,
  c.c7,
  c.c8,
];

/** NASA: a1…a7 in c1…c7, c8 empty, two ranges meeting at the middle temperature. */
function nasaModel(
  rows: readonly Row[],
  report: (line: number, message: string, column?: string) => false,
): HeatCapacityModel | null {
  if (rows.length !== 2) {
    report(
      rows[0]!.line,
      `a nasa7 set has exactly two rows (low and high range), found ${rows.length}`,
    );
    return null;
  }
  const [low, high] = rows as [Row, Row];
  let ok = true;
  for (const r of rows) {
    if (r.c.c6 === null || r.c.c7 === null)
      ok = report(r.line, 'nasa7 needs a6 and a7 (c6, c7)', r.c.c6 === null ? 'c6' : 'c7');
    if (r.c.c8 !== null) ok = report(r.line, 'nasa7 has seven coefficients: leave c8 empty', 'c8');
  }
  if (Number(low.c.t_max_k) !== Number(high.c.t_min_k))
    ok = report(
      high.line,
      `the ranges must meet: ${low.c.t_max_k} K ≠ ${high.c.t_min_k} K`,
      't_min_k',
    );
  if (!ok) return null;
  return {
    kind: 'nasa7',
    tLow: Number(low.c.t_min_k),
    tMid: Number(low.c.t_max_k),
    tHigh: Number(high.c.t_max_k),
    low: coefficientsOf(low.c).slice(0, 7).map(Number),
    high: coefficientsOf(high.c).slice(0, 7).map(Number),
  };
}

/** Shomate: A…H in c1…c8 (F, G, H optional; F and H together), ranges contiguous. */
function shomateModel(
  rows: readonly Row[],
  report: (line: number, message: string, column?: string) => false,
): HeatCapacityModel | null {
  let ok = true;
  rows.forEach((r, i) => {
    if ((r.c.c6 === null) !== (r.c.c8 === null))
      ok = report(
        r.line,
        'give F (c6) and H (c8) together or neither',
        r.c.c6 === null ? 'c6' : 'c8',
      );
    const previous = rows[i - 1];
    if (previous !== undefined && Number(previous.c.t_max_k) !== Number(r.c.t_min_k))
      ok = report(
        r.line,
        `ranges must be contiguous: ${previous.c.t_max_k} K then ${r.c.t_min_k} K`,
        't_min_k',
      );
  });
  if (!ok) return null;
  return {
    kind: 'shomate',
    ranges: rows.map(({ c }) => ({
      tMin: Number(c.t_min_k),
      tMax: Number(c.t_max_k),
      A: Number(c.c1),
      B: Number(c.c2),
      C: Number(c.c3),
      D: Number(c.c4),
      E: Number(c.c5),
      ...(c.c6 === null ? {} : { F: Number(c.c6), H: Number(c.c8) }),
    })),
  };
}

/**
 * Heat-capacity rows grouped into one set per species-phase; the engine's model is built from
 * each set and checked by the engine's own validation.
 */
export function parseHeatCapacityCsv(
  input: TextInput,
  refs: CrossReferences = {},
): ParseResult<HeatCapacitySet> {
  const read = readRows(input, FILE, HEAT_CAPACITY_COLUMNS, schema, (c, line, report): Row => {
    checkModification(c.phase, c.modification, 'modification', report);
    checkReferences(refs, c.species, c.source, report);
    if (!(Number(c.t_min_k) < Number(c.t_max_k)))
      report('t_min_k must be below t_max_k', 't_max_k');
    return { line, c };
  });
  const errors = read.errors;
  const groups = new Map<string, Row[]>();
  for (const row of read.rows) {
    const id = speciesPhaseKey(row.c.species, row.c.phase, row.c.modification);
    groups.set(id, [...(groups.get(id) ?? []), row]);
  }
  const rows: HeatCapacitySet[] = [];
  for (const [id, group] of groups) {
    const first = group[0]!;
    const report = (line: number, message: string, column?: string): false =>
      rowError(errors, FILE, line, `${id}: ${message}`, column);
    const mixed = group.find((r) => r.c.model !== first.c.model || r.c.source !== first.c.source);
    if (mixed !== undefined) {
      report(
        mixed.line,
        `one set per species-phase: this row's model or source differs from line ${first.line}`,
      );
      continue;
    }
    const sorted = [...group].sort((a, b) => Number(a.c.t_min_k) - Number(b.c.t_min_k));
    const model =
      first.c.model === 'nasa7' ? nasaModel(sorted, report) : shomateModel(sorted, report);
    if (model === null) continue;
    try {
      validateModel(model);
    } catch (err) {
      report(first.line, (err as Error).message);
      continue;
    }
    const notes = [...new Set(group.map((r) => r.c.notes).filter((n): n is string => n !== null))];
    rows.push({
      line: first.line,
      species: first.c.species,
      phase: first.c.phase,
      modification: first.c.modification,
      kind: first.c.model,
      ranges: sorted.map((r): CoefficientRange => ({
        line: r.line,
        tMinK: r.c.t_min_k,
        tMaxK: r.c.t_max_k,
        coefficients: coefficientsOf(r.c),
      })),
      model,
      source: first.c.source,
      fromMemory: group.some((r) => r.c.from_memory),
      notes: notes.length === 0 ? null : notes.join(' '),
    });
  }
  return { rows, errors };
}
