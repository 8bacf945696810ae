import { computed, linkedSignal, signal, untracked, type Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { catchError, map, of, startWith, switchMap, type Observable } from 'rxjs';

import { readableMessage } from '../core/api-error';

/** Where the latest request stands; `idle` while there is nothing to ask for. */
export type Loading<T> =
  | { readonly state: 'idle' }
  | { readonly state: 'loading' }
  | { readonly state: 'loaded'; readonly value: T }
  | { readonly state: 'failed'; readonly message: string };

export interface LatestResponseOptions<R, T> {
  /** What to ask for, read as a signal: each new value asks again; `null` asks nothing. */
  readonly request: () => R | null;
  /** The call that answers one request (an HttpClient call). */
  readonly load: (request: R) => Observable<T>;
  /** Keep the last answer on screen after a failure too (by default a failure clears it). */
  readonly keepOnFailure?: boolean;
}

export interface LatestResponse<T> {
  readonly state: Signal<Loading<T>>;
  /** The last answer that arrived, kept while the next one loads. */
  readonly last: Signal<T | null>;
  readonly loading: Signal<boolean>;
  /** Why the latest request failed, in words for people. */
  readonly failure: Signal<string | null>;
  /** Asks again for the current request (a retry, or the same filters applied anew). */
  reload(): void;
}

const IDLE = { state: 'idle' } as const;
const LOADING = { state: 'loading' } as const;

/**
 * The answer to the latest of a changing request, as signals: a new request drops the one in
 * flight (`switchMap`), and errors become a message instead of ending the stream.
 * Call it in an injection context (a field initializer), like `toSignal`.
 */
export function latestResponse<R, T>(options: LatestResponseOptions<R, T>): LatestResponse<T> {
  const { request, load, keepOnFailure = false } = options;
  const reloads = signal(0);
  // A fresh object each time, so a reload of an unchanged request is asked again.
  const asked = computed(() => ({ request: request(), reload: reloads() }));

  const state = toSignal(
    toObservable(asked).pipe(
      switchMap(({ request }) =>
        request === null
          ? of<Loading<T>>(IDLE)
          : load(request).pipe(
              map((value): Loading<T> => ({ state: 'loaded', value })),
              catchError((error: unknown) =>
                of<Loading<T>>({ state: 'failed', message: readableMessage(error) }),
              ),
              startWith<Loading<T>>(LOADING),
            ),
      ),
    ),
    { initialValue: untracked(request) === null ? IDLE : LOADING },
  );

  const last = linkedSignal<Loading<T>, T | null>({
    source: state,
    computation: (now, previous) => {
      if (now.state === 'loaded') return now.value;
      if (now.state === 'idle' || (now.state === 'failed' && !keepOnFailure)) return null;
      return previous?.value ?? null;
    },
  });

  return {
    state,
    last: last.asReadonly(),
    loading: computed(() => state().state === 'loading'),
    failure: computed(() => {
      const now = state();
      return now.state === 'failed' ? now.message : null;
    }),
    reload: () => reloads.update((n) => n + 1),
  };
}
