import type { ProposalItemInput } from '@contracts/proposals/proposals-schemas';
import { numberValue } from '../../../shared/number-input/number-text';
import { type ItemFormValue, type Phase, PHASES, readRanges } from './item-form';

const optional = (text: string): string | undefined =>
  text.trim() === '' ? undefined : text.trim();

/**
 * One item as the API takes it, from the form as typed (valid fields assumed: the form is
 * checked first). Energies go in the unit chosen; the server converts them to J/mol.
 */
export function toItemInput(v: ItemFormValue): ProposalItemInput {
  const target = {
    species: v.species.trim(),
    phase: v.phase,
    modification: optional(v.modification),
  };
  const notes = optional(v.notes);
  const uncertainty = numberValue(v.uncertainty);
  const sourceId = (v.sourceId ?? '').trim();
  const evidence = {
    uncertainty,
    uncertaintyBasis: uncertainty === null ? null : v.uncertaintyBasis,
    standardPressure: v.standardPressure,
    sourceId,
    notes,
  };
  switch (v.kind) {
    case 'add_species':
      return {
        kind: 'add_species',
        key: v.key.trim(),
        name: v.name.trim(),
        formula: v.formula.trim(),
        charge: numberValue(v.charge) ?? 0,
        synonyms: [],
        casRn: optional(v.casRn),
        inchiKey: optional(v.inchiKey),
        phases: v.phase
          ? [{ phase: v.phase as Phase, modification: optional(v.modification) }]
          : [],
        notes,
      };
    case 'add_phase':
      return {
        kind: 'add_phase',
        ...target,
        phase: v.phase as Phase,
        sourceId: optional(sourceId),
        notes,
      };
    case 'retire_value':
      return { kind: 'retire_value', ...target, quantity: v.quantity, sourceId, notes };
    case 'derive_value':
      return {
        kind: 'derive_value',
        ...target,
        equation: v.equation.trim(),
        deltaH: numberValue(v.value) ?? 0,
        unit: v.unit,
        release: v.release,
        method: 'derived',
        ...evidence,
      };
    case 'add_value':
    case 'supersede_value': {
      const kind = v.kind;
      if (v.quantity === 'heat_capacity') {
        const ranges = readRanges(v.ranges);
        return {
          kind,
          ...target,
          quantity: 'heat_capacity',
          form: v.form,
          ranges: typeof ranges === 'string' ? [] : ranges,
          method: optional(v.method),
          standardPressure: v.standardPressure,
          sourceId,
          notes,
          fromMemory: false,
        };
      }
      const measured = {
        kind,
        ...target,
        value: numberValue(v.value) ?? 0,
        unit: v.unit,
        method: v.method.trim(),
        fromMemory: false,
        ...evidence,
      };
      return v.quantity === 'transition'
        ? {
            ...measured,
            quantity: 'transition',
            toPhase: v.toPhase,
            temperature: numberValue(v.temperature) ?? 0,
          }
        : { ...measured, quantity: 'formation_enthalpy' };
    }
  }
}

const str = (x: unknown): string | undefined =>
  typeof x === 'string' ? x : typeof x === 'number' ? String(x) : undefined;

/** The form's fields from an item as the API stored it (`items[].input`), for revising. */
export function fromItemInput(input: Record<string, unknown>): Partial<ItemFormValue> {
  const kind = str(input['kind']) as ItemFormValue['kind'] | undefined;
  const [phase, modification] = (str(input['phase']) ?? '').split(',');
  const phases = Array.isArray(input['phases'])
    ? (input['phases'] as { phase?: string; modification?: string }[])
    : [];
  const ranges = Array.isArray(input['ranges'])
    ? (input['ranges'] as { tMin: number; tMax: number; coefficients: (number | null)[] }[])
        .map((r) => [r.tMin, r.tMax, ...r.coefficients.map((c) => c ?? 0)].join(' '))
        .join('\n')
    : undefined;
  const toPhase = str(input['toPhase']);
  return {
    kind,
    quantity: (str(input['quantity']) as ItemFormValue['quantity']) ?? undefined,
    species: str(input['species']),
    phase: phase || phases[0]?.phase || undefined,
    modification: str(input['modification']) ?? modification ?? phases[0]?.modification,
    value: str(kind === 'derive_value' ? input['deltaH'] : input['value']),
    unit: str(input['unit']) as ItemFormValue['unit'] | undefined,
    uncertainty: str(input['uncertainty']),
    uncertaintyBasis:
      (str(input['uncertaintyBasis']) as ItemFormValue['uncertaintyBasis']) ?? undefined,
    method: kind === 'derive_value' ? undefined : str(input['method']),
    standardPressure: str(input['standardPressure']) as ItemFormValue['standardPressure'],
    sourceId: str(input['sourceId']),
    notes: str(input['notes']),
    key: str(input['key']),
    name: str(input['name']),
    formula: str(input['formula']),
    charge: str(input['charge']),
    casRn: str(input['casRn']),
    inchiKey: str(input['inchiKey']),
    equation: str(input['equation']),
    release: str(input['release']),
    form: str(input['form']) as ItemFormValue['form'] | undefined,
    ranges,
    toPhase: PHASES.includes(toPhase as Phase) ? (toPhase as Phase) : undefined,
    temperature: str(input['temperature']),
  };
}
