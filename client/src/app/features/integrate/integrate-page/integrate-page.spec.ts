import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';

import { ReleaseContext } from '../../../core/release-context';
import { IntegratePage } from './integrate-page';

describe('IntegratePage', () => {
  let fixture: ComponentFixture<IntegratePage>;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [IntegratePage],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: ReleaseContext, useValue: { releases: signal([]), latest: signal('latest') } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(IntegratePage);
    await fixture.whenStable();
  });

  it('has a section for tokens, watchlists, downloads and the API reference', () => {
    backend.expectOne('/api/v1/me/tokens').flush({ tokens: [] });
    backend.expectOne('/api/v1/me/watchlists').flush({ watchlists: [] });
    const headings = [...(fixture.nativeElement as HTMLElement).querySelectorAll('h2')].map((h) =>
      h.textContent?.replace(/^\s*\S+\s+/, '').trim(),
    );
    expect(headings).toEqual(['API tokens', 'Watchlists', 'Downloads', 'API reference']);
    const reference = (fixture.nativeElement as HTMLElement).querySelector('a[href="/api/docs"]');
    expect(reference?.textContent).toContain('API reference');
    backend.verify();
  });
});
