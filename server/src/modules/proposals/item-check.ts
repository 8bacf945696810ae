import { SPECIES_KEY_PATTERN, type ItemDerivation, type StoredPhase } from '../../../../schema';
import { casCheckDigitValid } from '../../../../imports/registry-csv';
import type { Database, Tx } from '../../db/client';
import { fieldPath } from '../../middleware/error-handler';
import { hillFormula, parseFormula, validateModel, type HeatCapacityModel } from '../../thermo';
import { derivationMessage, derive, type SnapshotSource } from './derivation';
import { proposalsRepository, type CheckData } from './proposals-repository';
import { ProposalItemInput, type ItemIssue, type ItemWarning } from './proposals-schemas';
import { toStoredJoules } from './values-si';

type Queryable = Database | Tx;

/** An item as it will be stored: the input beside what the service resolved from it. */
export interface ResolvedItem {
  seq: number;
  kind: ProposalItemInput['kind'];
  input: ProposalItemInput;
  speciesKey: string | null;
  phase: StoredPhase | null;
  modification: string | null;
  quantity: string | null;
  /** J/mol, exact decimal text. */
  value: string | null;
  uncertainty: string | null;
  sourceId: number | null;
  targetRevisionId: number | null;
  derivation: ItemDerivation | null;
  inputRevisionIds: number[];
  /** Heat-capacity items: the engine's model. */
  model: HeatCapacityModel | null;
  /** add_species: the Hill formula the engine printed. */
  hill: string | null;
}

export interface CheckResult {
  issues: ItemIssue[];
  warnings: ItemWarning[];
  /** Only when there are no issues. */
  items: ResolvedItem[];
}

const KEY_RE = new RegExp(SPECIES_KEY_PATTERN);
const CAS_RE = /^[0-9]{2,7}-[0-9]{2}-[0-9]$/;
const INCHIKEY_RE = /^[A-Z]{14}-[A-Z]{10}-[A-Z]$/;

const spKey = (key: string, phase: string, mod: string | null) => `${key}|${phase}|${mod ?? ''}`;

function splitPhase(text: string, modification?: string) {
  const [phase, mod] = text.split(',', 2) as [string, string | undefined];
  return { phase, modification: modification ?? mod?.trim() ?? null };
}

/**
 * Checks items against the registry without saving: zod shape, the engine's formula, charge
 * and heat-capacity checks, key and identifier formats, species, phases and sources that must
 * exist, the value each item would replace, and derivations. Returns row-level issues (which
 * block saving) and warnings (likely duplicate species), and the resolved items when clean.
 */
export async function checkAndResolve(
  db: Queryable,
  raw: readonly unknown[],
  snapshots: SnapshotSource,
): Promise<CheckResult> {
  const issues: ItemIssue[] = [];
  const warnings: ItemWarning[] = [];
  const parsed: { index: number; item: ProposalItemInput }[] = [];
  raw.forEach((r, index) => {
    const res = ProposalItemInput.safeParse(r);
    if (res.success) parsed.push({ index, item: res.data });
    else
      for (const i of res.error.issues.slice(0, 5))
        issues.push({
          index,
          path: fieldPath(['items', index, ...i.path]),
          code: 'invalid_item',
          message: i.message,
        });
  });
  const data = await proposalsRepository.checkData(
    db,
    parsed.map((p) => p.item),
  );
  const out: ResolvedItem[] = [];
  const ctx = new ItemContext(data);
  for (const { index, item } of parsed) {
    const issue = (field: string, code: string, message: string) =>
      issues.push({ index, path: `items[${index}]${field ? `.${field}` : ''}`, code, message });
    const resolved = await resolveOne(item, index, ctx, issue, warnings, snapshots);
    if (resolved) out.push({ ...resolved, seq: index });
  }
  return { issues, warnings, items: issues.length === 0 ? out : [] };
}

/** What earlier items of the same proposal add (species, phases) and claim (values). */
class ItemContext {
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

type Issue = (field: string, code: string, message: string) => void;

async function resolveOne(
  item: ProposalItemInput,
  index: number,
  ctx: ItemContext,
  issue: Issue,
  warnings: ItemWarning[],
  snapshots: SnapshotSource,
): Promise<Omit<ResolvedItem, 'seq'> | null> {
  const base: Omit<ResolvedItem, 'seq' | 'kind' | 'input'> = {
    speciesKey: null,
    phase: null,
    modification: null,
    quantity: null,
    value: null,
    uncertainty: null,
    sourceId: null,
    targetRevisionId: null,
    derivation: null,
    inputRevisionIds: [],
    model: null,
    hill: null,
  };
  const r = { ...base, kind: item.kind, input: item };
  if ('sourceId' in item && item.sourceId !== undefined) {
    r.sourceId = Number(item.sourceId);
    if (!ctx.data.sources.has(r.sourceId))
      issue('sourceId', 'unknown_source', `There is no source ${item.sourceId}`);
  }

  if (item.kind === 'add_species') {
    resolveSpecies(item, index, ctx, issue, warnings, r);
    return r;
  }

  // Every other kind is about one species-phase.
  const key = item.species ?? null;
  const phaseText = 'phase' in item ? item.phase : undefined;
  if (item.kind === 'retire_value' && item.revisionId !== undefined && !key) {
    const rev = ctx.data.revisionsById.get(item.revisionId);
    if (!rev) {
      issue('revisionId', 'unknown_revision', `There is no revision ${item.revisionId}`);
      return null;
    }
    if (rev.status !== 'accepted')
      issue(
        'revisionId',
        'target_not_current',
        `Revision ${rev.id} is ${rev.status}, not accepted: only the current value can be retired`,
      );
    Object.assign(r, {
      speciesKey: rev.speciesKey,
      phase: rev.phase,
      modification: rev.modification,
      quantity: rev.quantity,
      targetRevisionId: rev.id,
    });
    return r;
  }
  const species = key ? ctx.speciesOf(key) : null;
  if (!key || !species) {
    issue(
      'species',
      'unknown_species',
      `There is no species with key ${JSON.stringify(key)} (add it with an add_species item first)`,
    );
    return null;
  }
  r.speciesKey = key;
  const split = splitPhase(
    phaseText ?? 'g',
    'modification' in item ? item.modification : undefined,
  );
  let phase = split.phase;
  const modification = split.modification;
  const phases = ctx.phasesOf(key);
  if (phase === 's') {
    const solids = phases.filter(
      (p) =>
        (p.phase === 'cr' || p.phase === 'am') &&
        (modification === null || p.modification === modification),
    );
    if (solids.length !== 1) {
      issue(
        'phase',
        'ambiguous_phase',
        solids.length === 0
          ? `${key} has no solid phase yet: write cr or am`
          : `${key} has several solid phases: write one of ${solids.map((p) => p.phase + (p.modification ? `,${p.modification}` : '')).join(', ')}`,
      );
      return null;
    }
    phase = solids[0]!.phase;
  }
  r.phase = phase as StoredPhase;
  r.modification = modification;
  const id = spKey(key, phase, modification);
  const existingPhase = phases.find((p) => p.phase === phase && p.modification === modification);

  if (item.kind === 'add_phase') {
    if (existingPhase)
      issue('phase', 'phase_exists', `${key} already has phase ${phaseText ?? phase}`);
    ctx.newPhases.add(id);
    return r;
  }

  // Value kinds: quantity, SI value, target.
  if (item.kind === 'derive_value') r.quantity = 'formation_enthalpy';
  else if (item.kind === 'retire_value') r.quantity = item.quantity ?? 'formation_enthalpy';
  else if (item.quantity === 'transition')
    r.quantity = `transition:${item.toPhase}${item.toModification ? `,${item.toModification}` : ''}`;
  else r.quantity = item.quantity;
  const claim = `${id}|${r.quantity}`;
  if (ctx.claimed.has(claim))
    issue(
      '',
      'duplicate_item',
      `Another item of this proposal already changes ${r.quantity} of ${key} (${phase})`,
    );
  ctx.claimed.add(claim);
  if (!existingPhase) ctx.newPhases.add(id);
  const current = existingPhase?.id
    ? ctx.data.accepted.get(`${existingPhase.id}|${r.quantity}`)
    : undefined;

  if (item.kind === 'add_value' || item.kind === 'supersede_value') {
    if (item.quantity === 'heat_capacity') {
      r.model = heatModel(item.form, item.ranges, issue);
    } else {
      const v = energy(item.value, item.unit, 'value', issue);
      const u =
        item.uncertainty == null ? null : energy(item.uncertainty, item.unit, 'uncertainty', issue);
      r.value = v?.text ?? null;
      r.uncertainty = u?.text ?? null;
      if (item.quantity === 'transition' && v && v.joules <= 0)
        issue('value', 'invalid_value', 'ΔtrsH is given in the heating direction and is positive');
    }
    if (item.kind === 'add_value' && current)
      issue(
        'kind',
        'value_exists',
        `${key} (${phase}) already has an accepted ${r.quantity} value (revision ${current.id}): use supersede_value`,
      );
    if (item.kind === 'supersede_value') {
      if (!current)
        issue(
          'kind',
          'no_current_value',
          `${key} (${phase}) has no accepted ${r.quantity} value to supersede: use add_value`,
        );
      else if (item.supersedes !== undefined && item.supersedes !== current.id)
        issue(
          'supersedes',
          'target_not_current',
          `Revision ${item.supersedes} is not the current value; the accepted revision is ${current.id}`,
        );
      r.targetRevisionId = current?.id ?? null;
    }
  } else if (item.kind === 'retire_value') {
    if (!current)
      issue(
        'quantity',
        'no_current_value',
        `${key} (${phase}) has no accepted ${r.quantity} value to retire`,
      );
    else if (item.revisionId !== undefined && item.revisionId !== current.id)
      issue(
        'revisionId',
        'target_not_current',
        `Revision ${item.revisionId} is not the current value; the accepted revision is ${current.id}`,
      );
    r.targetRevisionId = current?.id ?? null;
  } else {
    // derive_value: replaces the accepted value when there is one.
    r.targetRevisionId = current?.id ?? null;
    const dh = energy(item.deltaH, item.unit, 'deltaH', issue);
    const du =
      item.uncertainty == null ? null : energy(item.uncertainty, item.unit, 'uncertainty', issue);
    if (dh && (item.uncertainty == null || du)) {
      try {
        const snap = await snapshots(item.release);
        const d = derive(
          snap,
          { key, formula: species.formula, charge: species.charge, phase: r.phase, modification },
          {
            equation: item.equation,
            deltaH: dh.joules,
            uncertainty: du?.joules ?? null,
            uncertaintyBasis: item.uncertaintyBasis ?? (du ? 'as_stated' : null),
            release: item.release,
          },
        );
        const { joules: _j, uncertaintyJoules: _u, inputRevisionIds, ...derivation } = d;
        r.derivation = derivation;
        r.value = d.value;
        r.uncertainty = d.valueUncertainty;
        r.inputRevisionIds = inputRevisionIds;
      } catch (err) {
        const m = derivationMessage(err);
        if (!m) throw err;
        issue(m.code === 'unknown_release' ? 'release' : 'equation', m.code, m.message);
      }
    }
  }
  return r;
}

function energy(value: number, unit: 'kJ/mol' | 'kcal/mol' | 'J/mol', field: string, issue: Issue) {
  try {
    return toStoredJoules(value, unit);
  } catch (err) {
    const m = derivationMessage(err);
    if (!m) throw err;
    issue(field, 'invalid_value', m.message);
    return null;
  }
}

function heatModel(
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

function resolveSpecies(
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
