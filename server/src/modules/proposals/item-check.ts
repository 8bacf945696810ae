import type { ItemDerivation, StoredPhase } from '../../../../schema';
import type { Database, Tx } from '../../db/client';
import { fieldPath } from '../../middleware/error-handler';
import type { HeatCapacityModel } from '../../thermo';
import { loadCheckData } from './check-data';
import { derivationMessage, derive, type SnapshotSource } from './derivation';
import { energy, heatModel, ItemContext, resolveSpecies, spKey, type Issue } from './item-rules';
import { ProposalItemInput, type ItemIssue, type ItemWarning } from './proposals-schemas';

export { storedFormula } from './item-rules';

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
  const data = await loadCheckData(
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
