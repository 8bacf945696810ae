import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';

import type {
  BatchItem,
  ReactionBatchAnswer,
  ReactionBatchBody,
} from '@contracts/reactions/reactions-schemas';
import { errorInterceptor } from '../../../../core/error-interceptor';
import type { ReactionQuery } from '../reaction-query';
import { ReactionCurve } from './reaction-curve';

@Component({
  imports: [ReactionCurve],
  template: `<thalpos-reaction-curve [query]="query()" />`,
})
class Host {
  readonly query = signal<ReactionQuery>({
    equation: 'CO(g) + 1/2 O2(g) -> CO2(g)',
    release: '2026.1',
    temperatureK: 800,
    unit: 'kJ/mol',
  });
}

/** A made-up, smooth ΔrH(T) (not data) answered between 300 and 1500 K, refused outside. */
const fakeDeltaH = (t: number) => -283 + (t - 298.15) / 1000;

function answer(body: ReactionBatchBody): ReactionBatchAnswer {
  const results = body.reactions.map((item, index): BatchItem => {
    const t = item.temperatureK ?? 298.15;
    if (t < 298.15 || t > 1500) {
      return {
        index,
        id: null,
        error: { code: 'out_of_range', message: `${t} K is outside`, status: 422 },
      };
    }
    return {
      index,
      id: null,
      equation: item.equation,
      temperatureK: t,
      deltaH: fakeDeltaH(t),
      uncertainty: null,
      uncertaintyBasis: 'unavailable',
      terms: [],
      assumptions: [],
    };
  });
  return {
    release: '2026.1',
    unit: 'kJ/mol',
    count: results.length,
    errors: results.filter((r) => 'error' in r).length,
    results,
    caution: '',
  };
}

describe('ReactionCurve', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
    jest.spyOn(console, 'error').mockImplementation(() => undefined);
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    backend.verify();
    jest.restoreAllMocks();
  });

  it('asks for one batch over a temperature grid and draws the range the answers cover', async () => {
    const fixture = TestBed.createComponent(Host);
    await fixture.whenStable();

    const request = backend.expectOne({ method: 'POST', url: '/api/v1/reaction-enthalpy/batch' });
    const body = request.request.body as ReactionBatchBody;
    expect(body.release).toBe('2026.1');
    expect(body.unit).toBe('kJ/mol');
    expect(new Set(body.reactions.map((r) => r.equation))).toEqual(
      new Set(['CO(g) + 1/2 O2(g) -> CO2(g)']),
    );
    expect(body.reactions.map((r) => r.temperatureK)).toEqual(
      expect.arrayContaining([298.15, 800]),
    );
    request.flush(answer(body));
    await fixture.whenStable();

    const element = fixture.nativeElement as HTMLElement;
    expect(element.querySelector('canvas')).not.toBeNull();
    expect(element.querySelector('.range')?.textContent).toBe(
      "From 298.15 K to 1500 K, the range this release's data cover: ΔrH goes from -283 to -281.8 kJ/mol.",
    );
  });

  it('says why there is no curve when only the requested temperature is answered', async () => {
    const fixture = TestBed.createComponent(Host);
    fixture.componentInstance.query.update((q) => ({ ...q, temperatureK: 298.15 }));
    await fixture.whenStable();
    const request = backend.expectOne('/api/v1/reaction-enthalpy/batch');
    const body = request.request.body as ReactionBatchBody;
    const only298 = answer({
      ...body,
      reactions: body.reactions.map((r) =>
        r.temperatureK === 298.15 ? r : { ...r, temperatureK: 99_999 },
      ),
    });
    request.flush(only298);
    await fixture.whenStable();

    const element = fixture.nativeElement as HTMLElement;
    expect(element.querySelector('canvas')).toBeNull();
    expect(element.textContent).toContain('no heat-capacity data');
  });
});
