import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type {
  ReleaseDiff,
  ReleaseList,
  ReleaseManifestWithExports,
} from '@contracts/releases/releases-schemas';

const base = (version: string) => `/api/v1/releases/${encodeURIComponent(version)}`;

/** Published releases: manifests with export checksums, and diffs between two releases. */
@Injectable({ providedIn: 'root' })
export class ReleasesApi {
  private readonly http = inject(HttpClient);

  list(): Observable<ReleaseList> {
    return this.http.get<ReleaseList>('/api/v1/releases');
  }

  manifest(version: string): Observable<ReleaseManifestWithExports> {
    return this.http.get<ReleaseManifestWithExports>(base(version));
  }

  diff(from: string, to: string): Observable<ReleaseDiff> {
    return this.http.get<ReleaseDiff>(`${base(from)}/diff/${encodeURIComponent(to)}`);
  }

  /** Where the browser downloads the diff as CSV (the same rows as the JSON). */
  diffCsvUrl(from: string, to: string): string {
    return `${base(from)}/diff/${encodeURIComponent(to)}.csv`;
  }
}
