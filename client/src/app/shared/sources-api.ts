import { HttpClient, HttpEvent, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable } from 'rxjs';

import type {
  CreateSourceBody,
  DocumentList,
  DocumentView,
  SourceAnswer,
  SourceDetail,
  SourceList,
} from '@contracts/sources/sources-schemas';

export interface AddedSource {
  readonly source: SourceAnswer;
  /** True when a source with the same DOI existed already and is returned instead. */
  readonly existing: boolean;
}

/** Sources and their documents (`/api/v1/sources`), for the sources screens and the picker. */
@Injectable({ providedIn: 'root' })
export class SourcesApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/v1/sources';

  /** A page of sources, newest first; `q` matches the citation or the DOI. */
  list(q: string, offset = 0, limit = 20): Observable<SourceList> {
    let params = new HttpParams({ fromObject: { offset, limit } });
    if (q.trim()) params = params.set('q', q.trim());
    return this.http.get<SourceList>(this.base, { params });
  }

  source(id: string): Observable<SourceDetail> {
    return this.http.get<SourceDetail>(`${this.base}/${encodeURIComponent(id)}`);
  }

  /** The new source, or the existing one (200, `existing`) when its DOI is already registered. */
  create(body: CreateSourceBody): Observable<AddedSource> {
    return this.http
      .post<SourceAnswer>(this.base, body, { observe: 'response' })
      .pipe(map((res) => ({ source: res.body!, existing: res.status === 200 })));
  }

  documents(sourceId: string): Observable<DocumentList> {
    return this.http.get<DocumentList>(`${this.base}/${encodeURIComponent(sourceId)}/documents`);
  }

  /** Uploads one PDF, reporting upload progress as HttpEvents. */
  upload(sourceId: string, file: File): Observable<HttpEvent<DocumentView>> {
    const form = new FormData();
    form.append('file', file, file.name);
    return this.http.post<DocumentView>(
      `${this.base}/${encodeURIComponent(sourceId)}/documents`,
      form,
      { reportProgress: true, observe: 'events' },
    );
  }

  bibtexUrl = (id: string) => `${this.base}/${encodeURIComponent(id)}.bib`;
  risUrl = (id: string) => `${this.base}/${encodeURIComponent(id)}.ris`;
  documentUrl = (sourceId: string, docId: string) =>
    `${this.base}/${encodeURIComponent(sourceId)}/documents/${encodeURIComponent(docId)}`;
}
