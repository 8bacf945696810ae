import { HttpErrorResponse } from '@angular/common/http';
import type { ParseAnswer } from '@contracts/calculate/calculate-schemas';
import { Observable } from 'rxjs';
import { TestScheduler } from 'rxjs/testing';

import { ApiError } from '../../core/api-error';
import {
  checkEquation,
  EquationCheck,
  fromFailure,
  fromParsed,
  localProblem,
  termsWithoutPhase,
  withoutPosition,
} from './equation-check';

const balanced = {
  normalized: 'CO(g) + 1/2 O2(g) -> CO2(g)',
  balanced: true,
  imbalance: {},
  charge: '0',
  unknownComposition: [],
  suggestion: null,
  species: [
    { formula: 'CO', phase: 'g', phaseName: 'gas', modification: null, coefficient: '-1' },
    { formula: 'O2', phase: 'g', phaseName: 'gas', modification: null, coefficient: '-1/2' },
    { formula: 'CO2', phase: null, phaseName: null, modification: null, coefficient: '1' },
  ],
  hints: [],
} as ParseAnswer;

const unbalanced: ParseAnswer = {
  ...balanced,
  normalized: 'CO(g) + O2(g) -> CO2(g)',
  balanced: false,
  imbalance: { C: '0', O: '-1' },
  suggestion: 'CO(g) + 1/2 O2(g) -> CO2(g)',
};

describe('checkEquation', () => {
  let scheduler: TestScheduler;

  beforeEach(() => {
    scheduler = new TestScheduler((actual, expected) => expect(actual).toEqual(expected));
  });

  it('asks only after typing pauses, skips repeats, and cancels a check overtaken by newer text', () => {
    scheduler.run(({ cold, hot, expectObservable, expectSubscriptions }) => {
      const first = cold<EquationCheck>('----------a|', { a: fromParsed(unbalanced) });
      const second = cold<EquationCheck>('--b|', { b: fromParsed(balanced) });
      const asked: string[] = [];
      const answers = [first, second];
      const check = (equation: string): Observable<EquationCheck> => {
        asked.push(equation);
        return answers.shift()!;
      };
      const text = hot<string>('a 3ms b 3ms c', {
        a: 'CO(g) + O2(g) -> CO2(g)',
        b: 'CO(g) + O2(g) -> CO2(g) ',
        c: 'CO(g) + 1/2 O2(g) -> CO2(g)',
      });

      expectObservable(text.pipe(checkEquation(check, 3))).toBe('---C 7ms C-D', {
        C: { state: 'checking' },
        D: { state: 'balanced', parsed: balanced },
      });
      expectSubscriptions(first.subscriptions).toBe('---^-------!');
      scheduler.flush();
      expect(asked).toEqual(['CO(g) + O2(g) -> CO2(g)', 'CO(g) + 1/2 O2(g) -> CO2(g)']);
    });
  });

  it('reports empty text as empty without asking', () => {
    scheduler.run(({ hot, expectObservable }) => {
      const check = jest.fn();
      expectObservable(hot<string>('a', { a: '   ' }).pipe(checkEquation(check, 1))).toBe('-e', {
        e: { state: 'empty' },
      });
      scheduler.flush();
      expect(check).not.toHaveBeenCalled();
    });
  });
});

describe('fromFailure', () => {
  it('keeps a parse error in the field, with its 0-based position and without the position in the words', () => {
    const error = new ApiError(400, 'parse_error', "expected '->' at position 7", { position: 7 });
    expect(fromFailure(error, 'CH4(g) CO2(g)')).toEqual({
      state: 'invalid',
      message: "expected '->'",
      position: 7,
      text: 'CH4(g) CO2(g)',
    });
  });

  it('says "unknown element symbol" in the field, never "could not check"', () => {
    const error = new ApiError(
      400,
      'unknown_element',
      "unknown element symbol 'Xy' at position 0",
      {
        position: 0,
        symbol: 'Xy',
      },
    );
    expect(fromFailure(error, 'Xy2(g) -> Xy2(l)')).toMatchObject({
      state: 'invalid',
      message: "unknown element symbol 'Xy'",
      position: 0,
    });
    expect(
      fromFailure(new ApiError(422, 'unknown_element', 'unknown element symbol Xy'), 'x'),
    ).toMatchObject({ state: 'invalid' });
  });

  it('reports an unreachable server as "unavailable"', () => {
    expect(fromFailure(new HttpErrorResponse({ status: 0 }), 'H2(g) -> H2(g)')).toEqual({
      state: 'unavailable',
      message: 'The Thalpos server cannot be reached. Check the connection and try again.',
    });
  });

  it('drops any position from a message, whatever its wording', () => {
    expect(withoutPosition('bad term at position 12')).toBe('bad term');
    expect(withoutPosition('bad term at character 3, here')).toBe('bad term, here');
  });
});

describe('localProblem', () => {
  it('says phases are written in lower case instead of reporting an unknown element G', () => {
    expect(localProblem('CH4(G) + 2 O2(g) -> CO2(g) + 2 H2O(l)')).toEqual({
      state: 'invalid',
      message: 'phases are written in lower case: (g), not (G)',
      position: 4,
      text: 'CH4(G) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
    });
    expect(localProblem('NaCl(CR) -> NaCl(l)')).toMatchObject({ position: 5 });
  });

  it('leaves element groups alone', () => {
    expect(localProblem('Ca(OH)2(cr) -> CaO(cr) + H2O(g)')).toBeNull();
    expect(localProblem('CH4(g) -> C(graphite) + 2 H2(g)')).toBeNull();
  });
});

describe('fromParsed and termsWithoutPhase', () => {
  it('says the balance was not counted when the server could not count it', () => {
    const keyed = { ...balanced, balanced: null };
    expect(fromParsed(keyed)).toEqual({ state: 'uncounted', parsed: keyed });
  });

  it('lists only the elements that do not balance', () => {
    expect(fromParsed(unbalanced)).toEqual({
      state: 'unbalanced',
      parsed: unbalanced,
      imbalance: [{ element: 'O', excess: '-1' }],
    });
  });

  it('names the terms written without a phase', () => {
    expect(termsWithoutPhase(balanced)).toEqual(['CO2']);
  });
});
