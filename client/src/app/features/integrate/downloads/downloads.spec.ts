import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';

import { ReleaseContext } from '../../../core/release-context';
import { Downloads } from './downloads';

const releases = [
  {
    version: '2026.2',
    status: 'published',
    notes: '',
    publishedAt: '2026-06-01T00:00:00Z',
    publishedBy: null,
  },
];
const manifest = {
  ...releases[0],
  counts: {
    species: 1,
    speciesPhases: 1,
    formationEnthalpies: 1,
    heatCapacitySets: 0,
    transitions: 0,
    sources: 1,
  },
};

describe('Downloads', () => {
  let fixture: ComponentFixture<Downloads>;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [Downloads],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        {
          provide: ReleaseContext,
          useValue: { releases: signal(releases), latest: signal('2026.2') },
        },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(Downloads);
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const links = () =>
    [...(fixture.nativeElement as HTMLElement).querySelectorAll('a.file')].map((a) =>
      a.getAttribute('href'),
    );

  it("links the newest release's exports and shows their checksums when listed", async () => {
    const sha = 'ab'.repeat(32);
    backend.expectOne('/api/v1/releases/2026.2').flush({
      ...manifest,
      exports: { csv: { sha256: sha, bytes: 10, url: '/api/v1/releases/2026.2/export.csv' } },
    });
    await fixture.whenStable();
    expect(links()).toEqual([
      '/api/v1/releases/2026.2/export.csv',
      '/api/v1/releases/2026.2/export.json',
      '/api/v1/releases/2026.2/export.xml',
    ]);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain(`SHA-256 ${sha}`);
  });

  it('says checksums will come when the manifest has none yet', async () => {
    backend.expectOne('/api/v1/releases/2026.2').flush(manifest);
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Checksums appear here');
  });
});
