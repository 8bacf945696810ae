import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';

import { ReleaseContext } from './release-context';

@Component({ template: '' })
class Blank {}

const release = (version: string, publishedAt: string) => ({
  version,
  status: 'published' as const,
  notes: '',
  publishedAt,
  publishedBy: null,
});

describe('ReleaseContext', () => {
  let router: Router;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: 'browse', component: Blank }]),
        provideHttpClient(),
        provideHttpClientTesting(),
      ],
    });
    router = TestBed.inject(Router);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  it('reads the pinned release from the URL, and means the newest one when the URL names none', async () => {
    const context = TestBed.inject(ReleaseContext);
    await router.navigateByUrl('/browse');
    expect(context.pinned()).toBe('latest');
    expect(context.effective()).toBe('latest');

    backend.expectOne('/api/v1/releases').flush({
      releases: [
        release('2026.1', '2026-06-01T00:00:00Z'),
        release('2026.2', '2026-11-30T00:00:00Z'),
      ],
    });
    expect(context.releases().map((r) => r.version)).toEqual(['2026.2', '2026.1']);
    expect(context.effective()).toBe('2026.2');

    await router.navigateByUrl('/browse?release=2026.1');
    expect(context.pinned()).toBe('2026.1');
    expect(context.effective()).toBe('2026.1');
  });

  it('pins a release in the URL without losing the path or the other parameters', async () => {
    const context = TestBed.inject(ReleaseContext);
    backend.expectOne('/api/v1/releases').flush({ releases: [] });
    await router.navigateByUrl('/browse?q=water');

    await context.pin('2026.1');
    expect(router.url).toBe('/browse?q=water&release=2026.1');
    await context.pin('latest');
    expect(router.url).toBe('/browse?q=water');
  });

  it('offers no releases, rather than failing, when the list cannot be read', async () => {
    const context = TestBed.inject(ReleaseContext);
    backend
      .expectOne('/api/v1/releases')
      .flush({ error: { code: 'x', message: 'down' } }, { status: 503, statusText: 'Unavailable' });
    expect(context.releases()).toEqual([]);
    expect(context.latest()).toBe('latest');
  });
});
