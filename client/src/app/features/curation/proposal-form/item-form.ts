import {
  type AbstractControl,
  FormControl,
  FormGroup,
  type ValidationErrors,
  type ValidatorFn,
  Validators,
} from '@angular/forms';

import type { ItemKind, ProposalItemInput } from '@contracts/proposals/proposals-schemas';
import { type EnergyUnit } from '../../../shared/energy-unit';
import { numberText, readNumber } from '../../../shared/number-input/number-text';

export type { ItemKind };
type Of<K extends ItemKind> = Extract<ProposalItemInput, { kind: K }>;
type ValueInput = Of<'add_value'> | Of<'supersede_value'>;
export type Quantity = ValueInput['quantity'];
export type UncertaintyBasis = NonNullable<Of<'derive_value'>['uncertaintyBasis']>;
export type StandardPressure = Of<'derive_value'>['standardPressure'];
export type HeatCapacityForm = Extract<ValueInput, { quantity: 'heat_capacity' }>['form'];

/** What one proposal item does, in the order the select offers them. */
export const ITEM_KINDS: readonly { kind: ItemKind; label: string }[] = [
  { kind: 'add_value', label: 'Add a value' },
  { kind: 'supersede_value', label: 'Replace a value' },
  { kind: 'retire_value', label: 'Retire a value' },
  { kind: 'add_species', label: 'Add a species' },
  { kind: 'add_phase', label: 'Add a phase' },
  { kind: 'derive_value', label: 'Derive ΔfH° from a measured reaction' },
];

export const QUANTITIES: readonly { quantity: Quantity; label: string }[] = [
  { quantity: 'formation_enthalpy', label: 'Enthalpy of formation ΔfH°' },
  { quantity: 'heat_capacity', label: 'Heat-capacity set' },
  { quantity: 'transition', label: 'Phase transition' },
];

export const UNCERTAINTY_BASES: readonly { basis: UncertaintyBasis; label: string }[] = [
  { basis: 'standard', label: 'Standard uncertainty' },
  { basis: 'expanded_k2', label: 'Expanded, k = 2' },
  { basis: 'as_stated', label: 'As the source states it' },
];

export const METHODS = [
  'combustion calorimetry',
  'reaction calorimetry',
  'equilibrium',
  'computed',
  'estimated',
] as const;

export const STANDARD_PRESSURES: readonly { pressure: StandardPressure; label: string }[] = [
  { pressure: '1 bar', label: '1 bar (100 kPa)' },
  { pressure: '1 atm', label: '1 atm (101.325 kPa)' },
];

export const HEAT_CAPACITY_FORMS: readonly { form: HeatCapacityForm; label: string }[] = [
  { form: 'nasa7', label: 'NASA 7-coefficient (two ranges of a1…a7)' },
  { form: 'shomate', label: 'Shomate (ranges of A…H)' },
];

export const PHASES = ['g', 'l', 'cr', 'am', 'aq'] as const;
export type Phase = (typeof PHASES)[number];

/** One item as typed: numbers stay text until read by the shared number parser. */
export interface ItemFormControls {
  kind: FormControl<ItemKind>;
  quantity: FormControl<Quantity>;
  species: FormControl<string>;
  phase: FormControl<string>;
  modification: FormControl<string>;
  value: FormControl<string>;
  unit: FormControl<EnergyUnit>;
  uncertainty: FormControl<string>;
  uncertaintyBasis: FormControl<UncertaintyBasis>;
  method: FormControl<string>;
  standardPressure: FormControl<StandardPressure>;
  sourceId: FormControl<string>;
  notes: FormControl<string>;
  /** add_species */
  key: FormControl<string>;
  name: FormControl<string>;
  formula: FormControl<string>;
  charge: FormControl<string>;
  casRn: FormControl<string>;
  inchiKey: FormControl<string>;
  /** derive_value: the measured reaction and the release the other values come from. */
  equation: FormControl<string>;
  release: FormControl<string>;
  /** heat-capacity set: one range a line, `tMin tMax c1 c2 …`. */
  form: FormControl<HeatCapacityForm>;
  ranges: FormControl<string>;
  /** transition */
  toPhase: FormControl<Phase>;
  temperature: FormControl<string>;
}
export type ItemForm = FormGroup<ItemFormControls>;
export type ItemFormValue = ReturnType<ItemForm['getRawValue']>;

const KEY = /^[a-z0-9][a-z0-9,()+-]*$/;
const CAS_RN = /^\d{2,7}-\d{2}-\d$/;
const INCHI_KEY = /^[A-Z]{14}-[A-Z]{10}-[A-Z]$/;
const MODIFICATION = /^[a-z0-9][a-z0-9 -]*$/;

/** Heat-capacity ranges, one a line: `tMin tMax c1 c2 …` (commas or spaces between). */
export function readRanges(
  text: string,
): { tMin: number; tMax: number; coefficients: number[] }[] | string {
  const lines = text.split('\n').filter((line) => line.trim() !== '');
  if (lines.length === 0) return 'Enter at least one range.';
  const ranges = [];
  for (const [i, line] of lines.entries()) {
    const numbers = line.trim().split(/[\s;]+|,\s+/);
    const read = numbers.map((n) => readNumber(n));
    const bad = read.findIndex((r) => !r.ok);
    if (bad !== -1) return `Line ${i + 1}: “${numbers[bad]}” is not a number.`;
    const values = read.map((r) => (r.ok ? r.value : 0));
    if (values.length < 7 || values.length > 10) {
      return `Line ${i + 1}: write tMin, tMax and 5 to 8 coefficients.`;
    }
    const [tMin, tMax, ...coefficients] = values;
    if (!(tMin > 0 && tMax > tMin)) return `Line ${i + 1}: tMax must be above tMin (K).`;
    ranges.push({ tMin, tMax, coefficients });
  }
  return ranges;
}

const rangesText: ValidatorFn = (control: AbstractControl<string>): ValidationErrors | null => {
  const read = readRanges(control.value ?? '');
  return typeof read === 'string' ? { ranges: { message: read } } : null;
};

const text = (value: string | undefined, validators: ValidatorFn[] = []) =>
  new FormControl(value ?? '', { nonNullable: true, validators });

/** A blank item; `value` fills any field (a draft read back, a revision after changes). */
export function itemForm(value: Partial<ItemFormValue> = {}): ItemForm {
  const form = new FormGroup<ItemFormControls>({
    kind: new FormControl<ItemKind>(value.kind ?? 'add_value', { nonNullable: true }),
    quantity: new FormControl<Quantity>(value.quantity ?? 'formation_enthalpy', {
      nonNullable: true,
    }),
    species: text(value.species, [Validators.required]),
    phase: text(value.phase, [Validators.required]),
    modification: text(value.modification, [Validators.pattern(MODIFICATION)]),
    value: text(value.value, [numberText({ required: true })]),
    unit: new FormControl<EnergyUnit>(value.unit ?? 'kJ/mol', { nonNullable: true }),
    uncertainty: text(value.uncertainty, [
      numberText({ min: 0, minMessage: 'An uncertainty is zero or more.' }),
    ]),
    uncertaintyBasis: new FormControl<UncertaintyBasis>(value.uncertaintyBasis ?? 'standard', {
      nonNullable: true,
    }),
    method: text(value.method, [Validators.required, Validators.maxLength(200)]),
    standardPressure: new FormControl<StandardPressure>(value.standardPressure ?? '1 bar', {
      nonNullable: true,
    }),
    sourceId: text(value.sourceId, [Validators.required]),
    notes: text(value.notes, [Validators.maxLength(4000)]),
    key: text(value.key, [Validators.required, Validators.pattern(KEY)]),
    name: text(value.name, [Validators.required, Validators.maxLength(300)]),
    formula: text(value.formula, [Validators.required, Validators.maxLength(200)]),
    charge: text(value.charge ?? '0', [numberText({ required: true, min: -20, max: 20 })]),
    casRn: text(value.casRn, [Validators.pattern(CAS_RN)]),
    inchiKey: text(value.inchiKey, [Validators.pattern(INCHI_KEY)]),
    equation: text(value.equation, [Validators.required]),
    release: text(value.release ?? 'latest', [Validators.required]),
    form: new FormControl<HeatCapacityForm>(value.form ?? 'nasa7', { nonNullable: true }),
    ranges: text(value.ranges, [rangesText]),
    toPhase: new FormControl<Phase>(value.toPhase ?? 'l', { nonNullable: true }),
    temperature: text(value.temperature, [numberText({ required: true, min: 0 })]),
  });
  applyKind(form);
  // The controls live and die with the form, so these subscriptions need no teardown.
  form.controls.kind.valueChanges.subscribe(() => applyKind(form));
  form.controls.quantity.valueChanges.subscribe(() => applyKind(form));
  return form;
}

type Field = keyof ItemFormControls;

/** The controls each kind asks for; the others are disabled, so they neither show nor count. */
export function activeFields(kind: ItemKind, quantity: Quantity): Field[] {
  const target: Field[] = ['kind', 'species', 'phase', 'modification', 'notes'];
  const evidence: Field[] = [
    'uncertainty',
    'uncertaintyBasis',
    'method',
    'standardPressure',
    'sourceId',
  ];
  switch (kind) {
    case 'add_species':
      return ['kind', 'key', 'name', 'formula', 'charge', 'casRn', 'inchiKey', 'phase', 'notes'];
    case 'add_phase':
      return [...target, 'sourceId'];
    case 'retire_value':
      return [...target, 'quantity', 'sourceId'];
    case 'derive_value':
      return [...target, 'equation', 'release', 'value', 'unit', ...evidence].filter(
        (f): f is Field => f !== 'method',
      );
    case 'add_value':
    case 'supersede_value': {
      const base: Field[] = [...target, 'quantity', 'standardPressure', 'sourceId'];
      if (quantity === 'heat_capacity') return [...base, 'method', 'form', 'ranges'];
      const measured: Field[] = [...base, ...evidence, 'value', 'unit'];
      return quantity === 'transition' ? [...measured, 'toPhase', 'temperature'] : measured;
    }
  }
}

/** Enables the controls of the item's kind and quantity, disables the rest. */
export function applyKind(form: ItemForm): void {
  const { kind, quantity } = form.getRawValue();
  const active = new Set(activeFields(kind, quantity));
  // Heat-capacity sets need no method; every other value does.
  const methodRequired = !(quantity === 'heat_capacity' && kind !== 'derive_value');
  form.controls.method.setValidators(
    methodRequired ? [Validators.required, Validators.maxLength(200)] : [Validators.maxLength(200)],
  );
  for (const [name, control] of Object.entries(form.controls) as [Field, AbstractControl][]) {
    const on = active.has(name);
    if (on && control.disabled) control.enable({ emitEvent: false });
    if (!on && control.enabled) control.disable({ emitEvent: false });
    control.updateValueAndValidity({ emitEvent: false });
  }
  form.updateValueAndValidity();
}
