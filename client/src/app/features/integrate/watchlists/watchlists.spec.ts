import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { of } from 'rxjs';

import type { WatchlistView } from '@contracts/watchlists/watchlists-schemas';
import { errorInterceptor } from '../../../core/error-interceptor';
import { ReleaseContext } from '../../../core/release-context';
import { EMPTY_CHECK } from '../../calculate/equation-check';
import { EquationChecker } from '../../calculate/equation-checker';
import { exampleReport as report } from '../impact-table/example-report';
import { Watchlists } from './watchlists';

const releases = [
  {
    version: '2026.2',
    status: 'published',
    notes: '',
    publishedAt: '2026-06-01T00:00:00Z',
    publishedBy: null,
  },
  {
    version: '2026.1',
    status: 'published',
    notes: '',
    publishedAt: '2026-01-01T00:00:00Z',
    publishedBy: null,
  },
];

const reformer: WatchlistView = {
  id: 3,
  name: 'Reformer duties',
  reactions: [
    {
      equation: 'CH4(g) + H2O(g) -> CO(g) + 3 H2(g)',
      label: 'steam reforming',
      temperatureK: 1100,
    },
  ],
  createdAt: '2026-02-01T00:00:00.000Z',
  updatedAt: '2026-02-01T00:00:00.000Z',
};

// Harness typing through several fields takes a while on a busy machine: wait, never race.
jest.setTimeout(60_000);

describe('Watchlists', () => {
  let fixture: ComponentFixture<Watchlists>;
  let backend: HttpTestingController;
  let loader: HarnessLoader;
  let rootLoader: HarnessLoader;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [Watchlists],
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        { provide: EquationChecker, useValue: { check: () => of(EMPTY_CHECK) } },
        {
          provide: ReleaseContext,
          useValue: { releases: signal(releases), latest: signal('2026.2') },
        },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(Watchlists);
    loader = TestbedHarnessEnvironment.loader(fixture);
    rootLoader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    backend
      .expectOne({ method: 'GET', url: '/api/v1/me/watchlists' })
      .flush({ watchlists: [{ ...reformer, reactions: undefined, count: 1 }] });
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const button = (text: string | RegExp) => loader.getHarness(MatButtonHarness.with({ text }));
  const input = (label: string) =>
    loader.getHarness(
      MatInputHarness.with({ selector: `[aria-label="${label}"], [formcontrolname="${label}"]` }),
    );

  it('creates a watchlist with labelled reactions and a temperature', async () => {
    await (await button(/New watchlist/)).click();
    await (await input('name')).setValue('Combustion');
    await (await input('Reaction 1')).setValue('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)');
    await (await input('label')).setValue('methane');
    await (await button(/Add reaction/)).click();
    const equations = await loader.getAllHarnesses(MatInputHarness.with({ selector: 'textarea' }));
    await equations[1]!.setValue('H2(g) + 1/2 O2(g) -> H2O(l)');
    const temperatures = await loader.getAllHarnesses(
      MatInputHarness.with({ selector: '[formcontrolname="temperature"]' }),
    );
    await temperatures[1]!.setValue('350');
    await (await button('Save watchlist')).click();

    const post = backend.expectOne({ method: 'POST', url: '/api/v1/me/watchlists' });
    expect(post.request.body).toEqual({
      name: 'Combustion',
      reactions: [
        { equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)', label: 'methane' },
        { equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', temperatureK: 350 },
      ],
    });
    post.flush({
      watchlist: { ...reformer, id: 8, name: 'Combustion', reactions: post.request.body.reactions },
    });
    await fixture.whenStable();
    backend.expectOne('/api/v1/me/watchlists').flush({ watchlists: [] });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Impact report');
  });

  it('refuses a temperature at or below 0 K before saving', async () => {
    await (await button(/New watchlist/)).click();
    await (await input('name')).setValue('Cold');
    await (await input('Reaction 1')).setValue('H2(g) -> H2(l)');
    await (await input('temperature')).setValue('-5');
    await (await button('Save watchlist')).click();
    backend.expectNone({ method: 'POST' });
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('above 0 K');
  });

  it('runs the impact report of a saved watchlist between the two picked releases', async () => {
    await (await button(/Reformer duties/)).click();
    backend.expectOne('/api/v1/me/watchlists/3').flush({ watchlist: reformer });
    await fixture.whenStable();
    expect(await (await input('label')).getValue()).toBe('steam reforming');

    const pickers = await loader.getAllHarnesses(MatSelectHarness);
    expect(await pickers[0]!.getValueText()).toBe('2026.1');
    expect(await pickers[1]!.getValueText()).toBe('2026.2');
    await (await button(/Run impact report/)).click();
    const run = backend.expectOne({ method: 'POST', url: '/api/v1/releases/2026.1/impact/2026.2' });
    expect(run.request.body).toEqual({ watchlistId: 3, unit: 'kJ/mol' });
    run.flush(report);
    await fixture.whenStable();

    const flagged = (fixture.nativeElement as HTMLElement).querySelectorAll('tr.exceeds');
    expect(flagged).toHaveLength(1);
  });

  it('deletes a watchlist after confirming', async () => {
    await (await button(/Reformer duties/)).click();
    backend.expectOne('/api/v1/me/watchlists/3').flush({ watchlist: reformer });
    await fixture.whenStable();
    await (await button('Delete')).click();
    const dialog = await rootLoader.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Delete' }))).click();
    await fixture.whenStable();
    backend.expectOne({ method: 'DELETE', url: '/api/v1/me/watchlists/3' }).flush(null);
    await fixture.whenStable();
    backend.expectOne('/api/v1/me/watchlists').flush({ watchlists: [] });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('form')).toBeNull();
  });
});
