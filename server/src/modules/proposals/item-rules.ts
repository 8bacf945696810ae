import { SPECIES_KEY_PATTERN, type StoredPhase } from '../../../../schema';
import { casCheckDigitValid } from '../../../../imports/registry-csv';
import { hillFormula, parseFormula, validateModel, type HeatCapacityModel } from '../../thermo';
import type { CheckData } from './check-data';
import { derivationMessage } from './derivation';
import type { ResolvedItem } from './item-check';
import type { ItemWarning, ProposalItemInput } from './proposals-schemas';
import { toStoredJoules } from './values-si';

/** Checks of single fields and of new species, shared by every item kind. */

const KEY_RE = new RegExp(SPECIES_KEY_PATTERN);
const CAS_RE = /^[0-9]{2,7}-[0-9]{2}-[0-9]$/;
const INCHIKEY_RE = /^[A-Z]{14}-[A-Z]{10}-[A-Z]$/;

export const spKey = (key: string, phase: string, mod: string | null) =>
  `${key}|${phase}|${mod ?? ''}`;

/** What earlier items of the same proposal add (species, phases) and claim (values). */
export class ItemContext {
  readonly newSpecies = new Map<string, { formula: string; charge: number; phases: Set<string> }>();
  readonly newPhases = new Set<string>();
  readonly claimed = new Set<string>();
  constructor(readonly data: CheckData) {}

  speciesOf(key: string) {
    const existing = this.data.species.get(key);
    if (existing) return { formula: existing.formula, charge: existing.charge, existing };
    const added = this.newSpecies.get(key);
    return added ? { formula: added.formula, charge: added.charge, existing: null } : null;
  }

  phasesOf(key: string): { phase: StoredPhase; modification: string | null; id: number | null }[] {
    const existing = (this.data.phases.get(key) ?? []).map((p) => ({ ...p }));
    const added = [...this.newPhases]
      .filter((k) => k.startsWith(`${key}|`))
      .map((k) => {
        const [, phase, mod] = k.split('|');
        return { phase: phase as StoredPhase, modification: mod || null, id: null };
      });
    return [...existing, ...added];
  }
}

export type Issue = (field: string, code: string, message: string) => void;

export function energy(
  value: number,
  unit: 'kJ/mol' | 'kcal/mol' | 'J/mol',
  field: string,
  issue: Issue,
) {
  try {
    return toStoredJoules(value, unit);
  } catch (err) {
    const m = derivationMessage(err);
    if (!m) throw err;
    issue(field, 'invalid_value', m.message);
    return null;
  }
}

export function heatModel(
  form: 'nasa7' | 'shomate',
  ranges: readonly { tMin: number; tMax: number; coefficients: readonly (number | null)[] }[],
  issue: Issue,
): HeatCapacityModel | null {
  let model: HeatCapacityModel;
  if (form === 'nasa7') {
    const [low, high] = ranges;
    if (ranges.length !== 2 || !low || !high) {
      issue(
        'ranges',
        'invalid_heat_capacity',
        `a NASA 7-coefficient set has exactly two ranges (low and high), found ${ranges.length}`,
      );
      return null;
    }
    if (
      ![low, high].every(
        (r) => r.coefficients.length === 7 && r.coefficients.every((c) => c !== null),
      )
    ) {
      issue('ranges', 'invalid_heat_capacity', 'each NASA range has seven coefficients a1…a7');
      return null;
    }
    if (low.tMax !== high.tMin) {
      issue(
        'ranges[1].tMin',
        'invalid_heat_capacity',
        `the ranges must meet: ${low.tMax} K ≠ ${high.tMin} K`,
      );
      return null;
    }
    model = {
      kind: 'nasa7',
      tLow: low.tMin,
      tMid: low.tMax,
      tHigh: high.tMax,
      low: low.coefficients as number[],
      high: high.coefficients as number[],
    };
  } else {
    for (const [i, r] of ranges.entries()) {
      const [A, B, C, D, E, F, , H] = r.coefficients;
      if ([A, B, C, D, E].some((c) => c == null) || (F == null) !== (H == null)) {
        issue(
          `ranges[${i}].coefficients`,
          'invalid_heat_capacity',
          'Shomate needs A…E; give F and H together or neither',
        );
        return null;
      }
      if (i > 0 && ranges[i - 1]!.tMax !== r.tMin) {
        issue(
          `ranges[${i}].tMin`,
          'invalid_heat_capacity',
          `ranges must be contiguous: ${ranges[i - 1]!.tMax} K then ${r.tMin} K`,
        );
        return null;
      }
    }
    model = {
      kind: 'shomate',
      ranges: ranges.map((r) => {
        const [A, B, C, D, E, F, , H] = r.coefficients as number[];
        return {
          tMin: r.tMin,
          tMax: r.tMax,
          A: A!,
          B: B!,
          C: C!,
          D: D!,
          E: E!,
          ...(F != null ? { F, H: H! } : {}),
        };
      }),
    };
  }
  try {
    return validateModel(model);
  } catch (err) {
    const m = derivationMessage(err);
    if (!m) throw err;
    issue('ranges', 'invalid_heat_capacity', m.message);
    return null;
  }
}

/** The registry stores the Hill formula with its charge, as the engine prints it. */
export function storedFormula(item: { formula: string; charge: number }): string {
  const parsed = parseFormula(item.formula);
  return parsed.charge !== 0 || item.charge === 0
    ? parsed.hill
    : hillFormula(parsed.elements, item.charge);
}

export function resolveSpecies(
  item: Extract<ProposalItemInput, { kind: 'add_species' }>,
  index: number,
  ctx: ItemContext,
  issue: Issue,
  warnings: ItemWarning[],
  r: Omit<ResolvedItem, 'seq'>,
) {
  if (!KEY_RE.test(item.key))
    issue(
      'key',
      'invalid_key',
      'a key is lower-case words joined by hyphens, e.g. 2-methylpropane',
    );
  if (ctx.data.species.has(item.key) || ctx.newSpecies.has(item.key))
    issue('key', 'key_taken', `The key ${item.key} is already taken`);
  let hill: string | null = null;
  try {
    const parsed = parseFormula(item.formula);
    if (parsed.charge !== 0 && parsed.charge !== item.charge)
      issue(
        'charge',
        'charge_mismatch',
        `the formula carries charge ${parsed.charge} but charge is ${item.charge}`,
      );
    hill = storedFormula(item);
    r.hill = hill;
  } catch (err) {
    const m = derivationMessage(err);
    if (!m) throw err;
    issue(
      'formula',
      m.code === 'parse_error' || m.code === 'unknown_element' ? 'invalid_formula' : m.code,
      m.message,
    );
  }
  if (item.casRn !== undefined && (!CAS_RE.test(item.casRn) || !casCheckDigitValid(item.casRn)))
    issue(
      'casRn',
      'invalid_cas',
      `${item.casRn} is not a CAS Registry Number (form 1234-56-7 with a valid check digit)`,
    );
  if (item.inchiKey !== undefined && !INCHIKEY_RE.test(item.inchiKey))
    issue(
      'inchiKey',
      'invalid_inchikey',
      'an InChIKey has the shape XXXXXXXXXXXXXX-XXXXXXXXXX-X (capital letters)',
    );
  if (item.inchi !== undefined && !item.inchi.startsWith('InChI='))
    issue('inchi', 'invalid_inchi', 'an InChI starts with InChI=');
  r.speciesKey = item.key;
  const phases = new Set<string>();
  for (const p of item.phases) {
    const k = spKey(item.key, p.phase, p.modification ?? null);
    phases.add(k);
    ctx.newPhases.add(k);
  }
  ctx.newSpecies.set(item.key, { formula: hill ?? item.formula, charge: item.charge, phases });
  for (const d of ctx.data.duplicates(item, hill)) {
    warnings.push({
      index,
      path: `items[${index}].${d.field}`,
      code: 'likely_duplicate',
      message: d.message,
      species: d.key,
    });
  }
}
