import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type {
  ReactionBatchAnswer,
  ReactionBatchBody,
  ReactionEnthalpyAnswer,
} from '@contracts/reactions/reactions-schemas';
import { paramsFromQuery, type ReactionQuery } from './reaction-query';

/** The public reaction-enthalpy API: one reaction by GET (cacheable), many by the batch route. */
@Injectable({ providedIn: 'root' })
export class ReactionApi {
  private readonly http = inject(HttpClient);

  compute(query: ReactionQuery): Observable<ReactionEnthalpyAnswer> {
    return this.http.get<ReactionEnthalpyAnswer>('/api/v1/reaction-enthalpy', {
      params: new HttpParams({ fromObject: paramsFromQuery(query) }),
    });
  }

  batch(body: ReactionBatchBody): Observable<ReactionBatchAnswer> {
    return this.http.post<ReactionBatchAnswer>('/api/v1/reaction-enthalpy/batch', body);
  }
}
