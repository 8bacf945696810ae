import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type {
  CheckAnswer,
  CommentAnswer,
  CreateAnswer,
  CreateProposalBody,
  Decision,
  ProposalDetail,
  ProposalItemInput,
  ProposalList,
  ProposalStatus,
  TransitionAnswer,
  WatchlistImpactAnswer,
} from '@contracts/proposals/proposals-schemas';

/** One page request of a proposal list (the review queue, or the caller's own). */
export interface ProposalListRequest {
  readonly status: readonly ProposalStatus[];
  readonly author?: 'me';
  readonly stale?: boolean;
  readonly sort: 'updatedAt' | 'createdAt' | 'submittedAt' | 'id' | 'status';
  readonly order: 'asc' | 'desc';
  readonly offset: number;
  readonly limit: number;
}

/** Proposals: build, check, submit, review, decide. */
@Injectable({ providedIn: 'root' })
export class CurationApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/v1/proposals';

  list(request: ProposalListRequest): Observable<ProposalList> {
    let params = new HttpParams({
      fromObject: {
        sort: request.sort,
        order: request.order,
        offset: request.offset,
        limit: request.limit,
      },
    });
    if (request.status.length > 0) params = params.set('status', request.status.join(','));
    if (request.author) params = params.set('author', request.author);
    if (request.stale) params = params.set('stale', 'true');
    return this.http.get<ProposalList>(this.base, { params });
  }

  proposal(id: number): Observable<ProposalDetail> {
    return this.http.get<ProposalDetail>(`${this.base}/${id}`);
  }

  /** The caller's watchlists before and with the proposal applied. */
  watchlistImpact(id: number): Observable<WatchlistImpactAnswer> {
    return this.http.get<WatchlistImpactAnswer>(`${this.base}/${id}/watchlist-impact`);
  }

  /** Live validation of items (engine formula checks, duplicates); nothing is saved. */
  check(items: ProposalItemInput[]): Observable<CheckAnswer> {
    return this.http.post<CheckAnswer>(`${this.base}/check`, { items });
  }

  create(body: CreateProposalBody): Observable<CreateAnswer> {
    return this.http.post<CreateAnswer>(this.base, body);
  }

  /** Replaces rationale and items of a draft, or of a proposal sent back for changes. */
  revise(id: number, body: CreateProposalBody): Observable<TransitionAnswer> {
    return this.http.put<TransitionAnswer>(`${this.base}/${id}`, body);
  }

  submit(id: number): Observable<TransitionAnswer> {
    return this.http.post<TransitionAnswer>(`${this.base}/${id}/submit`, null);
  }

  withdraw(id: number): Observable<TransitionAnswer> {
    return this.http.post<TransitionAnswer>(`${this.base}/${id}/withdraw`, null);
  }

  comment(id: number, body: string): Observable<CommentAnswer> {
    return this.http.post<CommentAnswer>(`${this.base}/${id}/comments`, { body });
  }

  decide(id: number, decision: Decision, comment: string): Observable<TransitionAnswer> {
    return this.http.post<TransitionAnswer>(`${this.base}/${id}/decision`, { decision, comment });
  }
}
