import {
  debounceTime,
  distinctUntilChanged,
  map,
  Observable,
  of,
  OperatorFunction,
  startWith,
  switchMap,
} from 'rxjs';

import { ApiError, readableMessage } from '../../core/api-error';
import { exactValue, type ExactValue } from './exact-number';
import type { ParseAnswer as ParsedEquation } from '@contracts/calculate/calculate-schemas';

/** What a live check says about the equation typed so far. */
export type EquationCheck =
  | { readonly state: 'empty' }
  | { readonly state: 'checking' }
  | { readonly state: 'balanced'; readonly parsed: ParsedEquation }
  /** Read, but the balance could not be counted (a term named by registry key). */
  | { readonly state: 'uncounted'; readonly parsed: ParsedEquation }
  | {
      readonly state: 'unbalanced';
      readonly parsed: ParsedEquation;
      /** Elements that do not balance, with products minus reactants, e.g. `O +1`. */
      readonly imbalance: readonly ElementImbalance[];
    }
  | {
      readonly state: 'invalid';
      /** The cause, without a position (the field states the position once). */
      readonly message: string;
      /** 0-based index into `text` of the character at fault, when known. */
      readonly position: number | null;
      /** The text that was checked (trimmed), so the field can point into it. */
      readonly text: string;
    }
  /** The server asked us to slow down; the check resumes by itself. */
  | { readonly state: 'paused' }
  | { readonly state: 'unavailable'; readonly message: string };

export interface ElementImbalance {
  readonly element: string;
  /** Exact as the API sends it ("1/2"). */
  readonly excess: ExactValue;
}

/** Quiet time after the last keystroke before the server is asked. */
export const EQUATION_CHECK_DEBOUNCE_MS = 400;

export const EMPTY_CHECK: EquationCheck = { state: 'empty' };
export const CHECKING: EquationCheck = { state: 'checking' };
export const PAUSED: EquationCheck = { state: 'paused' };

/**
 * Equation text in, live check out: waits for typing to pause, skips repeats, and cancels a
 * check still in flight when newer text arrives. `check` answers for one trimmed text.
 */
export function checkEquation(
  check: (equation: string) => Observable<EquationCheck>,
  debounceMs = EQUATION_CHECK_DEBOUNCE_MS,
): OperatorFunction<string, EquationCheck> {
  return (text$) =>
    text$.pipe(
      map((text) => text.trim()),
      debounceTime(debounceMs),
      distinctUntilChanged(),
      switchMap((equation) =>
        equation === '' ? of(EMPTY_CHECK) : check(equation).pipe(startWith(CHECKING)),
      ),
    );
}

export function fromParsed(parsed: ParsedEquation): EquationCheck {
  if (parsed.balanced === true) return { state: 'balanced', parsed };
  if (parsed.balanced === null) return { state: 'uncounted', parsed };
  const imbalance = Object.entries(parsed.imbalance)
    .filter(([, excess]) => exactValue(excess) !== 0)
    .map(([element, excess]) => ({ element, excess }));
  return { state: 'unbalanced', parsed, imbalance };
}

/**
 * A refused check. Whatever the server could not read (400 or 422: syntax, unknown element)
 * belongs in the field; only an unreachable or failing server is "could not check".
 */
export function fromFailure(error: unknown, text: string): EquationCheck {
  if (error instanceof ApiError && (error.status === 400 || error.status === 422)) {
    const position = error.details['position'];
    return {
      state: 'invalid',
      message: withoutPosition(error.message),
      position: typeof position === 'number' && position >= 0 ? position : null,
      text,
    };
  }
  return { state: 'unavailable', message: readableMessage(error) };
}

/** Drops "at position 12" (or "character") from a message: the field states it once, 1-based. */
export function withoutPosition(message: string): string {
  return message.replace(/\s*(?:,\s*)?at (?:position|character) \d+/gi, '').trim();
}

const UPPER_CASE_PHASE = /\((G|L|S|CR|AQ|AM)(,[^)]*)?\)(?=$|[\s+=→-])/;

/**
 * Checks the server need not be asked: a phase written in upper case (`(G)`) would otherwise be
 * read as an element group and reported as an unknown element `G`.
 */
export function localProblem(text: string): EquationCheck | null {
  const upper = UPPER_CASE_PHASE.exec(text);
  if (upper) {
    const written = upper[0];
    return {
      state: 'invalid',
      message: `phases are written in lower case: ${written.toLowerCase()}, not ${written}`,
      position: upper.index + 1,
      text,
    };
  }
  return null;
}

/** Terms written without a phase, e.g. `["H2O"]` for `H2(g) + 1/2 O2(g) -> H2O`. */
export function termsWithoutPhase(parsed: ParsedEquation): string[] {
  return parsed.species.filter((s) => !s.phase).map((s) => s.formula);
}

/** `+1`, `-2`, `+1/2`: a signed count of atoms or charge. */
export function signed(value: ExactValue): string {
  return exactValue(value) > 0 ? `+${value}` : `${value}`;
}
