import { computed, inject, Injectable, signal } from '@angular/core';
import {
  catchError,
  defer,
  map,
  Observable,
  of,
  shareReplay,
  startWith,
  switchMap,
  tap,
  timer,
} from 'rxjs';

import { ApiError, rateLimitMessage } from '../../core/api-error';
import { CalculateApi } from './calculate-api';
import {
  type EquationCheck,
  fromFailure,
  fromParsed,
  localProblem,
  PAUSED,
} from './equation-check';

/** How long a pause lasts when a 429 names no wait. */
const DEFAULT_PAUSE_S = 10;

/**
 * The live equation check, shared by every equation field: each distinct text is asked once
 * (answers are kept, a check in flight is shared), and a 429 pauses all checks together until
 * the server's `Retry-After`, with one notice for the whole screen instead of one per field.
 */
@Injectable({ providedIn: 'root' })
export class EquationChecker {
  private readonly api = inject(CalculateApi);
  private readonly answers = new Map<string, EquationCheck>();
  private readonly inFlight = new Map<string, Observable<EquationCheck>>();
  private readonly pause = signal<{ until: number; seconds: number | null } | null>(null);
  private readonly version = signal(0);

  /** The one calm sentence to show while checks (and calculations) wait out a 429. */
  readonly limitNotice = computed(() => {
    const pause = this.pause();
    return pause ? rateLimitMessage(pause.seconds) : null;
  });

  /** Answers known so far, by trimmed text; a signal so screens can read them reactively. */
  readonly known = computed(() => {
    this.version();
    return new Map(this.answers) as ReadonlyMap<string, EquationCheck>;
  });

  /** The check of one trimmed equation: local checks first, then the server at most once. */
  check(equation: string): Observable<EquationCheck> {
    const local = localProblem(equation);
    if (local) return of(local);
    const known = this.answers.get(equation);
    if (known) return of(known);
    const pause = this.pause();
    if (pause && pause.until > Date.now()) {
      return timer(pause.until - Date.now()).pipe(
        switchMap(() => this.check(equation)),
        startWith(PAUSED),
      );
    }
    let shared = this.inFlight.get(equation);
    if (!shared) {
      shared = defer(() => this.api.parseEquation(equation)).pipe(
        map(fromParsed),
        catchError((error: unknown) => {
          if (error instanceof ApiError && error.rateLimited) {
            this.inFlight.delete(equation);
            this.pauseFor(error.retryAfter);
            return this.check(equation);
          }
          return of(fromFailure(error, equation));
        }),
        tap((answer) => {
          if (answer.state !== 'paused') {
            this.inFlight.delete(equation);
            if (answer.state !== 'unavailable') this.remember(equation, answer);
          }
        }),
        shareReplay({ bufferSize: 1, refCount: true }),
      );
      this.inFlight.set(equation, shared);
    }
    return shared;
  }

  /** Pauses every check (e.g. after a calculation met a 429) for `seconds`, or a short default. */
  pauseFor(seconds: number | null): void {
    const until = Date.now() + (seconds ?? DEFAULT_PAUSE_S) * 1000;
    this.pause.set({ until, seconds });
    const ends = until;
    setTimeout(() => {
      if (this.pause()?.until === ends) this.pause.set(null);
    }, until - Date.now());
  }

  private remember(equation: string, answer: EquationCheck): void {
    this.answers.set(equation, answer);
    this.version.update((v) => v + 1);
  }
}
