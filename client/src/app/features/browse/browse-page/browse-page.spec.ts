import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import type { SearchAnswer } from '@contracts/search/search-schemas';
import type { ReleaseSpeciesPage } from '@contracts/species/species-schemas';
import { errorInterceptor } from '../../../core/error-interceptor';
import { BrowsePage, SEARCH_DEBOUNCE_MS } from './browse-page';

const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

const source = { id: 3, citation: 'Kestrel data team, starter compilation (2026).', doi: null };

function page(overrides: Partial<ReleaseSpeciesPage> = {}): ReleaseSpeciesPage {
  return {
    release: '2026.1',
    page: 1,
    pageSize: 25,
    total: 87,
    formula: null,
    items: [
      {
        key: 'water',
        name: 'Water',
        formula: 'H2O',
        charge: 0,
        phase: 'l',
        modification: null,
        deltaFH: -285830,
        deltaFHText: '-285830',
        uncertainty: 40,
        uncertaintyBasis: 'standard',
        method: null,
        standardPressure: '1 bar',
        fromMemory: true,
        revisionId: 12,
        source,
      },
    ],
    ...overrides,
  };
}

const releases = {
  releases: [
    {
      version: '2026.1',
      status: 'published',
      notes: '',
      publishedAt: '2026-11-30T10:00:00Z',
      publishedBy: null,
    },
  ],
};

describe('BrowsePage', () => {
  let harness: RouterTestingHarness;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'browse', component: BrowsePage },
          { path: 'species/:key', children: [] },
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
  const tableRequest = () =>
    backend.expectOne((r) => r.url.startsWith('/api/v1/releases/') && r.url.endsWith('/species'));

  async function open(url = '/browse'): Promise<void> {
    await harness.navigateByUrl(url, BrowsePage);
    backend.match('/api/v1/releases').forEach((r) => r.flush(releases));
    await harness.fixture.whenStable();
  }

  async function typeSearch(text: string): Promise<void> {
    const input = element().querySelector<HTMLInputElement>('input[aria-label="Search species"]')!;
    input.value = text;
    input.dispatchEvent(new Event('input'));
    await pause(SEARCH_DEBOUNCE_MS + 50);
    await harness.fixture.whenStable();
  }

  it('loads the first page of the pinned release, sorted by name, and shows kJ/mol', async () => {
    await open('/browse?release=2026.1');
    const request = tableRequest();
    expect(request.request.url).toBe('/api/v1/releases/2026.1/species');
    expect(request.request.params.get('page')).toBe('1');
    expect(request.request.params.get('pageSize')).toBe('25');
    expect(request.request.params.get('sort')).toBe('name');
    expect(request.request.params.get('order')).toBe('asc');
    expect(request.request.params.has('phase')).toBe(false);
    request.flush(page());
    await harness.fixture.whenStable();

    const row = element().querySelector('table[aria-label="Species"] tbody tr')!;
    expect(row.textContent).toContain('Water');
    expect(row.textContent).toContain('H₂O');
    expect(row.textContent).toContain('liquid');
    expect(row.textContent).toContain('−285.83');
    expect(row.textContent).toContain('0.04');
    expect(row.textContent).toContain('transcribed from memory');
    expect(row.querySelector('a')?.getAttribute('href')).toBe('/species/water?release=2026.1');
  });

  it('asks the server again when sorted, paged or filtered by phase', async () => {
    await open('/browse?release=2026.1');
    tableRequest().flush(page());
    await harness.fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(harness.fixture);

    const sort = await loader.getHarness(MatSortHarness);
    const [, formulaHeader] = await sort.getSortHeaders();
    await formulaHeader.click();
    let request = tableRequest();
    expect(request.request.params.get('sort')).toBe('formula');
    expect(request.request.params.get('order')).toBe('asc');
    request.flush(page());

    const paginator = await loader.getHarness(MatPaginatorHarness);
    await paginator.goToNextPage();
    request = tableRequest();
    expect(request.request.params.get('page')).toBe('2');
    request.flush(page({ page: 2 }));

    const phase = await loader.getHarness(
      MatSelectHarness.with({ selector: '[aria-label="Phase"]' }),
    );
    expect(await phase.getValueText()).toBe('All phases');
    await phase.open();
    await phase.clickOptions({ text: 'gas' });
    request = tableRequest();
    expect(request.request.params.get('phase')).toBe('g');
    // A new filter starts again from the first page.
    expect(request.request.params.get('page')).toBe('1');
    request.flush(page({ items: [], total: 0 }));
    await harness.fixture.whenStable();
    expect(element().textContent).toContain('No species in this release match the filter.');
  });

  it('searches as the user types, once typing pauses, and links each hit to its species', async () => {
    await open();
    tableRequest().flush(page());

    await typeSearch('metane');
    const search = backend.expectOne((r) => r.url === '/api/v1/search');
    expect(search.request.params.get('q')).toBe('metane');
    expect(search.request.params.get('release')).toBe('latest');
    const answer: SearchAnswer = {
      release: '2026.1',
      query: 'metane',
      formula: null,
      results: [
        {
          key: 'methane',
          name: 'Methane',
          formula: 'CH4',
          charge: 0,
          casRn: '74-82-8',
          inchiKey: 'VNWKTOKETHGBQD-UHFFFAOYSA-N',
          phases: [{ phase: 'g', modification: null }],
          score: 0.2,
          match: 'text',
        },
      ],
    };
    search.flush(answer);
    await harness.fixture.whenStable();

    const hit = element().querySelector<HTMLAnchorElement>('ul[aria-label="Search results"] a')!;
    expect(hit.textContent).toContain('Methane');
    expect(hit.textContent).toContain('CH₄');
    expect(hit.textContent).toContain('CAS 74-82-8');
    expect(hit.getAttribute('href')).toBe('/species/methane');
  });

  it('drops a search still in flight when the text changes, and skips repeats', async () => {
    await open();
    tableRequest().flush(page());

    await typeSearch('wat');
    const first = backend.expectOne((r) => r.url === '/api/v1/search');
    await typeSearch('water');
    expect(first.cancelled).toBe(true);
    backend.expectOne((r) => r.url === '/api/v1/search' && r.params.get('q') === 'water');
    await typeSearch(' water ');
    backend.expectNone('/api/v1/search');
  });

  it('searches again in a newly chosen release', async () => {
    await open('/browse?release=2026.1');
    tableRequest().flush(page());
    await typeSearch('water');
    const first = backend.expectOne((r) => r.url === '/api/v1/search');
    expect(first.request.params.get('release')).toBe('2026.1');
    first.flush({ release: '2026.1', query: 'water', formula: null, results: [] });

    const loader = TestbedHarnessEnvironment.loader(harness.fixture);
    const picker = await loader.getHarness(
      MatSelectHarness.with({ selector: '[aria-label="Release"]' }),
    );
    await picker.open();
    await picker.clickOptions({ text: /^Newest/ });
    await harness.fixture.whenStable();

    const again = backend.expectOne((r) => r.url === '/api/v1/search');
    expect(again.request.params.get('q')).toBe('water');
    expect(again.request.params.get('release')).toBe('latest');
    tableRequest();
  });

  it('keeps the chosen release in the URL and reloads the table for it', async () => {
    await open('/browse?release=2026.1');
    tableRequest().flush(page());
    const loader = TestbedHarnessEnvironment.loader(harness.fixture);
    const picker = await loader.getHarness(
      MatSelectHarness.with({ selector: '[aria-label="Release"]' }),
    );
    await picker.open();
    await picker.clickOptions({ text: /^Newest/ });
    await harness.fixture.whenStable();

    expect(TestBed.inject(Router).url).toBe('/browse');
    expect(tableRequest().request.url).toBe('/api/v1/releases/latest/species');
  });
});
