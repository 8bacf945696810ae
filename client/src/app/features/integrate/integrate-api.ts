import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable } from 'rxjs';

import type { ReleaseManifest } from '@contracts/releases/releases-schemas';
import type {
  CreatedTokenAnswer,
  CreateTokenRequest,
  TokenListAnswer,
  TokenView,
} from '@contracts/tokens/tokens-schemas';
import type {
  ImpactAnswer,
  ImpactRequest,
  WatchlistAnswer,
  WatchlistListAnswer,
  WatchlistRequest,
  WatchlistSummary,
  WatchlistView,
} from '@contracts/watchlists/watchlists-schemas';

/** One export file as the release manifest describes it once exports are published. */
export interface ExportFile {
  sha256: string;
  bytes?: number;
  url?: string;
}

/**
 * The manifest, with the exports' checksums where the server already lists them (the `exports`
 * field of the releases contract; older servers answer without it).
 */
export type ManifestWithExports = ReleaseManifest & {
  exports?: Partial<Record<'csv' | 'json' | 'xml', ExportFile>>;
};

/** API tokens, watchlists, impact reports and release downloads (the Integrate screen). */
@Injectable({ providedIn: 'root' })
export class IntegrateApi {
  private readonly http = inject(HttpClient);

  listTokens(): Observable<TokenView[]> {
    return this.http.get<TokenListAnswer>('/api/v1/me/tokens').pipe(map((a) => a.tokens));
  }

  createToken(name: string): Observable<CreatedTokenAnswer> {
    const body: CreateTokenRequest = { name };
    return this.http.post<CreatedTokenAnswer>('/api/v1/me/tokens', body);
  }

  revokeToken(id: number): Observable<void> {
    return this.http.delete<void>(`/api/v1/me/tokens/${encodeURIComponent(id)}`);
  }

  listWatchlists(): Observable<WatchlistSummary[]> {
    return this.http
      .get<WatchlistListAnswer>('/api/v1/me/watchlists')
      .pipe(map((a) => a.watchlists));
  }

  getWatchlist(id: number): Observable<WatchlistView> {
    return this.http
      .get<WatchlistAnswer>(`/api/v1/me/watchlists/${encodeURIComponent(id)}`)
      .pipe(map((a) => a.watchlist));
  }

  saveWatchlist(id: number | null, body: WatchlistRequest): Observable<WatchlistView> {
    const request =
      id === null
        ? this.http.post<WatchlistAnswer>('/api/v1/me/watchlists', body)
        : this.http.put<WatchlistAnswer>(`/api/v1/me/watchlists/${encodeURIComponent(id)}`, body);
    return request.pipe(map((a) => a.watchlist));
  }

  deleteWatchlist(id: number): Observable<void> {
    return this.http.delete<void>(`/api/v1/me/watchlists/${encodeURIComponent(id)}`);
  }

  impact(from: string, to: string, body: ImpactRequest): Observable<ImpactAnswer> {
    return this.http.post<ImpactAnswer>(
      `/api/v1/releases/${encodeURIComponent(from)}/impact/${encodeURIComponent(to)}`,
      body,
    );
  }

  manifest(version: string): Observable<ManifestWithExports> {
    return this.http.get<ManifestWithExports>(`/api/v1/releases/${encodeURIComponent(version)}`);
  }
}
