import { HttpClient } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import { httpStatus, readableMessage } from './api-error';
import type { Role, SignedInUser } from './models/user';

/** Where a full-page navigation starts the sign-in (GitHub, or the local fake in development). */
export const SIGN_IN_URL = '/auth/github';

export type SessionStatus = 'loading' | 'signed-in' | 'anonymous' | 'unavailable';

interface SessionState {
  status: SessionStatus;
  user: SignedInUser | null;
  /** Why the session could not be read, when status is `unavailable`. */
  problem: string | null;
}

/** Who is signed in, as signals. Reads `GET /api/v1/me`; a 401 there means anonymous. */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly http = inject(HttpClient);
  private readonly state = signal<SessionState>({ status: 'loading', user: null, problem: null });
  private pending: Promise<SignedInUser | null> | null = null;
  private generation = 0;

  readonly status = computed(() => this.state().status);
  readonly user = computed(() => this.state().user);
  readonly problem = computed(() => this.state().problem);
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
        this.settle(generation, { status: 'signed-in', user, problem: null });
        return user;
      },
      (error: unknown) => {
        const anonymous = httpStatus(error) === 401;
        this.settle(generation, {
          status: anonymous ? 'anonymous' : 'unavailable',
          user: null,
          problem: anonymous ? null : readableMessage(error),
        });
        return null;
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
