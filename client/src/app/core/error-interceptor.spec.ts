import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';

import { ApiError, rateLimitMessage, readableMessage, retryAfterSeconds } from './api-error';
import { errorInterceptor } from './error-interceptor';

describe('errorInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function failureOf(
    flush: (url: string) => void,
    url = '/api/v1/users/7',
  ): Promise<ApiError> {
    const answer = firstValueFrom(http.patch(url, { role: 'reader' }));
    flush(url);
    return answer.then(
      () => {
        throw new Error('expected the request to fail');
      },
      (error: unknown) => error as ApiError,
    );
  }

  it("re-throws failures as ApiError carrying the server's code, message and details", async () => {
    const error = await failureOf((url) =>
      backend.expectOne(url).flush(
        {
          error: {
            code: 'last_admin',
            message: 'At least one admin must remain.',
            adminCount: 1,
          },
        },
        { status: 409, statusText: 'Conflict' },
      ),
    );

    expect(error).toBeInstanceOf(ApiError);
    expect(error.status).toBe(409);
    expect(error.code).toBe('last_admin');
    expect(error.message).toBe('At least one admin must remain.');
    expect(error.details).toEqual({ adminCount: 1 });
    expect(readableMessage(error)).toBe('At least one admin must remain.');
  });

  it('reads an error body that arrives as JSON text', async () => {
    const error = await failureOf((url) =>
      backend
        .expectOne(url)
        .flush(JSON.stringify({ error: { code: 'forbidden', message: 'Admins only.' } }), {
          status: 403,
          statusText: 'Forbidden',
        }),
    );

    expect(error.code).toBe('forbidden');
    expect(error.message).toBe('Admins only.');
  });

  it('falls back to a plain message when the server sends no error body', async () => {
    const error = await failureOf((url) =>
      backend
        .expectOne(url)
        .flush('<html>Bad gateway</html>', { status: 502, statusText: 'Bad Gateway' }),
    );

    expect(error.code).toBe('http_502');
    expect(error.message).toBe(
      'The server could not complete the request (HTTP 502). Try again later.',
    );
  });

  it('says the server cannot be reached when the network fails', async () => {
    const error = await failureOf((url) =>
      backend.expectOne(url).error(new ProgressEvent('error'), { status: 0, statusText: '' }),
    );

    expect(error.status).toBe(0);
    expect(error.code).toBe('network_error');
    expect(error.message).toContain('cannot be reached');
  });

  it('reads a 429 as a pause with its wait time, never as signed out', async () => {
    const error = await failureOf((url) =>
      backend
        .expectOne(url)
        .flush(
          { error: { code: 'rate_limited', message: 'Too many requests; slow down.' } },
          { status: 429, statusText: 'Too Many Requests', headers: { 'Retry-After': '42' } },
        ),
    );

    expect(error.status).toBe(429);
    expect(error.rateLimited).toBe(true);
    expect(error.retryAfter).toBe(42);
    expect(error.code).not.toBe('unauthenticated');
    expect(rateLimitMessage(error.retryAfter)).toContain('Try again in 42 seconds');
  });

  it('reads Retry-After given as an HTTP date', () => {
    const now = Date.parse('2026-12-02T03:00:00Z');
    expect(retryAfterSeconds('Wed, 02 Dec 2026 03:00:30 GMT', now)).toBe(30);
    expect(retryAfterSeconds(null, now)).toBeNull();
  });

  it('lets successful answers through untouched', async () => {
    const answer = firstValueFrom(http.get('/api/v1/users'));
    backend.expectOne('/api/v1/users').flush({ users: [] });
    await expect(answer).resolves.toEqual({ users: [] });
  });
});
