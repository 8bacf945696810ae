import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { EquationText, ParsedEquation } from './models/equation';
import type { HessRequest, HessSolution } from './models/hess';

/** Equation checks and calculations; public, no sign-in needed. */
@Injectable({ providedIn: 'root' })
export class CalculateApi {
  private readonly http = inject(HttpClient);

  parseEquation(equation: string): Observable<ParsedEquation> {
    const body: EquationText = { equation };
    return this.http.post<ParsedEquation>('/api/v1/equations/parse', body);
  }

  solveHess(request: HessRequest): Observable<HessSolution> {
    return this.http.post<HessSolution>('/api/v1/hess/solve', request);
  }
}
