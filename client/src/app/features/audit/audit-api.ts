import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { AuditPage } from '@contracts/audit/audit-schemas';

/** One page request of the audit log; empty filters are left out. */
export interface AuditRequest {
  readonly actor: string;
  readonly action: string;
  readonly entityType: string;
  readonly entityId: string;
  /** ISO 8601 instants, or '' for no bound. */
  readonly from: string;
  readonly to: string;
  /** 1-based, as the API counts. */
  readonly page: number;
  readonly pageSize: number;
}

/** The audit log (admins: everything; editors: curated data). */
@Injectable({ providedIn: 'root' })
export class AuditApi {
  private readonly http = inject(HttpClient);

  list(request: AuditRequest): Observable<AuditPage> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(request)) {
      const text = String(value).trim();
      if (text) params = params.set(key, text);
    }
    return this.http.get<AuditPage>('/api/v1/audit', { params });
  }
}
