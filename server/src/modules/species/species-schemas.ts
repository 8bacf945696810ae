import { z } from 'zod';
import {
  REVISION_KINDS,
  REVISION_STATUSES,
  STANDARD_PRESSURES,
  STORED_PHASES,
  UNCERTAINTY_BASIS_VALUES,
} from '../../../../schema';

/** `s` (solid) is accepted as input and means cr or am. */
const PhaseFilter = z.enum([...STORED_PHASES, 's']);

export const ReleaseSpeciesQuery = z
  .object({
    page: z.coerce.number().int().min(1).max(100_000).default(1),
    pageSize: z.coerce.number().int().min(1).max(200).default(50),
    /** Any spelling of a formula (`OH2`, `H2O`); compared in Hill order. */
    formula: z.string().trim().min(1).max(100).optional(),
    phase: PhaseFilter.optional(),
    /** Part of a name, synonym or key, case-insensitive. */
    name: z.string().trim().min(1).max(100).optional(),
    sort: z.enum(['name', 'formula', 'deltaFH', 'key']).default('name'),
    order: z.enum(['asc', 'desc']).default('asc'),
  })
  .strict();
export type ReleaseSpeciesQuery = z.infer<typeof ReleaseSpeciesQuery>;

export const SpeciesParams = z.object({ key: z.string().min(1).max(200) });

const Basis = z.enum(UNCERTAINTY_BASIS_VALUES);
const Phase = z.enum(STORED_PHASES);

export const SourceRef = z.object({
  id: z.number().int(),
  citation: z.string(),
  doi: z.string().nullable(),
});

export const ReleaseSpeciesItem = z.object({
  key: z.string(),
  name: z.string(),
  formula: z.string(),
  charge: z.number().int(),
  phase: Phase,
  modification: z.string().nullable(),
  /** ΔfH°(298.15 K) in J/mol; `deltaFHText` holds the exact stored decimal. */
  deltaFH: z.number(),
  deltaFHText: z.string(),
  uncertainty: z.number().nullable(),
  uncertaintyBasis: Basis.nullable(),
  method: z.string().nullable(),
  standardPressure: z.enum(STANDARD_PRESSURES),
  fromMemory: z.boolean(),
  revisionId: z.number().int(),
  source: SourceRef,
});

export const ReleaseSpeciesPage = z.object({
  release: z.string(),
  page: z.number().int(),
  pageSize: z.number().int(),
  total: z.number().int(),
  /** The formula filter in Hill order, when one was given. */
  formula: z.string().nullable(),
  items: z.array(ReleaseSpeciesItem),
});
export type ReleaseSpeciesPage = z.infer<typeof ReleaseSpeciesPage>;

export const HeatCapacityRange = z.object({
  tMin: z.number(),
  tMax: z.number(),
  /** c1… as the source printed them: a1…a7 (NASA) or A…H (Shomate); null where left empty. */
  coefficients: z.array(z.number().nullable()),
});

export const RevisionView = z.object({
  id: z.number().int(),
  phase: Phase,
  modification: z.string().nullable(),
  kind: z.enum(REVISION_KINDS),
  quantity: z.string(),
  /** J/mol (ΔfH° or ΔtrsH); null for heat-capacity sets. */
  value: z.number().nullable(),
  valueText: z.string().nullable(),
  uncertainty: z.number().nullable(),
  uncertaintyBasis: Basis.nullable(),
  temperature: z.number().nullable(),
  toPhase: Phase.nullable(),
  toModification: z.string().nullable(),
  heatCapacity: z
    .object({ form: z.enum(['nasa7', 'shomate']), ranges: z.array(HeatCapacityRange) })
    .nullable(),
  method: z.string().nullable(),
  standardPressure: z.enum(STANDARD_PRESSURES),
  sourceId: z.number().int(),
  notes: z.string().nullable(),
  fromMemory: z.boolean(),
  status: z.enum(REVISION_STATUSES),
  supersedesId: z.number().int().nullable(),
  createdAt: z.string(),
  /** Published releases that pin this revision. */
  releases: z.array(z.string()),
  /** A derived value (computed from a measured reaction enthalpy and other species' values). */
  derived: z.boolean().optional(),
  /** Derived values only: true when an input was superseded or retired since (`staleInputs` says which). */
  stale: z.boolean().optional(),
  staleInputs: z
    .array(
      z.object({
        inputRevisionId: z.number().int(),
        /** The revision that replaced it; null when it was retired. */
        supersededBy: z.number().int().nullable(),
        species: z.string(),
        phase: z.string(),
      }),
    )
    .optional(),
});
export type RevisionView = z.infer<typeof RevisionView>;

export const PhaseView = z.object({
  phase: Phase,
  modification: z.string().nullable(),
  /** ΔfH° in each published release that holds this phase, oldest release first. */
  formationEnthalpy: z.array(
    z.object({
      release: z.string(),
      publishedAt: z.string(),
      revisionId: z.number().int(),
      value: z.number(),
      uncertainty: z.number().nullable(),
      uncertaintyBasis: Basis.nullable(),
    }),
  ),
});

export const SpeciesPage = z.object({
  key: z.string(),
  name: z.string(),
  synonyms: z.array(z.string()),
  formula: z.string(),
  charge: z.number().int(),
  casRn: z.string().nullable(),
  inchi: z.string().nullable(),
  inchiKey: z.string().nullable(),
  smiles: z.string().nullable(),
  notes: z.string().nullable(),
  /** g/mol from the engine's atomic-weight table (CIAAW 2021 abridged). */
  molarMass: z.number(),
  phases: z.array(PhaseView),
  revisions: z.array(RevisionView),
  sources: z.array(SourceRef.extend({ csl: z.record(z.string(), z.unknown()) })),
});
export type SpeciesPage = z.infer<typeof SpeciesPage>;
