import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Clipboard } from '@angular/cdk/clipboard';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import type { ReleaseList, ReleaseManifestWithExports } from '@contracts/releases/releases-schemas';
import { errorInterceptor } from '../../../core/error-interceptor';
import { Session } from '../../../core/session';
import { ReleasesPage } from './releases-page';

// Harness-driven Material components: slow on a busy machine, which must not fail a test.
jest.setTimeout(60_000);

const list: ReleaseList = {
  releases: [
    {
      version: '2026.1',
      status: 'published',
      notes: 'Starter set of the Kestrel data team.',
      publishedAt: '2026-11-01T09:00:00.000Z',
      publishedBy: { login: 'thalpos-system', name: 'Thalpos' },
    },
    {
      version: '2026.2',
      status: 'published',
      notes: 'Second pass (demo data).',
      publishedAt: '2026-11-30T10:30:00.000Z',
      publishedBy: { login: 'demo-editor', name: 'Dana Editor' },
    },
  ],
};

const sha = (c: string) => c.repeat(64);

function manifest(version: string): ReleaseManifestWithExports {
  const summary = list.releases.find((r) => r.version === version)!;
  const file = (f: string, c: string, bytes: number) => ({
    sha256: sha(c),
    bytes,
    url: `/api/v1/releases/${version}/export.${f}`,
  });
  return {
    ...summary,
    counts: {
      species: 80,
      speciesPhases: 95,
      formationEnthalpies: 95,
      heatCapacitySets: 12,
      transitions: 5,
      sources: 14,
    },
    exports: {
      csv: file('csv', 'a', 20480),
      json: file('json', 'b', 40960),
      xml: file('xml', 'c', 51200),
    },
  };
}

describe('ReleasesPage', () => {
  let harness: RouterTestingHarness;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'releases', component: ReleasesPage },
          { path: 'releases/:from/diff/:to', children: [] },
          { path: 'releases/diff', children: [] },
        ]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
  });

  afterEach(() => backend.verify());

  const element = () => harness.routeNativeElement as HTMLElement;

  async function open(): Promise<void> {
    await harness.navigateByUrl('/releases', ReleasesPage);
    backend.expectOne('/api/v1/releases').flush(list);
    await harness.fixture.whenStable();
    for (const v of ['2026.1', '2026.2'])
      backend.expectOne(`/api/v1/releases/${v}`).flush(manifest(v));
    await harness.fixture.whenStable();
  }

  it('offers the release drafts to editors only', async () => {
    await open();
    expect(element().querySelector('a[href="/releases/drafts"]')).toBeNull();
    const known = TestBed.inject(Session).refresh();
    backend.expectOne('/api/v1/me').flush({
      id: 3,
      login: 'demo-editor',
      name: 'Helga Brandt',
      role: 'editor',
      avatarUrl: null,
    });
    await known;
    await harness.fixture.whenStable();
    const link = element().querySelector('a[href="/releases/drafts"]');
    expect(link?.textContent).toContain('Release drafts and New release');
  });

  it('lists releases newest first with who published them, notes and counts', async () => {
    await open();
    const cards = [...element().querySelectorAll('article')];
    expect(cards.map((c) => c.querySelector('h2')!.textContent!.trim())).toEqual([
      'Release 2026.2 newest',
      'Release 2026.1',
    ]);
    expect(cards[0]!.textContent).toMatch(/Published 30 Nov 2026, 10:30 UTC\s+by Dana Editor/);
    expect(cards[0]!.textContent).toContain('Second pass (demo data).');
    expect(cards[0]!.textContent).toMatch(/95\s+ΔfH° values/);
    expect(cards[0]!.textContent).toMatch(/12\s+heat-capacity sets/);
  });

  it('offers each export with its size and SHA-256, and copies the checksum', async () => {
    await open();
    const clipboard = TestBed.inject(Clipboard);
    const copy = jest.spyOn(clipboard, 'copy').mockReturnValue(true);
    const newest = element().querySelector('article')!;
    const links = [...newest.querySelectorAll<HTMLAnchorElement>('ul.downloads a')];
    expect(links.map((a) => a.getAttribute('href'))).toEqual([
      '/api/v1/releases/2026.2/export.csv',
      '/api/v1/releases/2026.2/export.json',
      '/api/v1/releases/2026.2/export.xml',
    ]);
    expect(links[0]!.getAttribute('download')).toBe('thalpos-2026.2.csv');
    expect(newest.textContent).toContain(sha('a'));
    expect(newest.textContent).toContain('20 KB');

    newest
      .querySelector<HTMLButtonElement>('button[aria-label="Copy the SHA-256 of the JSON export"]')!
      .click();
    await harness.fixture.whenStable();
    expect(copy).toHaveBeenCalledWith(sha('b'));
    expect(newest.querySelector('.copied')!.textContent).toContain(
      'Checksum of the JSON export copied.',
    );
  });

  it('links each release to what changed since the one before', async () => {
    await open();
    const [newest, first] = [...element().querySelectorAll('article')];
    expect(newest!.querySelector('a.compare')!.getAttribute('href')).toBe(
      '/releases/2026.1/diff/2026.2',
    );
    expect(first!.querySelector('a.compare')).toBeNull();
  });

  it('says so when the list cannot be loaded', async () => {
    await harness.navigateByUrl('/releases', ReleasesPage);
    backend
      .expectOne('/api/v1/releases')
      .flush(
        { error: { code: 'boom', message: 'Database unavailable' } },
        { status: 503, statusText: 'x' },
      );
    await harness.fixture.whenStable();
    expect(element().querySelector('[role="alert"]')!.textContent).toContain(
      'The releases could not be loaded',
    );
  });
});
