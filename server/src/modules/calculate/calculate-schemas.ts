import { z } from 'zod';

/**
 * The contract of the public calculation routes: request bodies (validated at the edge) and the
 * answers the service builds (checked against these schemas in tests/api/calculate.test.ts).
 * The client imports the inferred types with `import type` only.
 */
export const ENERGY_UNITS = ['kJ/mol', 'kcal/mol', 'J/mol'] as const;
export const EnergyUnit = z.enum(ENERGY_UNITS);

/**
 * The one wire format for exact numbers (coefficients, multipliers, imbalances, charges): a JSON
 * string holding the rational in lowest terms, sign first, "/denominator" only when it is not 1:
 * "2", "-1/2", "13/2". Measured quantities (ΔH, uncertainties) are JSON numbers.
 */
export const ExactNumber = z
  .string()
  .regex(/^-?\d+(\/\d+)?$/, 'is not an exact number such as "-1/2"');

/**
 * An energy in the request's unit: a JSON number, never text. A string such as "−283,5" is
 * refused rather than guessed at (a typographic minus or a decimal comma must never change a
 * value silently); JSON's 1e309 arrives as Infinity and is refused as too large.
 */
const energy = (what: string) =>
  z.number({
    error: (issue) => {
      const input = issue.input;
      if (input === undefined) return `${what} is required`;
      if (typeof input === 'string')
        return `${what} must be a JSON number such as -283.5, not text (${JSON.stringify(input.slice(0, 40))})`;
      if (typeof input === 'number' && !Number.isNaN(input))
        return `${what} is too large: numbers go up to ±1.8e308`;
      return `${what} must be a JSON number such as -283.5`;
    },
  });

const equationText = z
  .string()
  .trim()
  .min(1, 'is empty')
  .max(2000, 'is longer than 2000 characters');

// ---- POST /api/v1/equations/parse ----

export const ParseBody = z.object({ equation: equationText }).strict();

const phase = z.enum(['g', 'l', 'cr', 's', 'am', 'aq']);

export const ParsedSpecies = z.object({
  /** The written formula, or `[key]` for a registry key. */
  formula: z.string(),
  phase: phase.nullable(),
  /** Crystal modification such as "graphite"; null when none is written. */
  modification: z.string().nullable(),
  /** The phase spelled out for people: "gas", "liquid", "crystal, diamond", "aqueous"; null without a phase. */
  phaseName: z.string().nullable(),
  /** Exact; negative for reactants. */
  coefficient: ExactNumber,
});

export const ParseAnswer = z.object({
  normalized: z.string(),
  /** null when a registry-key term hides its composition. */
  balanced: z.boolean().nullable(),
  /** Products minus reactants, per element; empty when balanced. */
  imbalance: z.record(z.string(), ExactNumber),
  /** Products' charge minus reactants'. */
  charge: ExactNumber,
  /** Registry keys whose composition is unknown to the engine. */
  unknownComposition: z.array(z.string()),
  /** A balanced form of the equation, when it is unbalanced and one exists. */
  suggestion: z.string().nullable(),
  species: z.array(ParsedSpecies),
  /**
   * Readings that are right by the syntax yet a common slip, as questions for people, e.g.
   * "did you mean Fe^2+? Fe2+ reads as Fe2 with charge +1". The reading above stands.
   */
  hints: z.array(z.string()),
});

// ---- POST /api/v1/hess/solve ----

export const HessBody = z
  .object({
    target: equationText,
    steps: z
      .array(
        z
          .object({
            equation: equationText,
            deltaH: energy('ΔH'),
            uncertainty: energy('the uncertainty')
              .nonnegative('the uncertainty cannot be negative')
              .optional(),
          })
          .strict(),
      )
      .min(1, 'needs at least one step')
      .max(50, 'takes at most 50 steps'),
    unit: EnergyUnit.default('kJ/mol'),
  })
  .strict();

export const HessStepAnswer = z.object({
  /** 0-based position of the step in the request. */
  index: z.number().int().nonnegative(),
  /** mᵢ in Σ mᵢ·stepᵢ = target (negative: used reversed). */
  multiplier: ExactNumber,
  flipped: z.boolean(),
  /** |mᵢ|. */
  scale: ExactNumber,
  /** mᵢ·ΔHᵢ in the answer's unit. */
  deltaH: z.number(),
  /** The step's equation as written, normalized. */
  equation: z.string(),
});

export const HessAnswer = z.object({
  /** The target equation, normalized. */
  target: z.string(),
  deltaH: z.number(),
  /** Root sum of squares of the used steps' uncertainties; null if a used step has none. */
  uncertainty: z.number().nullable(),
  unit: EnergyUnit,
  /** One multiplier per requested step, in order (0 for unused steps). */
  multipliers: z.array(ExactNumber),
  /** 0-based indices of steps not used. */
  unused: z.array(z.number().int().nonnegative()),
  /** Other multiplier sets reach the target too (all with the same ΔH). */
  alternativeSolutions: z.boolean(),
  /** Every step in request order; unused ones have multiplier 0. */
  steps: z.array(HessStepAnswer),
});

export type EnergyUnitName = z.infer<typeof EnergyUnit>;
export type ParseInput = z.infer<typeof ParseBody>;
export type ParsedSpeciesAnswer = z.infer<typeof ParsedSpecies>;
export type ParseAnswer = z.infer<typeof ParseAnswer>;
export type HessInput = z.infer<typeof HessBody>;
export type HessStepUseAnswer = z.infer<typeof HessStepAnswer>;
export type HessAnswer = z.infer<typeof HessAnswer>;
