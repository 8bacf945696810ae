import { HttpErrorResponse } from '@angular/common/http';
import { Observable, throwError } from 'rxjs';
import { TestScheduler } from 'rxjs/testing';

import { ApiError } from '../../core/api-error';
import { checkEquation, EquationCheck, fromParsed } from './equation-check';
import type { ParsedEquation } from './models/equation';

const balanced: ParsedEquation = {
  normalized: 'CO(g) + 1/2 O2(g) -> CO2(g)',
  balanced: true,
  imbalance: {},
  charge: 0,
  suggestion: null,
  species: [
    { formula: 'CO', phase: 'g', coefficient: -1 },
    { formula: 'O2', phase: 'g', coefficient: -0.5 },
    { formula: 'CO2', phase: 'g', coefficient: 1 },
  ],
};

const unbalanced: ParsedEquation = {
  normalized: 'CO(g) + O2(g) -> CO2(g)',
  balanced: false,
  imbalance: { C: 0, O: -1 },
  charge: 0,
  suggestion: 'CO(g) + 1/2 O2(g) -> CO2(g)',
  species: [],
};

describe('checkEquation', () => {
  let scheduler: TestScheduler;

  beforeEach(() => {
    scheduler = new TestScheduler((actual, expected) => expect(actual).toEqual(expected));
  });

  it('asks only after typing pauses, skips repeats, and cancels a check overtaken by newer text', () => {
    scheduler.run(({ cold, hot, expectObservable, expectSubscriptions }) => {
      const first = cold<ParsedEquation>('----------a|', { a: unbalanced });
      const second = cold<ParsedEquation>('--b|', { b: balanced });
      const asked: string[] = [];
      const answers = [first, second];
      const parse = (equation: string): Observable<ParsedEquation> => {
        asked.push(equation);
        return answers.shift()!;
      };

      // At 0 the unbalanced text; its check starts at 3 (after the pause) and would answer at 13.
      // At 4 a trailing space: the same text once trimmed, so no new check at 7.
      // At 8 the corrected text: checked at 11, which cancels the first check unanswered.
      const text = hot<string>('a 3ms b 3ms c', {
        a: 'CO(g) + O2(g) -> CO2(g)',
        b: 'CO(g) + O2(g) -> CO2(g) ',
        c: 'CO(g) + 1/2 O2(g) -> CO2(g)',
      });

      expectObservable(text.pipe(checkEquation(parse, 3))).toBe('---C 7ms C-D', {
        C: { state: 'checking' },
        D: { state: 'balanced', parsed: balanced } satisfies EquationCheck,
      });
      // The first check is unsubscribed when the corrected text arrives (before it answered).
      expectSubscriptions(first.subscriptions).toBe('---^-------!');
      scheduler.flush();
      expect(asked).toEqual(['CO(g) + O2(g) -> CO2(g)', 'CO(g) + 1/2 O2(g) -> CO2(g)']);
    });
  });

  it('reports empty text as empty without asking the server', () => {
    scheduler.run(({ hot, expectObservable }) => {
      const parse = jest.fn();
      expectObservable(hot<string>('a', { a: '   ' }).pipe(checkEquation(parse, 1))).toBe('-e', {
        e: { state: 'empty' },
      });
      scheduler.flush();
      expect(parse).not.toHaveBeenCalled();
    });
  });

  it('turns a 400 parse_error into an "invalid" check with the position', () => {
    scheduler.run(({ hot, expectObservable }) => {
      const parse = () =>
        throwError(
          () => new ApiError(400, 'parse_error', "Expected a phase after 'CH4'", { position: 4 }),
        );
      expectObservable(hot<string>('a', { a: 'CH4 + O2' }).pipe(checkEquation(parse, 1))).toBe(
        '-(ci)',
        {
          c: { state: 'checking' },
          i: { state: 'invalid', message: "Expected a phase after 'CH4'", position: 4 },
        },
      );
    });
  });

  it('reports other failures as "unavailable" with a readable message', () => {
    scheduler.run(({ hot, expectObservable }) => {
      const parse = () => throwError(() => new HttpErrorResponse({ status: 0 }));
      expectObservable(
        hot<string>('a', { a: 'H2(g) -> H2(g)' }).pipe(checkEquation(parse, 1)),
      ).toBe('-(cu)', {
        c: { state: 'checking' },
        u: {
          state: 'unavailable',
          message: 'The Thalpos server cannot be reached. Check the connection and try again.',
        },
      });
    });
  });
});

describe('fromParsed', () => {
  it('says the balance was not counted when the server could not count it', () => {
    const keyed = {
      ...balanced,
      normalized: '[2-methylpropane](g) -> [butane](g)',
      balanced: null,
    };
    expect(fromParsed(keyed)).toEqual({ state: 'uncounted', parsed: keyed });
  });

  it('lists only the elements that do not balance', () => {
    expect(fromParsed(unbalanced)).toEqual({
      state: 'unbalanced',
      parsed: unbalanced,
      imbalance: [{ element: 'O', excess: -1 }],
    });
  });
});
