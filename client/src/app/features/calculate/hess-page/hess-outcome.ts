import { ApiError, readableMessage } from '../../../core/api-error';
import { formatEnergy, formatFactor, formatValue } from '../../../shared/energy-unit';
import type { HessRequest, HessSolution } from '../models/hess';

/** One row of the result table: a step as the combination uses it. */
export interface UsedStep {
  /** 1-based, as the form numbers the steps. */
  readonly number: number;
  readonly equation: string;
  readonly flipped: 'Yes' | 'No';
  readonly scale: string;
  readonly deltaH: string;
}

export interface UnusedStep {
  readonly number: number;
  readonly equation: string;
}

export type HessOutcome =
  | { readonly kind: 'idle' }
  | { readonly kind: 'solving' }
  | {
      readonly kind: 'solved';
      readonly target: string;
      readonly unit: string;
      /** ΔH of the target with its uncertainty when known, e.g. `206.1 ± 0.54 kJ/mol`. */
      readonly total: string;
      readonly used: readonly UsedStep[];
      readonly unused: readonly UnusedStep[];
    }
  | { readonly kind: 'failed'; readonly title: string; readonly message: string };

export const IDLE: HessOutcome = { kind: 'idle' };
export const SOLVING: HessOutcome = { kind: 'solving' };

/** The solution in the words and numbers the result table shows. */
export function solved(request: HessRequest, solution: HessSolution): HessOutcome {
  const equationOf = (index: number) => request.steps[index]?.equation ?? `(step ${index + 1})`;
  return {
    kind: 'solved',
    target: request.target,
    unit: solution.unit,
    total: formatEnergy(solution.deltaH, solution.unit, solution.uncertainty),
    // Unused steps (multiplier 0) are listed apart, not as ×0 rows.
    used: solution.steps
      .filter((step) => step.multiplier !== 0)
      .map((step) => ({
        number: step.index + 1,
        equation: equationOf(step.index),
        flipped: step.flipped ? 'Yes' : 'No',
        scale: formatFactor(step.scale),
        deltaH: formatValue(step.deltaH),
      })),
    unused: solution.unused.map((index) => ({ number: index + 1, equation: equationOf(index) })),
  };
}

/** A refused or failed calculation in plain words, with the server's own message. */
export function failed(error: unknown): HessOutcome {
  const message = readableMessage(error);
  const code = error instanceof ApiError ? error.code : null;
  switch (code) {
    case 'no_combination':
      return {
        kind: 'failed',
        title: 'These steps cannot be combined into the target equation.',
        message,
      };
    case 'not_unique':
      return {
        kind: 'failed',
        title:
          'These steps give the target in more than one way; remove the steps that repeat others.',
        message,
      };
    case 'parse_error':
      return { kind: 'failed', title: 'One of the equations cannot be read.', message };
    case 'unbalanced':
      return { kind: 'failed', title: 'One of the equations is not balanced.', message };
    case 'validation_error':
      return { kind: 'failed', title: 'Some of the inputs are not valid.', message };
    default:
      return { kind: 'failed', title: 'The calculation did not complete.', message };
  }
}
