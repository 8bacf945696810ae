import { provideHttpClient, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { errorInterceptor } from './error-interceptor';
import type { SignedInUser } from './models/user';
import { Session, signInHref } from './session';

const curator: SignedInUser = {
  id: 4,
  login: 'mkaya',
  name: 'Merve Kaya',
  role: 'curator',
  avatarUrl: null,
};

describe('Session', () => {
  let session: Session;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(
          withInterceptors([errorInterceptor]),
          withXsrfConfiguration({ cookieName: 'XSRF-TOKEN', headerName: 'X-XSRF-TOKEN' }),
        ),
        provideHttpClientTesting(),
      ],
    });
    session = TestBed.inject(Session);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    backend.verify();
    document.cookie = 'XSRF-TOKEN=; expires=Thu, 01 Jan 1970 00:00:00 GMT; path=/';
  });

  it('is loading until /api/v1/me answers, then holds the signed-in user', async () => {
    expect(session.status()).toBe('loading');

    const known = session.whenKnown();
    backend.expectOne({ method: 'GET', url: '/api/v1/me' }).flush(curator);

    await expect(known).resolves.toEqual(curator);
    expect(session.status()).toBe('signed-in');
    expect(session.user()).toEqual(curator);
    expect(session.hasRole('curator', 'editor')).toBe(true);
    expect(session.hasRole('admin')).toBe(false);
    expect(session.isAdmin()).toBe(false);
  });

  it('treats 401 from /api/v1/me as anonymous, not as a problem', async () => {
    const known = session.refresh();
    backend
      .expectOne('/api/v1/me')
      .flush(
        { error: { code: 'unauthenticated', message: 'Not signed in.' } },
        { status: 401, statusText: 'Unauthorized' },
      );

    await expect(known).resolves.toBeNull();
    expect(session.status()).toBe('anonymous');
    expect(session.signedIn()).toBe(false);
    expect(session.problem()).toBeNull();
  });

  it('reports an unavailable session when the server fails', async () => {
    const known = session.refresh();
    backend
      .expectOne('/api/v1/me')
      .flush(
        { error: { code: 'internal', message: 'Database is down.' } },
        { status: 503, statusText: 'Unavailable' },
      );

    await expect(known).resolves.toBeNull();
    expect(session.status()).toBe('unavailable');
    expect(session.problem()).toBe('Database is down.');
  });

  it('does not read a 429 from /api/v1/me as signed out: the user stays, with the wait time', async () => {
    const first = session.refresh();
    backend.expectOne('/api/v1/me').flush(curator);
    await first;

    const again = session.refresh();
    backend
      .expectOne('/api/v1/me')
      .flush(
        { error: { code: 'rate_limited', message: 'Too many requests.' } },
        { status: 429, statusText: 'Too Many Requests', headers: { 'Retry-After': '30' } },
      );

    await expect(again).resolves.toEqual(curator);
    expect(session.status()).toBe('signed-in');
    expect(session.user()).toEqual(curator);
    expect(session.retryAfter()).toBe(30);
    expect(session.problem()).toContain('Try again in 30 seconds');
  });

  it('is unavailable, not anonymous, when the first read meets a 429', async () => {
    const known = session.refresh();
    backend
      .expectOne('/api/v1/me')
      .flush(
        { error: { code: 'rate_limited', message: 'Too many requests.' } },
        { status: 429, statusText: 'Too Many Requests' },
      );

    await expect(known).resolves.toBeNull();
    expect(session.status()).toBe('unavailable');
    expect(session.status()).not.toBe('anonymous');
  });

  it('asks the server only once while the first read is pending', async () => {
    const first = session.whenKnown();
    const second = session.whenKnown();
    backend.expectOne('/api/v1/me').flush(curator);
    await expect(Promise.all([first, second])).resolves.toEqual([curator, curator]);
  });

  it('signs out with POST /auth/logout carrying the XSRF header, then reads the session again', async () => {
    document.cookie = 'XSRF-TOKEN=token-from-server; path=/';
    const known = session.refresh();
    backend.expectOne('/api/v1/me').flush(curator);
    await known;

    const signedOut = session.signOut();
    const logout = backend.expectOne({ method: 'POST', url: '/auth/logout' });
    expect(logout.request.headers.get('X-XSRF-TOKEN')).toBe('token-from-server');
    logout.flush(null, { status: 204, statusText: 'No Content' });

    await new Promise((resolve) => setTimeout(resolve));
    backend
      .expectOne('/api/v1/me')
      .flush(
        { error: { code: 'unauthenticated', message: 'Not signed in.' } },
        { status: 401, statusText: 'Unauthorized' },
      );
    await signedOut;

    expect(session.user()).toBeNull();
    expect(session.status()).toBe('anonymous');
  });

  it('keeps the user when sign-out fails, and lets the caller see why', async () => {
    const known = session.refresh();
    backend.expectOne('/api/v1/me').flush(curator);
    await known;

    const signedOut = session.signOut();
    backend
      .expectOne('/auth/logout')
      .flush(
        { error: { code: 'forbidden', message: 'Invalid XSRF token.' } },
        { status: 403, statusText: 'Forbidden' },
      );

    await expect(signedOut).rejects.toMatchObject({ status: 403, message: 'Invalid XSRF token.' });
    expect(session.user()).toEqual(curator);
  });

  it('builds a sign-in address that returns to same-site paths only', () => {
    expect(signInHref('/calculate/hess?target=H2(g)%20-%3E%20H2(g)')).toBe(
      '/auth/github?returnTo=%2Fcalculate%2Fhess%3Ftarget%3DH2(g)%2520-%253E%2520H2(g)',
    );
    expect(signInHref('//evil.example/x')).toBe('/auth/github');
    expect(signInHref('https://evil.example/')).toBe('/auth/github');
    expect(signInHref(null)).toBe('/auth/github');
  });
});
