import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { provideRouter, Router, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import type { ReleaseDiff, ReleaseDiffRow } from '@contracts/releases/releases-schemas';
import { errorInterceptor } from '../../../core/error-interceptor';
import { DiffPage } from './diff-page';

// Harness-driven Material components: slow on a busy machine, which must not fail a test.
jest.setTimeout(60_000);

const releases = {
  releases: ['2026.1', '2026.2', '2026.3'].map((version, i) => ({
    version,
    status: 'published',
    notes: '',
    publishedAt: `2026-11-0${i + 1}T10:00:00.000Z`,
    publishedBy: null,
  })),
};

function row(i: number, overrides: Partial<ReleaseDiffRow> = {}): ReleaseDiffRow {
  return {
    change: 'changed',
    speciesKey: `demo-${i}`,
    speciesName: `Demo species ${String(i).padStart(2, '0')}`,
    formula: `C${i}H4`,
    phase: 'g',
    modification: null,
    quantity: 'formation_enthalpy',
    oldRevisionId: i,
    newRevisionId: 100 + i,
    oldValue: String(-1000 * i),
    newValue: String(-1000 * i + 10 * i),
    oldUncertainty: '40',
    newUncertainty: '30',
    oldUncertaintyBasis: 'standard',
    newUncertaintyBasis: 'standard',
    differenceKjPerMol: String((10 * i) / 1000),
    combinedUncertaintyKjPerMol: '0.05',
    differenceInUncertainties: String((10 * i) / 50),
    oldSourceCitation: 'Kestrel starter compilation (demo)',
    newSourceCitation: 'Kestrel recheck (demo)',
    oldSourceDoi: null,
    newSourceDoi: null,
    ...overrides,
  };
}

const diff: ReleaseDiff = {
  from: '2026.1',
  to: '2026.2',
  summary: { added: 1, removed: 1, changed: 28 },
  rows: [
    ...Array.from({ length: 28 }, (_, i) => row(i + 1)),
    row(40, {
      change: 'added',
      speciesName: 'Kestrel demo oxide',
      formula: 'KeO',
      oldRevisionId: null,
      oldValue: null,
      oldUncertainty: null,
      oldUncertaintyBasis: null,
      differenceKjPerMol: null,
      differenceInUncertainties: null,
      combinedUncertaintyKjPerMol: null,
      oldSourceCitation: null,
    }),
    row(41, {
      change: 'removed',
      speciesName: 'Retired demo gas',
      newRevisionId: null,
      newValue: null,
      newUncertainty: null,
      newUncertaintyBasis: null,
      differenceKjPerMol: null,
      differenceInUncertainties: null,
      combinedUncertaintyKjPerMol: null,
      newSourceCitation: null,
    }),
  ],
};

describe('DiffPage', () => {
  let harness: RouterTestingHarness;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter(
          [
            { path: 'releases/diff', component: DiffPage },
            { path: 'releases/:from/diff/:to', component: DiffPage },
            { path: 'species/:key', children: [] },
          ],
          withComponentInputBinding(),
        ),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
  });

  afterEach(() => backend.verify());

  const element = () => harness.routeNativeElement as HTMLElement;
  const bodyRows = () => [...element().querySelectorAll('table[aria-label="Changes"] tbody tr')];

  async function open(url = '/releases/2026.1/diff/2026.2'): Promise<void> {
    await harness.navigateByUrl(url, DiffPage);
    backend.match('/api/v1/releases').forEach((r) => r.flush(releases));
    await harness.fixture.whenStable();
    backend.expectOne('/api/v1/releases/2026.1/diff/2026.2').flush(diff);
    await harness.fixture.whenStable();
  }

  it('shows the summary, a page of changes in kJ/mol and the CSV download', async () => {
    await open();
    expect(element().querySelector('h2#changes-title')!.textContent).toMatch(
      /2026\.1 → 2026\.2:\s+28 changed, 1 added, 1 removed/,
    );
    expect(bodyRows()).toHaveLength(25);
    const first = bodyRows()[0]!;
    expect(first.textContent).toContain('Demo species 01');
    expect(first.textContent).toContain('−1.0');
    expect(first.textContent).toContain('−0.99');
    expect(first.textContent).toContain('+0.01');
    expect(first.querySelector('a')!.getAttribute('href')).toBe('/species/demo-1?release=2026.2');
    const csv = element().querySelector<HTMLAnchorElement>('a[download]')!;
    expect(csv.getAttribute('href')).toBe('/api/v1/releases/2026.1/diff/2026.2.csv');
    expect(csv.textContent).toContain('Download as CSV');
  });

  it('filters by text and by kind of change, sorts and pages', async () => {
    await open();
    const loader = TestbedHarnessEnvironment.loader(harness.fixture);

    const filter = await loader.getHarness(
      MatInputHarness.with({ selector: '[aria-label^="Filter"]' }),
    );
    await filter.setValue('oxide');
    await harness.fixture.whenStable();
    expect(bodyRows().map((r) => r.textContent)).toEqual([
      expect.stringContaining('Kestrel demo oxide'),
    ]);
    await filter.setValue('');

    const change = await loader.getHarness(
      MatSelectHarness.with({ selector: '[aria-label="Kind of change"]' }),
    );
    await change.open();
    await change.clickOptions({ text: 'Removed' });
    await harness.fixture.whenStable();
    expect(bodyRows()).toHaveLength(1);
    expect(bodyRows()[0]!.textContent).toContain('Retired demo gas');
    await change.open();
    await change.clickOptions({ text: 'Every change' });

    const sort = await loader.getHarness(MatSortHarness);
    const difference = (await sort.getSortHeaders({ label: 'Change (kJ/mol)' }))[0]!;
    await difference.click(); // ascending
    await difference.click(); // descending: the largest change first
    await harness.fixture.whenStable();
    expect(bodyRows()[0]!.textContent).toContain('Demo species 28');

    const paginator = await loader.getHarness(MatPaginatorHarness);
    await paginator.goToNextPage();
    await harness.fixture.whenStable();
    expect(bodyRows()).toHaveLength(5);
  });

  it('compares other releases when a picker changes, and opens on the newest two', async () => {
    await open();
    const loader = TestbedHarnessEnvironment.loader(harness.fixture);
    const to = await loader.getHarness(
      MatSelectHarness.with({ selector: '[aria-label="To release"]' }),
    );
    await to.open();
    await to.clickOptions({ text: '2026.3' });
    await harness.fixture.whenStable();
    expect(TestBed.inject(Router).url).toBe('/releases/2026.1/diff/2026.3');
    backend
      .expectOne('/api/v1/releases/2026.1/diff/2026.3')
      .flush({ ...diff, to: '2026.3', rows: [], summary: { added: 0, removed: 0, changed: 0 } });
    await harness.fixture.whenStable();
    expect(element().textContent).toContain('Nothing changed between 2026.1 and 2026.3.');
  });

  it('opens /releases/diff on the two newest releases', async () => {
    await harness.navigateByUrl('/releases/diff');
    backend.match('/api/v1/releases').forEach((r) => r.flush(releases));
    await harness.fixture.whenStable();
    expect(TestBed.inject(Router).url).toBe('/releases/2026.2/diff/2026.3');
    backend
      .expectOne('/api/v1/releases/2026.2/diff/2026.3')
      .flush({ ...diff, from: '2026.2', to: '2026.3' });
    await harness.fixture.whenStable();
  });

  it('names an unknown release in an alert', async () => {
    await harness.navigateByUrl('/releases/2099.1/diff/2026.2', DiffPage);
    backend.match('/api/v1/releases').forEach((r) => r.flush(releases));
    backend
      .expectOne('/api/v1/releases/2099.1/diff/2026.2')
      .flush(
        { error: { code: 'unknown_release', message: 'There is no published release "2099.1"' } },
        { status: 404, statusText: 'Not Found' },
      );
    await harness.fixture.whenStable();
    expect(element().querySelector('[role="alert"]')!.textContent).toContain(
      'There is no published release "2099.1"',
    );
  });
});
