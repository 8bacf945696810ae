import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { ParseAnswer } from '@contracts/calculate/calculate-schemas';
import { filter, firstValueFrom } from 'rxjs';

import { errorInterceptor } from '../../core/error-interceptor';
import { EquationChecker } from './equation-checker';

const answer = (normalized: string) =>
  ({
    normalized,
    balanced: true,
    imbalance: {},
    charge: '0',
    unknownComposition: [],
    suggestion: null,
    hints: [],
    species: [],
  }) as ParseAnswer;

describe('EquationChecker', () => {
  let checker: EquationChecker;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    checker = TestBed.inject(EquationChecker);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  const settled = (text: string) =>
    firstValueFrom(checker.check(text).pipe(filter((c) => c.state !== 'paused')));

  it('asks once per distinct text: checks in flight are shared and answers kept', async () => {
    const a = settled('H2(g) -> H2(g)');
    const b = settled('H2(g) -> H2(g)');
    backend.expectOne('/api/v1/equations/parse').flush(answer('H2(g) -> H2(g)'));
    await expect(Promise.all([a, b])).resolves.toEqual([
      expect.objectContaining({ state: 'balanced' }),
      expect.objectContaining({ state: 'balanced' }),
    ]);

    await settled('H2(g) -> H2(g)');
    backend.expectNone('/api/v1/equations/parse');
    expect(checker.known().get('H2(g) -> H2(g)')?.state).toBe('balanced');
  });

  it('does not ask the server about an upper-case phase', async () => {
    await expect(settled('H2O(L) -> H2O(g)')).resolves.toMatchObject({ state: 'invalid' });
    backend.expectNone('/api/v1/equations/parse');
  });

  it('pauses every check on a 429 with one notice naming the wait, then resumes by itself', async () => {
    const first = settled('CO(g) -> CO(g)');
    backend
      .expectOne('/api/v1/equations/parse')
      .flush(
        { error: { code: 'rate_limited', message: 'Too many requests' } },
        { status: 429, statusText: 'Too Many Requests', headers: { 'Retry-After': '1' } },
      );
    expect(checker.limitNotice()).toContain('Try again in 1 second');

    // Another field asks meanwhile: it waits too, without a request of its own.
    const second = settled('O2(g) -> O2(g)');
    backend.expectNone('/api/v1/equations/parse');

    // After the wait, each text is asked once more.
    const asked = await new Promise<ReturnType<HttpTestingController['match']>>((resolve) => {
      const poll = () => {
        const pending = backend.match('/api/v1/equations/parse');
        if (pending.length > 0) resolve(pending);
        else setTimeout(poll, 50);
      };
      poll();
    });
    const more = backend.match('/api/v1/equations/parse');
    for (const r of [...asked, ...more]) r.flush(answer(r.request.body.equation));
    await expect(first).resolves.toMatchObject({ state: 'balanced' });
    await expect(second).resolves.toMatchObject({ state: 'balanced' });
    expect(checker.limitNotice()).toBeNull();
  });
});
