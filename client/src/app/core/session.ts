import { HttpClient } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import { ApiError, httpStatus, rateLimitMessage, readableMessage } from './api-error';
import type { Role, SignedInUser } from './models/user';

/** Where a full-page navigation starts the sign-in (GitHub, or the local fake in development). */
export const SIGN_IN_URL = '/auth/github';

/**
 * The sign-in address that brings the user back to `returnTo` (the current path and query, so a
 * calculation kept in the URL survives). Only same-site relative paths are sent.
 */
export function signInHref(returnTo: string | null | undefined): string {
  if (!returnTo || !returnTo.startsWith('/') || returnTo.startsWith('//')) return SIGN_IN_URL;
  return `${SIGN_IN_URL}?returnTo=${encodeURIComponent(returnTo)}`;
}

/**
 * `unavailable`: the session could not be read (server busy or down) and no user is known yet;
 * that is not the same as signed out, so nothing offers to sign in or refuses a role for it.
 */
export type SessionStatus = 'loading' | 'signed-in' | 'anonymous' | 'unavailable';

interface SessionState {
  status: SessionStatus;
  user: SignedInUser | null;
  /** Why the session could not be read (last attempt), e.g. too many requests. */
  problem: string | null;
  /** Seconds the server asked to wait when it refused with 429. */
  retryAfter: number | null;
}

/** Who is signed in, as signals. Reads `GET /api/v1/me`; a 401 there means anonymous. */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly http = inject(HttpClient);
  private readonly state = signal<SessionState>({
    status: 'loading',
    user: null,
    problem: null,
    retryAfter: null,
  });
  private pending: Promise<SignedInUser | null> | null = null;
  private generation = 0;

  readonly status = computed(() => this.state().status);
  readonly user = computed(() => this.state().user);
  readonly problem = computed(() => this.state().problem);
  readonly retryAfter = computed(() => this.state().retryAfter);
  readonly signedIn = computed(() => this.state().user !== null);
  readonly isAdmin = computed(() => this.state().user?.role === 'admin');

  hasRole(...roles: Role[]): boolean {
    const user = this.state().user;
    return user !== null && roles.includes(user.role);
  }

  /** The signed-in user once known (reads the server on first use). */
  whenKnown(): Promise<SignedInUser | null> {
    return this.pending ?? this.refresh();
  }

  /** Reads the session from the server again; never rejects. */
  refresh(): Promise<SignedInUser | null> {
    const generation = ++this.generation;
    this.state.update((s) => ({ ...s, status: 'loading' }));
    const pending = firstValueFrom(this.http.get<SignedInUser>('/api/v1/me')).then(
      (user) => {
        this.settle(generation, { status: 'signed-in', user, problem: null, retryAfter: null });
        return user;
      },
      (error: unknown) => {
        if (httpStatus(error) === 401) {
          this.settle(generation, {
            status: 'anonymous',
            user: null,
            problem: null,
            retryAfter: null,
          });
          return null;
        }
        // Busy (429) or down: whoever was signed in still is; only a 401 means signed out.
        const known = this.state().user;
        const retryAfter = error instanceof ApiError ? error.retryAfter : null;
        this.settle(generation, {
          status: known ? 'signed-in' : 'unavailable',
          user: known,
          problem:
            httpStatus(error) === 429 ? rateLimitMessage(retryAfter) : readableMessage(error),
          retryAfter,
        });
        return known;
      },
    );
    this.pending = pending;
    return pending;
  }

  /** `POST /auth/logout` (HttpClient adds the XSRF header), then reads the session again. */
  async signOut(): Promise<void> {
    await firstValueFrom(this.http.post('/auth/logout', null));
    await this.refresh();
  }

  private settle(generation: number, state: SessionState): void {
    if (generation === this.generation) this.state.set(state);
  }
}
