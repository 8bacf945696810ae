import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { SearchAnswer } from '@contracts/search/search-schemas';
import type { ReleaseSpeciesPage } from '@contracts/species/species-schemas';

/** One page request of the species table. */
export interface SpeciesTableRequest {
  readonly release: string;
  /** 1-based, as the API counts. */
  readonly page: number;
  readonly pageSize: number;
  readonly phase: string | null;
  readonly sort: 'name' | 'formula' | 'deltaFH' | 'key';
  readonly order: 'asc' | 'desc';
}

/** The registry's read side for Browse: typo-tolerant search and the paged species table. */
@Injectable({ providedIn: 'root' })
export class BrowseApi {
  private readonly http = inject(HttpClient);

  search(q: string, release: string): Observable<SearchAnswer> {
    return this.http.get<SearchAnswer>('/api/v1/search', {
      params: new HttpParams({ fromObject: { q, release, limit: 8 } }),
    });
  }

  speciesPage(request: SpeciesTableRequest): Observable<ReleaseSpeciesPage> {
    const { release, phase, ...rest } = request;
    let params = new HttpParams({ fromObject: { ...rest } });
    if (phase) params = params.set('phase', phase);
    return this.http.get<ReleaseSpeciesPage>(
      `/api/v1/releases/${encodeURIComponent(release)}/species`,
      { params },
    );
  }
}
