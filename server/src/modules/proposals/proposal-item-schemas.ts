import { z } from 'zod';
import {
  HEAT_CAPACITY_FORMS,
  STANDARD_PRESSURES,
  STORED_PHASES,
  UNCERTAINTY_BASIS_VALUES,
} from '../../../../schema';

/**
 * Items of a proposal (issue 7), the request side shared by the proposals routes and bulk upload.
 *
 * Item kinds (`kind`):
 * - `add_value` / `supersede_value` — a new value of one species-phase. `quantity` chooses the
 *   shape: `formation_enthalpy` (the fixed fields of issue 7), `heat_capacity` (`form` nasa7 with
 *   exactly two ranges of 7 coefficients a1…a7, or shomate with one or more ranges of 5–8
 *   coefficients A…H), `transition` (`toPhase`, `toModification`, `temperature` in K, ΔtrsH as
 *   `value`). `supersede_value` replaces the accepted revision of the same species-phase and
 *   quantity; `supersedes` (a revision id) pins which one was meant — without it the revision
 *   accepted when the proposal is submitted is the target.
 * - `retire_value` — withdraws the accepted revision (`revisionId`, or the accepted one of
 *   `species`/`phase`/`quantity`) without replacement; `sourceId` says why.
 * - `add_species` — a new species (formula checked by the engine, key format, charge, CAS RN
 *   check digit, InChIKey shape) with its first phases; duplicates are warnings, not errors.
 * - `add_phase` — a new phase (and modification) of an existing species, or of one added by an
 *   earlier item of the same proposal.
 * - `derive_value` — ΔfH° derived from a measured reaction enthalpy (`equation`, `deltaH` in
 *   `unit`) and the other species' values in `release`; method is always `derived`.
 *
 * Species are named by registry key (`methane`); a phase is `g l cr s am aq`, optionally with a
 * modification after a comma (`cr,graphite`) or in `modification`. `s` means cr or am when the
 * species has exactly one of them. Energies arrive in kJ/mol, kcal/mol (thermochemical calorie,
 * 4.184 J) or J/mol and are stored exactly in J/mol. `sourceId` is a source's id (text or number).
 */

export const Phase = z.enum(STORED_PHASES);
const PhaseText = z
  .string()
  .trim()
  .regex(
    /^(g|l|cr|s|am|aq)(,[a-z0-9][a-z0-9 -]*)?$/,
    'a phase is g, l, cr, s, am or aq, optionally with a modification: cr,graphite',
  );
const Modification = z
  .string()
  .trim()
  .regex(/^[a-z0-9][a-z0-9 -]*$/, 'a modification is lower-case words: graphite, calcite')
  .max(60);
const SpeciesKey = z.string().trim().min(1).max(200);
export const EnergyUnit = z.enum(['kJ/mol', 'kcal/mol', 'J/mol']);
export const UncertaintyBasis = z.enum(UNCERTAINTY_BASIS_VALUES);
const Finite = z.number().finite();
const NonNegative = z.number().finite().min(0);
/** A source's id; the fixed contract sends it as text, numbers are accepted too. */
export const SourceIdField = z
  .union([
    z.string().regex(/^[1-9][0-9]{0,9}$/, 'a source id is a positive whole number'),
    z.number().int().positive(),
  ])
  .transform(String);
const RevisionId = z.number().int().positive().max(2_147_483_647);
const Method = z.string().trim().min(1).max(200);
const Notes = z.string().max(4000).optional();
const Pressure = z.enum(STANDARD_PRESSURES).default('1 bar');

const Target = { species: SpeciesKey, phase: PhaseText, modification: Modification.optional() };
const Measured = {
  value: Finite,
  unit: EnergyUnit,
  uncertainty: NonNegative.nullable().optional(),
  uncertaintyBasis: UncertaintyBasis.nullable().optional(),
  method: Method,
  standardPressure: Pressure,
  sourceId: SourceIdField,
  notes: Notes,
  fromMemory: z.boolean().default(false),
};

export const HeatCapacityRangeInput = z.object({
  tMin: z.number().finite().positive(),
  tMax: z.number().finite().positive(),
  coefficients: z.array(Finite.nullable()).min(5).max(8),
});

const FormationValue = z.object({
  ...Target,
  quantity: z.literal('formation_enthalpy'),
  ...Measured,
});
const HeatCapacityValue = z.object({
  ...Target,
  quantity: z.literal('heat_capacity'),
  form: z.enum(HEAT_CAPACITY_FORMS),
  ranges: z.array(HeatCapacityRangeInput).min(1).max(8),
  method: Method.optional(),
  standardPressure: Pressure,
  sourceId: SourceIdField,
  notes: Notes,
  fromMemory: z.boolean().default(false),
});
const TransitionValue = z.object({
  ...Target,
  quantity: z.literal('transition'),
  toPhase: Phase,
  toModification: Modification.optional(),
  /** K. */
  temperature: z.number().finite().positive(),
  ...Measured,
});

const AddKind = { kind: z.literal('add_value') };
const SupersedeKind = {
  kind: z.literal('supersede_value'),
  /** The accepted revision meant; without it, the one accepted at submission. */
  supersedes: RevisionId.optional(),
};

export const AddValueItem = z.discriminatedUnion('quantity', [
  FormationValue.extend(AddKind).strict(),
  HeatCapacityValue.extend(AddKind).strict(),
  TransitionValue.extend(AddKind).strict(),
]);
export const SupersedeValueItem = z.discriminatedUnion('quantity', [
  FormationValue.extend(SupersedeKind).strict(),
  HeatCapacityValue.extend(SupersedeKind).strict(),
  TransitionValue.extend(SupersedeKind).strict(),
]);

export const RetireValueItem = z
  .object({
    kind: z.literal('retire_value'),
    /** The accepted revision to retire; or name it by species, phase and quantity. */
    revisionId: RevisionId.optional(),
    species: SpeciesKey.optional(),
    phase: PhaseText.optional(),
    modification: Modification.optional(),
    /** `formation_enthalpy`, `heat_capacity` or `transition:<to phase>[,<modification>]`. */
    quantity: z.string().max(80).optional(),
    sourceId: SourceIdField,
    notes: Notes,
  })
  .strict()
  .refine((i) => i.revisionId !== undefined || (i.species && i.phase && i.quantity), {
    message: 'name the revision to retire: revisionId, or species, phase and quantity',
  });

export const NewPhase = z.object({ phase: Phase, modification: Modification.optional() }).strict();

export const AddSpeciesItem = z
  .object({
    kind: z.literal('add_species'),
    /** Registry key: lower-case words joined by hyphens (`2-methylpropane`). */
    key: z.string().trim().min(1).max(120),
    name: z.string().trim().min(1).max(300),
    /** Any notation the engine reads (`CH4`, `SO4^2-`); stored in Hill order. */
    formula: z.string().trim().min(1).max(200),
    charge: z.number().int().min(-20).max(20).default(0),
    synonyms: z.array(z.string().trim().min(1).max(300)).max(50).default([]),
    casRn: z.string().trim().max(20).optional(),
    inchi: z.string().trim().max(4000).optional(),
    inchiKey: z.string().trim().max(40).optional(),
    smiles: z.string().trim().max(2000).optional(),
    notes: Notes,
    phases: z.array(NewPhase).max(10).default([]),
    sourceId: SourceIdField.optional(),
  })
  .strict();

export const AddPhaseItem = z
  .object({
    kind: z.literal('add_phase'),
    species: SpeciesKey,
    phase: Phase,
    modification: Modification.optional(),
    sourceId: SourceIdField.optional(),
    notes: Notes,
  })
  .strict();

export const DeriveValueItem = z
  .object({
    kind: z.literal('derive_value'),
    species: SpeciesKey,
    phase: PhaseText,
    modification: Modification.optional(),
    /** The measured reaction, containing the species (e.g. its combustion). */
    equation: z.string().trim().min(1).max(2000),
    deltaH: Finite,
    unit: EnergyUnit,
    uncertainty: NonNegative.nullable().optional(),
    uncertaintyBasis: UncertaintyBasis.nullable().optional(),
    /**
     * Whose values the other terms come from: a published release (`2026.1`, `latest`), or
     * `accepted` for the newest accepted values (released or waiting for the next release).
     */
    release: z.string().trim().min(1).max(64),
    sourceId: SourceIdField,
    method: z.literal('derived').default('derived'),
    standardPressure: Pressure,
    notes: Notes,
  })
  .strict();

/** One item of a proposal: the union of every kind above. */
export const ProposalItemInput = z.union([
  AddValueItem,
  SupersedeValueItem,
  RetireValueItem,
  AddSpeciesItem,
  AddPhaseItem,
  DeriveValueItem,
]);
export type ProposalItemInput = z.infer<typeof ProposalItemInput>;
export type ItemKind = ProposalItemInput['kind'];
export const ITEM_KINDS = [
  'add_species',
  'add_phase',
  'add_value',
  'supersede_value',
  'retire_value',
  'derive_value',
] as const;
