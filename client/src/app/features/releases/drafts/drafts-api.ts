import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type {
  CreateReleaseInput,
  DraftAnswer,
  DraftList,
  PublishStatus,
  StaleAnswer,
  UpdateDraftInput,
} from '@contracts/releases/release-drafts-schemas';
import type { ReleaseManifest } from '@contracts/releases/releases-schemas';

const base = (version: string) => `/api/v1/releases/${encodeURIComponent(version)}`;

/** The release composer (editors and admins): drafts, their changes, and publishing. */
@Injectable({ providedIn: 'root' })
export class DraftsApi {
  private readonly http = inject(HttpClient);

  list(): Observable<DraftList> {
    return this.http.get<DraftList>('/api/v1/releases/drafts');
  }

  create(body: CreateReleaseInput): Observable<DraftAnswer> {
    return this.http.post<DraftAnswer>('/api/v1/releases', body);
  }

  changes(version: string): Observable<DraftAnswer> {
    return this.http.get<DraftAnswer>(`${base(version)}/changes`);
  }

  update(version: string, body: UpdateDraftInput): Observable<DraftAnswer> {
    return this.http.patch<DraftAnswer>(base(version), body);
  }

  stale(version: string): Observable<StaleAnswer> {
    return this.http.get<StaleAnswer>(`${base(version)}/stale`);
  }

  acknowledge(version: string, revisionIds: number[]): Observable<StaleAnswer> {
    return this.http.post<StaleAnswer>(`${base(version)}/acknowledgements`, { revisionIds });
  }

  publish(version: string): Observable<ReleaseManifest> {
    return this.http.post<ReleaseManifest>(`${base(version)}/publish`, {});
  }

  publishStatus(version: string): Observable<PublishStatus> {
    return this.http.get<PublishStatus>(`${base(version)}/publish-status`);
  }
}
