import { HttpClient, HttpEventType, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { filter, map, Observable } from 'rxjs';

import type { UploadCreated, UploadPreview } from '@contracts/uploads/uploads-schemas';

/** Where an upload is: sending bytes (with progress), then the server checking or saving rows. */
export type UploadProgress =
  | { readonly stage: 'sending'; readonly percent: number | null }
  | { readonly stage: 'processing' }
  | { readonly stage: 'preview'; readonly preview: UploadPreview }
  | { readonly stage: 'created'; readonly created: UploadCreated };

/** Bulk upload of proposal items: a dry run (preview) or the submit that saves one proposal. */
@Injectable({ providedIn: 'root' })
export class UploadApi {
  private readonly http = inject(HttpClient);
  private readonly url = '/api/v1/proposals/uploads';

  dryRun(file: File): Observable<UploadProgress> {
    return this.send(file, true).pipe(
      map((p) => (p.stage === 'created' ? ({ stage: 'processing' } as UploadProgress) : p)),
    );
  }

  submit(file: File, rationale: string): Observable<UploadProgress> {
    return this.send(file, false, rationale);
  }

  private send(file: File, dryRun: boolean, rationale = ''): Observable<UploadProgress> {
    const body = new FormData();
    if (rationale.trim() !== '') body.append('rationale', rationale.trim());
    body.append('file', file, file.name);
    const params = new HttpParams({ fromObject: { dryRun } });
    return this.http
      .post<UploadPreview | UploadCreated>(this.url, body, {
        params,
        reportProgress: true,
        observe: 'events',
      })
      .pipe(
        map((event): UploadProgress | null => {
          if (event.type === HttpEventType.UploadProgress) {
            const percent = event.total ? Math.round((100 * event.loaded) / event.total) : null;
            // Every byte sent: what remains is the server reading and checking the rows.
            return percent === 100 ? { stage: 'processing' } : { stage: 'sending', percent };
          }
          if (event.type === HttpEventType.Response && event.body !== null)
            return dryRun
              ? { stage: 'preview', preview: event.body as UploadPreview }
              : { stage: 'created', created: event.body as UploadCreated };
          return null;
        }),
        filter((p): p is UploadProgress => p !== null),
      );
  }
}
