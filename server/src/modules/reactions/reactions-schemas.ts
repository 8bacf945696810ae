import { z } from 'zod';

/**
 * The contract of the reaction-enthalpy routes (fixed: other programs depend on it). Requests
 * are validated at the edge; answers are checked against these schemas in the API tests. The
 * client imports the inferred types with `import type` only.
 */
export const REACTION_UNITS = ['kJ/mol', 'kcal/mol', 'J/mol'] as const;
export const ReactionUnit = z.enum(REACTION_UNITS);
export const STANDARD_TEMPERATURE_K = 298.15;

/** Release label such as `2026.1`, or `latest`. */
const releaseLabel = z
  .string()
  .trim()
  .min(1, 'is empty')
  .max(40, 'is longer than 40 characters')
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'must be a release label such as 2026.1 or latest');

/** A reaction equation as typed; watchlists and impact reports take the same. */
export const EquationText = z
  .string()
  .trim()
  .min(1, 'is empty')
  .max(2000, 'is longer than 2000 characters');

/** Kelvin, above absolute zero; the engine answers `out_of_range` past the data's ranges. */
export const TemperatureK = z
  .number()
  .finite()
  .positive('must be above 0 K')
  .max(100_000, 'must be at most 100000 K');

export const ReactionBody = z
  .object({
    equation: EquationText,
    release: releaseLabel.default('latest'),
    temperatureK: TemperatureK.default(STANDARD_TEMPERATURE_K),
    unit: ReactionUnit.default('kJ/mol'),
  })
  .strict();

/** The GET form: the same fields as query parameters (numbers arrive as text). */
export const ReactionQuery = z
  .object({
    equation: EquationText,
    release: releaseLabel.default('latest'),
    temperatureK: z
      .string()
      .trim()
      .regex(/^[0-9]+(\.[0-9]+)?([eE][+-]?[0-9]+)?$/, 'must be a number of kelvin such as 298.15')
      .transform(Number)
      .pipe(TemperatureK)
      .optional()
      .transform((t) => t ?? STANDARD_TEMPERATURE_K),
    unit: ReactionUnit.default('kJ/mol'),
  })
  .strict();

export const BATCH_MAX_ITEMS = 10_000;

export const BatchBody = z
  .object({
    release: releaseLabel.default('latest'),
    unit: ReactionUnit.default('kJ/mol'),
    reactions: z
      .array(
        z
          .object({
            id: z.union([z.string().max(200), z.number().finite()]).optional(),
            equation: z.string().max(2000, 'is longer than 2000 characters'),
            temperatureK: TemperatureK.optional(),
          })
          .strict(),
      )
      .min(1, 'needs at least one reaction')
      .max(BATCH_MAX_ITEMS, `takes at most ${BATCH_MAX_ITEMS} reactions`),
  })
  .strict();

// ---- answers ----

export const SourceRef = z.object({
  citation: z.string(),
  doi: z.string().nullable(),
});

export const TransitionCrossed = z.object({
  /** K. */
  temperature: z.number(),
  /** ΔtrsH in the answer's unit, heating direction. */
  deltaH: z.number(),
  /** The phase entered on heating. */
  phase: z.string().nullable(),
  revisionId: z.string().nullable(),
});

export const ReactionTerm = z.object({
  /** Registry key; null for an element in its reference state that the release does not list. */
  species: z.string().nullable(),
  /** Hill formula (with charge). */
  formula: z.string(),
  phase: z.enum(['g', 'l', 'cr', 'am', 'aq']),
  modification: z.string().nullable(),
  /** Negative for reactants. */
  coefficient: z.number(),
  /** ΔfH°(298.15 K) in the answer's unit (0 for an element in its reference state). */
  deltaFH: z.number(),
  uncertainty: z.number().nullable(),
  uncertaintyBasis: z.string().nullable(),
  /** The ΔfH° revision the release pins; null for a reference element without one. */
  revisionId: z.string().nullable(),
  source: SourceRef.nullable(),
  referenceState: z.boolean(),
  /** Plain words on how the value was obtained, e.g. for a reference element. */
  note: z.string().nullable(),
  standardPressure: z.string().nullable(),
  /** At T ≠ 298.15 K: H°(T) − H°(298.15 K) in the answer's unit, transitions included. */
  enthalpyIncrement: z.number().optional(),
  transitions: z.array(TransitionCrossed).optional(),
  heatCapacity: z.object({ revisionId: z.string(), source: SourceRef }).nullable().optional(),
});

export const ReactionAnswer = z.object({
  release: z.string(),
  /** The equation as computed: phases and modifications filled in, canonical notation. */
  equation: z.string(),
  temperatureK: z.number(),
  unit: ReactionUnit,
  deltaH: z.number(),
  /** At T ≠ 298.15 K: ΔrH°(298.15 K), in the answer's unit. */
  deltaH298: z.number().optional(),
  uncertainty: z.number().nullable(),
  /** standard · expanded_k2 · as_stated · mixed · exact (all terms are reference elements) · unavailable. */
  uncertaintyBasis: z.string(),
  terms: z.array(ReactionTerm),
  assumptions: z.array(z.string()),
  caution: z.string(),
});

export const ErrorBody = z
  .object({
    code: z.string(),
    message: z.string(),
  })
  .passthrough();

/** One batch item: the single answer without what the batch states once, or its error. */
export const BatchItemResult = ReactionAnswer.omit({
  release: true,
  unit: true,
  caution: true,
}).extend({
  index: z.number().int(),
  id: z.union([z.string(), z.number()]).nullable(),
});
export const BatchItemError = z.object({
  index: z.number().int(),
  id: z.union([z.string(), z.number()]).nullable(),
  /** The error a single request would have answered, with its HTTP status. */
  error: ErrorBody.extend({ status: z.number().int() }),
});
export const BatchItemAnswer = z.union([BatchItemResult, BatchItemError]);

export const BatchAnswer = z.object({
  release: z.string(),
  unit: ReactionUnit,
  count: z.number().int(),
  errors: z.number().int(),
  /** In the order of the request. */
  results: z.array(BatchItemAnswer),
  caution: z.string(),
});

export type ReactionInput = z.output<typeof ReactionBody>;
export type ReactionRequest = z.input<typeof ReactionBody>;
export type BatchInput = z.output<typeof BatchBody>;
export type ReactionBatchBody = z.input<typeof BatchBody>;
export type ReactionUnitName = z.infer<typeof ReactionUnit>;
export type ReactionTermAnswer = z.infer<typeof ReactionTerm>;
export type ReactionEnthalpyAnswer = z.infer<typeof ReactionAnswer>;
export type BatchItem = z.infer<typeof BatchItemAnswer>;
export type BatchItemResult = z.infer<typeof BatchItemResult>;
export type ReactionBatchAnswer = z.infer<typeof BatchAnswer>;
