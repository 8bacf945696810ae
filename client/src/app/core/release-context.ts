import { HttpClient } from '@angular/common/http';
import { computed, inject, Injectable } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NavigationEnd, Router } from '@angular/router';
import { catchError, filter, map, of, startWith } from 'rxjs';

import type { ReleaseList } from '@contracts/releases/releases-schemas';

/** The URL query parameter that pins a release on every screen that reads one. */
export const RELEASE_PARAM = 'release';

/** What `release` means when the URL names none: the newest published release. */
export const LATEST = 'latest';

/**
 * The release the screens read from, as a signal kept in the URL (`?release=2026.1`), so a link
 * shows the same numbers to whoever opens it. Also the list of published releases to pick from.
 */
@Injectable({ providedIn: 'root' })
export class ReleaseContext {
  private readonly router = inject(Router);
  private readonly http = inject(HttpClient);

  private readonly param = toSignal(
    this.router.events.pipe(
      filter((event) => event instanceof NavigationEnd),
      startWith(null),
      map(() => this.router.parseUrl(this.router.url).queryParamMap.get(RELEASE_PARAM)),
    ),
    { initialValue: null },
  );

  /** Published releases, newest first; empty until loaded (or when the list cannot be read). */
  readonly releases = toSignal(
    this.http.get<ReleaseList>('/api/v1/releases').pipe(
      map(({ releases }) =>
        [...releases].sort((a, b) => b.publishedAt.localeCompare(a.publishedAt)),
      ),
      catchError(() => of([])),
    ),
    { initialValue: [] },
  );

  /** The newest published version, or `latest` until the list has loaded. */
  readonly latest = computed(() => this.releases()[0]?.version ?? LATEST);

  /** The release named in the URL, `latest` when it names none. */
  readonly pinned = computed(() => this.param() ?? LATEST);

  /** The concrete version the screens should show: `latest` resolved once the list is known. */
  readonly effective = computed(() => {
    const pinned = this.pinned();
    return pinned === LATEST ? this.latest() : pinned;
  });

  /** Pins a release in the URL, keeping the other query parameters and the history tidy. */
  pin(version: string): Promise<boolean> {
    const url = this.router.parseUrl(this.router.url);
    const { [RELEASE_PARAM]: _previous, ...others } = url.queryParams;
    url.queryParams = version === LATEST ? others : { ...others, [RELEASE_PARAM]: version };
    return this.router.navigateByUrl(url, { replaceUrl: true });
  }
}
