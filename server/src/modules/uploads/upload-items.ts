import type { UploadEntry } from '../../../../imports/proposal-upload';
import type { ProposalItemInput } from '../proposals/proposals-schemas';
import { valueKey } from './uploads-repository';

/** What turning rows into proposal items needs to know about the registry. */
export interface ItemContext {
  /** Source reference as written (key or id) → source id. */
  readonly sourceIds: ReadonlyMap<string, number>;
  /** `valueKey`s of the values accepted now: a row for one of them supersedes it. */
  readonly accepted: ReadonlySet<string>;
}

const PRESSURE = { 100000: '1 bar', 101325: '1 atm' } as const;
const optional = <T>(v: T | null): T | undefined => (v === null ? undefined : v);

/** Trailing empty coefficients are left out (NASA's c8, Shomate's missing F G H). */
function coefficients(list: readonly (string | null)[]): (number | null)[] {
  const out = list.map((c) => (c === null ? null : Number(c)));
  while (out.length > 0 && out[out.length - 1] === null) out.pop();
  return out;
}

/**
 * One upload entry → one proposal item (the contract of POST /api/v1/proposals). A value row
 * for a species-phase that already holds an accepted value of that quantity supersedes it;
 * otherwise it adds one (a new phase is created with its first value). The kind is one of two,
 * so TypeScript cannot pick a branch of the union: the service checks each item with the
 * contract's zod schema instead.
 */
export function entryToItem(entry: UploadEntry, ctx: ItemContext): ProposalItemInput {
  if (entry.layout === 'species') {
    const s = entry.parsed;
    return {
      kind: 'add_species',
      key: s.key,
      name: s.name,
      formula: s.formula,
      charge: s.charge,
      synonyms: [...s.synonyms],
      casRn: optional(s.casRn),
      inchi: optional(s.inchi),
      inchiKey: optional(s.inchiKey),
      smiles: optional(s.smiles),
      notes: optional(s.notes),
      phases: [],
    };
  }
  const p = entry.parsed;
  const phase = entry.layout === 'transition' ? entry.parsed.fromPhase : entry.parsed.phase;
  const modification =
    entry.layout === 'transition' ? entry.parsed.fromModification : entry.parsed.modification;
  const quantity =
    entry.layout === 'formation'
      ? 'formation_enthalpy'
      : entry.layout === 'heat_capacity'
        ? 'heat_capacity'
        : `transition:${entry.parsed.toPhase}${entry.parsed.toModification ? `,${entry.parsed.toModification}` : ''}`;
  const kind = ctx.accepted.has(valueKey(p.species, phase, modification, quantity))
    ? ('supersede_value' as const)
    : ('add_value' as const);
  const common = {
    kind,
    species: p.species,
    phase,
    modification: optional(modification),
    // An unknown source was reported on its row already; 0 never reaches a saved proposal.
    sourceId: String(ctx.sourceIds.get(p.source) ?? 0),
    notes: optional(p.notes),
    fromMemory: p.fromMemory,
  };
  if (entry.layout === 'heat_capacity') {
    const h = entry.parsed;
    return {
      ...common,
      quantity: 'heat_capacity',
      form: h.kind,
      ranges: h.ranges.map((r) => ({
        tMin: Number(r.tMinK),
        tMax: Number(r.tMaxK),
        coefficients: coefficients(r.coefficients),
      })),
      standardPressure: '1 bar',
    };
  }
  const e = entry.parsed;
  const measured = {
    value: Number(e.value),
    unit: e.unit,
    uncertainty: e.uncertainty === null ? null : Number(e.uncertainty),
    uncertaintyBasis: e.uncertaintyBasis,
    method: e.method,
    standardPressure: PRESSURE[e.standardPressurePa],
  };
  if (entry.layout === 'formation')
    return { ...common, quantity: 'formation_enthalpy', ...measured } as ProposalItemInput;
  const t = entry.parsed;
  return {
    ...common,
    quantity: 'transition',
    toPhase: t.toPhase,
    toModification: optional(t.toModification),
    temperature: Number(t.temperatureK),
    ...measured,
  } as ProposalItemInput;
}
