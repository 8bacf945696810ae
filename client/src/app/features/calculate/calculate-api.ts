import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type {
  HessAnswer,
  HessInput,
  ParseAnswer,
  ParseInput,
} from '@contracts/calculate/calculate-schemas';
import { Observable } from 'rxjs';

/** Equation checks and calculations; public, no sign-in needed. */
@Injectable({ providedIn: 'root' })
export class CalculateApi {
  private readonly http = inject(HttpClient);

  parseEquation(equation: string): Observable<ParseAnswer> {
    const body: ParseInput = { equation };
    return this.http.post<ParseAnswer>('/api/v1/equations/parse', body);
  }

  solveHess(request: HessInput): Observable<HessAnswer> {
    return this.http.post<HessAnswer>('/api/v1/hess/solve', request);
  }
}
