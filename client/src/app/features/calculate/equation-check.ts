import {
  catchError,
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
import type { ParsedEquation } from './models/equation';

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
  | { readonly state: 'invalid'; readonly message: string; readonly position: number | null }
  | { readonly state: 'unavailable'; readonly message: string };

export interface ElementImbalance {
  readonly element: string;
  readonly excess: number;
}

/** Quiet time after the last keystroke before the server is asked. */
export const EQUATION_CHECK_DEBOUNCE_MS = 300;

export const EMPTY_CHECK: EquationCheck = { state: 'empty' };
const CHECKING: EquationCheck = { state: 'checking' };

/**
 * Equation text in, live check out: waits for typing to pause, skips repeats, and cancels a
 * check still in flight when newer text arrives.
 */
export function checkEquation(
  parse: (equation: string) => Observable<ParsedEquation>,
  debounceMs = EQUATION_CHECK_DEBOUNCE_MS,
): OperatorFunction<string, EquationCheck> {
  return (text$) =>
    text$.pipe(
      map((text) => text.trim()),
      debounceTime(debounceMs),
      distinctUntilChanged(),
      switchMap((equation) =>
        equation === ''
          ? of(EMPTY_CHECK)
          : parse(equation).pipe(
              map(fromParsed),
              catchError((error: unknown) => of(fromFailure(error))),
              startWith(CHECKING),
            ),
      ),
    );
}

export function fromParsed(parsed: ParsedEquation): EquationCheck {
  if (parsed.balanced === true) return { state: 'balanced', parsed };
  if (parsed.balanced === null) return { state: 'uncounted', parsed };
  const imbalance = Object.entries(parsed.imbalance)
    .filter(([, excess]) => excess !== 0)
    .map(([element, excess]) => ({ element, excess }));
  return { state: 'unbalanced', parsed, imbalance };
}

function fromFailure(error: unknown): EquationCheck {
  if (error instanceof ApiError && error.code === 'parse_error') {
    const position = error.details['position'];
    return {
      state: 'invalid',
      message: error.message,
      position: typeof position === 'number' ? position : null,
    };
  }
  return { state: 'unavailable', message: readableMessage(error) };
}

/** `+1`, `-2`: a signed count of atoms. */
export function signed(value: number): string {
  return value > 0 ? `+${value}` : `${value}`;
}
