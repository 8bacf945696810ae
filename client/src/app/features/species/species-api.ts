import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { RederiveAnswer } from '@contracts/proposals/proposals-schemas';
import type { SpeciesPage } from '@contracts/species/species-schemas';

/** One species with its phases, values across releases, revisions and sources. */
@Injectable({ providedIn: 'root' })
export class SpeciesApi {
  private readonly http = inject(HttpClient);

  species(key: string): Observable<SpeciesPage> {
    return this.http.get<SpeciesPage>(`/api/v1/species/${encodeURIComponent(key)}`);
  }

  /** Opens a draft proposal that re-derives a derived revision from today's inputs. */
  rederive(revisionId: number): Observable<RederiveAnswer> {
    return this.http.post<RederiveAnswer>(`/api/v1/revisions/${revisionId}/rederive`, {});
  }
}
