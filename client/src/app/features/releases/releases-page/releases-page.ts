import { ChangeDetectionStrategy, Component, computed } from '@angular/core';
import { inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { catchError, map, of, startWith } from 'rxjs';

import type { ReleaseSummary } from '@contracts/releases/releases-schemas';
import { readableMessage } from '../../../core/api-error';
import { Session } from '../../../core/session';
import { ReleasesApi } from '../releases-api';
import { ReleaseCard } from './release-card';

type List =
  | { readonly state: 'loading' }
  | { readonly state: 'loaded'; readonly releases: readonly ReleaseSummary[] }
  | { readonly state: 'failed'; readonly message: string };

/** Releases: every published release, newest first, with its manifest and downloads. */
@Component({
  selector: 'thalpos-releases-page',
  imports: [RouterLink, MatButton, MatIcon, MatProgressBar, ReleaseCard],
  templateUrl: './releases-page.html',
  styleUrl: './releases-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReleasesPage {
  private readonly api = inject(ReleasesApi);
  private readonly session = inject(Session);

  /** Editors and admins compose releases; the link leads to their drafts. */
  protected readonly canCompose = computed(() => {
    const role = this.session.user()?.role;
    return role === 'editor' || role === 'admin';
  });

  protected readonly list = toSignal(
    this.api.list().pipe(
      map(({ releases }): List => ({
        state: 'loaded',
        releases: [...releases].sort((a, b) => b.publishedAt.localeCompare(a.publishedAt)),
      })),
      catchError((error: unknown) =>
        of<List>({ state: 'failed', message: readableMessage(error) }),
      ),
      startWith<List>({ state: 'loading' }),
    ),
    { initialValue: { state: 'loading' } as List },
  );

  /** Each release with the one published before it (the list is newest first). */
  protected readonly entries = computed(() => {
    const list = this.list();
    if (list.state !== 'loaded') return [];
    return list.releases.map((release, i) => ({
      release,
      previous: list.releases[i + 1]?.version ?? null,
    }));
  });
}
