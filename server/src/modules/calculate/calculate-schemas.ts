import { z } from 'zod';

export const ENERGY_UNITS = ['kJ/mol', 'kcal/mol', 'J/mol'] as const;

const equationText = z
  .string()
  .trim()
  .min(1, 'is empty')
  .max(2000, 'is longer than 2000 characters');

export const ParseBody = z.object({ equation: equationText }).strict();

export const HessBody = z
  .object({
    target: equationText,
    steps: z
      .array(
        z
          .object({
            equation: equationText,
            deltaH: z.number().finite(),
            uncertainty: z.number().finite().nonnegative().optional(),
          })
          .strict(),
      )
      .min(1, 'needs at least one step')
      .max(50, 'takes at most 50 steps'),
    unit: z.enum(ENERGY_UNITS).default('kJ/mol'),
  })
  .strict();

export type HessInput = z.infer<typeof HessBody>;
